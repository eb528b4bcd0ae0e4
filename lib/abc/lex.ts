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

// Sticky regular expressions run on the whole tune text at an index: no substring per character
// (the lexer runs on every element of every analysis, and allocation is most of its cost).
const ACC = /\^\^|__|\^|_|=/y;
const NOTE = /[A-Ga-g][',]*/y;
const LEN = /\d*\/*\d*/y;
const WS = /\s+/y;
const TUPLET = /\((\d+)(:\d*)?(:\d*)?/y;
const BROKEN = /[<>]+/y;
const TIE = /\.?-/y;

function at(re: RegExp, t: string, i: number, end: number): string {
  re.lastIndex = i;
  const m = re.exec(t);
  return m && re.lastIndex <= end ? m[0] : "";
}

function readNote(t: string, i: number, end: number): WrittenNote | null {
  const acc = at(ACC, t, i, end);
  const name = at(NOTE, t, i + acc.length, end);
  if (!name) return null;
  const j = i + acc.length + name.length;
  const len = at(LEN, t, j, end);
  return { start: i, letterStart: i + acc.length, end: j + len.length, acc, name, len: parseAbcLength(len), tie: "" };
}

function closing(t: string, i: number, ch: string, end: number): number {
  const k = t.indexOf(ch, i + 1);
  return k < 0 || k >= end ? end : k + 1;
}

const isSpace = (c: string): boolean => c === " " || c === "\t" || c === "\n" || c === "\r";
const isNoteStart = (c: string): boolean => (c >= "A" && c <= "G") || (c >= "a" && c <= "g") || c === "^" || c === "_" || c === "=";

/** Lex the span [start, end) of `t`. `shorthands` maps single-character decorations to names. */
export function lexSpan(t: string, start: number, end: number, shorthands: Record<string, string>): Lexed {
  const toks: Tok[] = [];
  let body: Body | null = null;
  let i = start;
  while (i < end) {
    const c = t[i];
    let kind: TokKind = "other";
    let j = i + 1;
    let name = "";
    if (isSpace(c)) {
      kind = "ws";
      j = i + Math.max(1, at(WS, t, i, end).length);
    } else if (c === '"') {
      kind = "gchord";
      j = closing(t, i, '"', end);
    } else if ((c === "!" || c === "+") && !body) {
      kind = "deco";
      j = closing(t, i, c, end);
      name = t.slice(i + 1, j - 1);
    } else if (c === "{") {
      kind = "grace";
      j = closing(t, i, "}", end);
      name = t[i + 1] === "/" ? "acciaccatura" : "appoggiatura";
    } else if (c === "(") {
      const tuplet = at(TUPLET, t, i, end);
      kind = tuplet ? "tuplet" : "slurOpen";
      j = i + Math.max(1, tuplet.length);
      name = tuplet.slice(1);
    } else if (c === "." && t[i + 1] === "(" && i + 1 < end) {
      kind = "slurOpen";
      j = i + 2;
      name = "dotted";
    } else if (c === ")") kind = "slurClose";
    else if (c === "-" || (c === "." && t[i + 1] === "-" && i + 1 < end)) {
      kind = "tie";
      j = i + at(TIE, t, i, end).length;
      name = c === "." ? "dotted" : "";
    } else if (c === "<" || c === ">") {
      kind = "broken";
      name = at(BROKEN, t, i, end);
      j = i + name.length;
    } else if (!body && (c === "z" || c === "x" || c === "Z" || c === "X")) {
      j = i + 1 + at(LEN, t, i + 1, end).length;
      const note: WrittenNote = { start: i, letterStart: i, end: j, acc: "", name: c, len: parseAbcLength(t.slice(i + 1, j)), tie: "" };
      body = { start: i, end: j, chord: false, rest: c, notes: [note], outerLen: ONE };
      kind = "body";
    } else if (!body && c === "[") {
      body = lexChord(t, i, end);
      kind = "body";
      j = body.end;
    } else if (!body && isNoteStart(c)) {
      const note = readNote(t, i, end);
      if (note) {
        body = { start: i, end: note.end, chord: false, rest: null, notes: [note], outerLen: ONE };
        kind = "body";
        j = note.end;
      }
    } else if (!body && shorthands[c] !== undefined) {
      kind = "short";
      name = shorthands[c];
    }
    toks.push({ kind, start: i, end: j, name });
    i = j;
  }
  return { toks, body };
}

const ONE = parseAbcLength("");

function lexChord(t: string, i: number, end: number): Body {
  const notes: WrittenNote[] = [];
  let j = i + 1;
  while (j < end && t[j] !== "]") {
    const note = readNote(t, j, end);
    if (note) {
      const tie = at(TIE, t, note.end, end);
      note.tie = tie;
      note.end += tie.length;
      j = note.end;
      notes.push(note);
    } else if (t[j] === "!" || t[j] === "+" || t[j] === '"') j = closing(t, j, t[j], end);
    else j += 1;
  }
  j = Math.min(end, j + 1);
  const len = at(LEN, t, j, end);
  return { start: i, end: j + len.length, chord: true, rest: null, notes, outerLen: parseAbcLength(len) };
}
