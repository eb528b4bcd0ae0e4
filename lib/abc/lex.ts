// A lexer for the text of one abcjs element. abcjs gives a note's span (decorations, grace notes,
// chord symbols, slur marks, tuplet marker, the note, tie, broken rhythm) but not where each part
// sits inside it; editing by offsets needs those, so this reads the span again. It only ever runs
// on text abcjs already accepted as one element, which keeps it small.
import { parseAbcLength } from "./fraction";
import type { Fraction } from "./types";

export type TokKind =
  | "ws" | "gchord" | "deco" | "short" | "grace" | "slurOpen" | "tuplet" | "body"
  | "tie" | "broken" | "slurClose" | "other";

export interface Tok {
  kind: TokKind;
  start: number; // absolute offsets in the tune text
  end: number;
  name: string; // decoration name, tuplet spec "3:2:3", "dotted" slur …
}

/** One written note of a body (a single note, or one note of a chord). */
export interface WrittenNote {
  start: number; // first character (the accidental, if any)
  letterStart: number; // the letter
  end: number; // after its own length and tie
  acc: string; // "^", "__", "=", "" …
  name: string; // letter and octave marks, e.g. "c'", "B,"
  len: Fraction; // its own length, multiple of L
  tie: string; // "-" / ".-" written inside a chord, else ""
}

export interface Body {
  start: number;
  end: number;
  chord: boolean;
  rest: string | null; // "z", "x", "Z" …
  notes: WrittenNote[];
  outerLen: Fraction; // length after "]" (1 for a single note: its length is in notes[0].len)
}

export interface Lexed {
  toks: Tok[];
  body: Body | null;
}

const ACC = /^(\^\^|__|\^|_|=)/;
const NOTE = /^[A-Ga-g][',]*/;
const LEN = /^\d*\/*\d*/;

function readNote(t: string, i: number, base: number): WrittenNote | null {
  const s = t.slice(i);
  const acc = ACC.exec(s)?.[0] ?? "";
  const name = NOTE.exec(s.slice(acc.length))?.[0];
  if (!name) return null;
  let j = i + acc.length + name.length;
  const len = LEN.exec(t.slice(j))?.[0] ?? "";
  j += len.length;
  return { start: base + i, letterStart: base + i + acc.length, end: base + j, acc, name, len: parseAbcLength(len), tie: "" };
}

function closing(t: string, i: number, ch: string): number {
  const k = t.indexOf(ch, i + 1);
  return k < 0 ? t.length : k + 1;
}

/** Lex the span [start, end) of `abc`. `shorthands` maps single-character decorations to names. */
export function lexSpan(abc: string, start: number, end: number, shorthands: Record<string, string>): Lexed {
  const t = abc.slice(start, end);
  const toks: Tok[] = [];
  let body: Body | null = null;
  const push = (kind: TokKind, a: number, b: number, name = ""): void => {
    toks.push({ kind, start: start + a, end: start + b, name });
  };
  let i = 0;
  while (i < t.length) {
    const c = t[i];
    const rest = t.slice(i);
    let m: RegExpExecArray | null;
    if (/\s/.test(c)) {
      const j = i + (/^\s+/.exec(rest)?.[0].length ?? 1);
      push("ws", i, j);
      i = j;
    } else if (c === '"') {
      const j = closing(t, i, '"');
      push("gchord", i, j);
      i = j;
    } else if ((c === "!" || c === "+") && !body) {
      const j = closing(t, i, c);
      push("deco", i, j, t.slice(i + 1, j - 1));
      i = j;
    } else if (c === "{") {
      const j = closing(t, i, "}");
      push("grace", i, j, t[i + 1] === "/" ? "acciaccatura" : "appoggiatura");
      i = j;
    } else if ((m = /^\((\d+)(:\d*)?(:\d*)?/.exec(rest))) {
      push("tuplet", i, i + m[0].length, m[0].slice(1));
      i += m[0].length;
    } else if (rest.startsWith(".(")) {
      push("slurOpen", i, i + 2, "dotted");
      i += 2;
    } else if (c === "(") {
      push("slurOpen", i, i + 1);
      i += 1;
    } else if (c === ")") {
      push("slurClose", i, i + 1);
      i += 1;
    } else if (rest.startsWith(".-") || c === "-") {
      const n = c === "-" ? 1 : 2;
      push("tie", i, i + n, n === 2 ? "dotted" : "");
      i += n;
    } else if ((m = /^[<>]+/.exec(rest))) {
      push("broken", i, i + m[0].length, m[0]);
      i += m[0].length;
    } else if (!body && (m = /^[zxZX]/.exec(rest))) {
      const len = LEN.exec(t.slice(i + 1))?.[0] ?? "";
      const j = i + 1 + len.length;
      const note: WrittenNote = { start: start + i, letterStart: start + i, end: start + j, acc: "", name: c, len: parseAbcLength(len), tie: "" };
      body = { start: start + i, end: start + j, chord: false, rest: c, notes: [note], outerLen: parseAbcLength("") };
      push("body", i, j);
      i = j;
    } else if (!body && c === "[") {
      const j = lexChord(t, i, start);
      body = j.body;
      push("body", i, j.end);
      i = j.end;
    } else if (!body && (ACC.test(rest) || NOTE.test(rest))) {
      const note = readNote(t, i, start);
      if (!note) {
        push("other", i, i + 1);
        i += 1;
        continue;
      }
      body = { start: note.start, end: note.end, chord: false, rest: null, notes: [note], outerLen: parseAbcLength("") };
      push("body", i, note.end - start);
      i = note.end - start;
    } else if (!body && shorthands[c] !== undefined) {
      push("short", i, i + 1, shorthands[c]);
      i += 1;
    } else {
      push("other", i, i + 1);
      i += 1;
    }
  }
  return { toks, body };
}

function lexChord(t: string, i: number, base: number): { body: Body; end: number } {
  const notes: WrittenNote[] = [];
  let j = i + 1;
  while (j < t.length && t[j] !== "]") {
    const note = readNote(t, j, base);
    if (note) {
      j = note.end - base;
      const tie = /^\.?-/.exec(t.slice(j))?.[0] ?? "";
      note.tie = tie;
      note.end += tie.length;
      j += tie.length;
      notes.push(note);
    } else if (t[j] === "!" || t[j] === "+" || t[j] === '"') j = closing(t, j, t[j]);
    else j += 1;
  }
  j = Math.min(t.length, j + 1);
  const len = LEN.exec(t.slice(j))?.[0] ?? "";
  const end = j + len.length;
  return { body: { start: base + i, end: base + end, chord: true, rest: null, notes, outerLen: parseAbcLength(len) }, end };
}
