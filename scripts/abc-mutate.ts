// Seeded mutations of real tunes, for the engine's fuzz test and its benchmark: what a teacher's
// typing slips, a pasted fragment or a hostile upload might make of a good tune.
import { readdirSync, readFileSync } from "node:fs";
import { splitTunes } from "../lib/abc/split";

const CORPUS = "../shared/datasets/nottingham";

/** The fuzz test's mutants, which bench:abc times too. */
export const FUZZ_COUNT = 2000;
export const FUZZ_SEED = 20261205;

/** Every tune of the open corpus (cleaned, then as first published), in a fixed order. */
export function corpusTunes(root = CORPUS): string[] {
  const out: string[] = [];
  for (const dir of ["ABC_cleaned", "ABC_original"]) {
    for (const f of readdirSync(`${root}/${dir}`).sort())
      for (const t of splitTunes(readFileSync(`${root}/${dir}/${f}`, "utf8"))) out.push(t.abc);
  }
  return out;
}

/** mulberry32: a small seeded generator, so a failing case can be made again from its seed. */
export function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

// Pieces of ABC, well- and ill-formed: notes, chords, lengths, broken rhythm, tuplets, ties, slurs,
// grace notes, decorations, chord symbols, bar lines, endings, inline fields, comments and noise.
const PIECES = [
  "A",
  "c'",
  "B,",
  "^f",
  "_B",
  "=c",
  "z",
  "x",
  "Z",
  "Z4",
  "2",
  "3",
  "/",
  "//",
  "3/2",
  "/0",
  "0",
  "99999",
  "[AB]",
  "[A-B-]",
  "[GBd]2",
  "[",
  "]",
  "[+GB]",
  "+GB+",
  "(3",
  "(3ABc",
  "(3:2:4",
  "(5",
  "(",
  ")",
  "-",
  ".",
  ">",
  "<",
  ">>>",
  "{g}",
  "{/a}",
  "{",
  "}",
  "~",
  "T",
  "u",
  "v",
  "!trill!",
  "!roll!",
  "!p!",
  "!<(!",
  "!fermata!",
  "!",
  "!unknown!",
  '"G"',
  '"',
  '"Am7"',
  "|",
  "||",
  "|]",
  "|:",
  ":|",
  "::",
  ":|:",
  "[1",
  "[2",
  "|1",
  ":|2",
  "[K:G]",
  "[K:Bb]",
  "[M:3/4]",
  "[L:1/16]",
  "[P:B]",
  "\nP:B\n",
  "\nK:D\n",
  "\nM:6/8\n",
  "\nL:1/4\n",
  "%",
  "\\\n",
  "\n",
  " ",
  "&",
  "#",
  "@",
  "`",
  "$",
  "*",
  "y",
  "\t",
  "é",
];

/** One mutation of `abc`; the header's X: line is left alone so the text stays one tune. */
function mutateOnce(abc: string, rnd: () => number): string {
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)] as T;
  const start = abc.indexOf("\n") + 1;
  const at = start + Math.floor(rnd() * Math.max(1, abc.length - start));
  const kind = Math.floor(rnd() * 8);
  switch (kind) {
    case 0:
    case 1:
      return abc.slice(0, at) + pick(PIECES) + abc.slice(at);
    case 2:
      return abc.slice(0, at) + abc.slice(at + 1 + Math.floor(rnd() * 6));
    case 3: {
      const piece = pick(PIECES);
      return abc.slice(0, at) + piece + abc.slice(at + piece.length);
    }
    case 4: {
      // a stretch of the tune again somewhere else (a pasted bar or two)
      const from = start + Math.floor(rnd() * Math.max(1, abc.length - start));
      const span = abc.slice(from, from + 5 + Math.floor(rnd() * 40));
      return abc.slice(0, at) + span + abc.slice(at);
    }
    case 5: {
      const lines = abc.split("\n");
      const i = 1 + Math.floor(rnd() * Math.max(1, lines.length - 1));
      const j = 1 + Math.floor(rnd() * Math.max(1, lines.length - 1));
      [lines[i], lines[j]] = [lines[j] ?? "", lines[i] ?? ""];
      return lines.join("\n");
    }
    case 6: {
      // a header line dropped (M:, L: or K:)
      const lines = abc.split("\n");
      const field = pick(["M:", "L:", "K:", "T:"]);
      const i = lines.findIndex((l) => l.startsWith(field));
      if (i > 0) lines.splice(i, 1);
      return lines.join("\n");
    }
    default: {
      // the whole body again: a longer tune
      const k = /^K:.*$/m.exec(abc);
      const body = k ? abc.slice(k.index + k[0].length) : "";
      return abc + body.repeat(1 + Math.floor(rnd() * 3));
    }
  }
}

/** `count` mutants of the corpus tunes, each with one to four mutations, from `seed`. */
export function mutants(tunes: readonly string[], count: number, seed: number): string[] {
  const rnd = random(seed);
  const out: string[] = [];
  for (let n = 0; n < count; n++) {
    let abc = tunes[Math.floor(rnd() * tunes.length)] ?? "";
    const times = 1 + Math.floor(rnd() * 4);
    for (let k = 0; k < times; k++) abc = mutateOnce(abc, rnd);
    out.push(abc);
  }
  return out;
}
