// Decoration names → embellishment kinds. The names are those of the ABC 2.1 decoration table
// (§4.14, written from memory of the standard's text); the grouping into kinds is PRODUCT.md §3.
import type { Tok } from "./lex";
import { KINDS, type Kind } from "./types";

const TABLE: Record<string, Kind> = {};
const put = (kind: Kind, names: string[]): void => names.forEach((n) => (TABLE[n] = kind));

put("ornaments", [
  "trill",
  "trill(",
  "trill)",
  "lowermordent",
  "uppermordent",
  "mordent",
  "pralltriller",
  "roll",
  "turn",
  "turnx",
  "invertedturn",
  "invertedturnx",
  "arpeggio",
]);
put("slides", ["slide"]);
put("bowing", ["upbow", "downbow"]);
put("dynamics", [
  "pppp",
  "ppp",
  "pp",
  "p",
  "mp",
  "mf",
  "f",
  "ff",
  "fff",
  "ffff",
  "sfz",
  "crescendo(",
  "<(",
  "crescendo)",
  "<)",
  "diminuendo(",
  ">(",
  "diminuendo)",
  ">)",
]);
put("articulation", [
  ">",
  "accent",
  "emphasis",
  "fermata",
  "invertedfermata",
  "tenuto",
  "breath",
  "wedge",
  "snap",
  "+",
  "plus",
  "marcato",
  "staccato",
]);
put("fingerings", ["0", "1", "2", "3", "4", "5", "open", "thumb"]);
put("marks", [
  "segno",
  "coda",
  "D.S.",
  "D.C.",
  "dacoda",
  "dacapo",
  "fine",
  "shortphrase",
  "mediumphrase",
  "longphrase",
  "ped",
  "ped-up",
  "editorial",
  "courtesy",
  "xstem",
  "trem1",
  "trem2",
  "trem3",
  "trem4",
]);

/** Kind of a decoration name; a name the table does not know is a mark (not melody either way). */
export function kindOfDecoration(name: string): Kind {
  return TABLE[name] ?? "marks";
}

/** Kind of a lexed token, null for the notes themselves, chord symbols, ties and the like. */
export function tokKind(t: Tok): Kind | null {
  switch (t.kind) {
    case "deco":
    case "short":
      return kindOfDecoration(t.name);
    case "grace":
      return "ornaments";
    case "slurOpen":
    case "slurClose":
      return "bowing";
    default:
      return null;
  }
}

// Kinds as bits, so "does this element hold a kind being taken out" is one test per element.
// A name the table answers from outside its own entries (an inherited property name) gets a bit
// of its own: it is never taken out, and its element is still not bare.
const KIND_BIT = new Map<Kind, number>(KINDS.map((k, i) => [k, 1 << i]));
const UNLISTED_BIT = 1 << 30;
export const kindBit = (k: Kind | null): number => (k === null ? 0 : (KIND_BIT.get(k) ?? UNLISTED_BIT));
export function kindMask(kinds: Iterable<Kind>): number {
  let m = 0;
  for (const k of kinds) m |= kindBit(k);
  return m;
}
/** The kinds of a list of tokens, as bits. */
export function tokMask(toks: readonly Tok[]): number {
  let m = 0;
  for (const t of toks) m |= kindBit(tokKind(t));
  return m;
}

/**
 * The predefined shorthands of ABC 2.1 §4.16 (from memory of the standard's table). "." is
 * staccato (§4.14 calls it the staccato dot). J and R are abc 2.0 leftovers that abcjs also
 * accepts (slide, roll); kept so such tunes classify instead of reporting an unknown mark.
 */
export const DEFAULT_SHORTHANDS: Readonly<Record<string, string>> = {
  ".": "staccato",
  "~": "roll",
  H: "fermata",
  L: "accent",
  M: "lowermordent",
  O: "coda",
  P: "uppermordent",
  S: "segno",
  T: "trill",
  u: "upbow",
  v: "downbow",
  J: "slide",
  R: "roll",
};

/** Shorthands in force after the tune's U: fields (§4.16: U: may redefine h–w, H–W and ~). */
export function shorthandsOf(abc: string): Record<string, string> {
  const map: Record<string, string> = { ...DEFAULT_SHORTHANDS };
  if (!abc.includes("U:")) return map; // most tunes redefine nothing: skip the scan
  for (const m of abc.matchAll(/^U:\s*([~H-Wh-w])\s*=\s*(\S+)/gm)) {
    const value = m[2].replace(/^[!+](.*)[!+]$/, "$1");
    if (value === "nil" || value === "none") delete map[m[1]];
    else map[m[1]] = value;
  }
  return map;
}
