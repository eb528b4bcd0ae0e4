// A lexer for the text of one abcjs element. abcjs gives a note's span (decorations, grace notes,
// chord symbols, slur marks, tuplet marker, the note, tie, broken rhythm) but not where each part
// sits inside it; editing by offsets needs those, so this reads the span again. It only ever runs
// on text abcjs already accepted as one element, which keeps it small.
import { parseAbcLength } from "./fraction";
import { AbcInputError } from "./locate";
import type { Fraction } from "./types";

/** The length written in t[from, to) after a note or rest, or a located error for a length of nothing. */
function lengthAt(t: string, note: number, from: number, to: number): Fraction {
  const len = parseAbcLength(from === to ? "" : t.slice(from, to));
  if (len === null)
    throw new AbcInputError(note, `"${t.slice(note, to)}" has no length: a note or rest lasts more than 0`);
  return len;
}

export type TokKind =
  | "ws"
  | "gchord"
  | "deco"
  | "short"
  | "grace"
  | "slurOpen"
  | "tuplet"
  | "body"
  | "tie"
  | "broken"
  | "slurClose"
  | "other";

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
  /** Text abcjs read as part of the element that is not ABC this lexer knows (a "]" with no "["). */
  odd: Tok | null;
}

// Scanners over the whole tune text at an index, returning where the match ends: no substring
// or match object per character (the lexer runs on every element of every analysis). Each one
// matches greedily on the whole text and the match counts only if it ends within the span, as a
// sticky regular expression with a bound would.
const TUPLET = /\((\d+)(:\d*)?(:\d*)?/y;

function within(j: number, i: number, end: number): number {
  return j <= end ? j : i;
}
const isDigit = (c: number): boolean => c >= 48 && c <= 57;
/** `\^\^|__|\^|_|=` */
function scanAcc(t: string, i: number, end: number): number {
  const c = t.charCodeAt(i);
  if (c === 94 || c === 95) return within(t.charCodeAt(i + 1) === c ? i + 2 : i + 1, i, end);
  return c === 61 ? within(i + 1, i, end) : i;
}
/** `[A-Ga-g][',]*` */
function scanNote(t: string, i: number, end: number): number {
  const c = t.charCodeAt(i);
  if (!((c >= 65 && c <= 71) || (c >= 97 && c <= 103))) return i;
  let j = i + 1;
  for (let d = t.charCodeAt(j); d === 39 || d === 44; d = t.charCodeAt(++j));
  return within(j, i, end);
}
/** `\d*\/*\d*` */
function scanLen(t: string, i: number, end: number): number {
  let j = i;
  while (isDigit(t.charCodeAt(j))) j++;
  while (t.charCodeAt(j) === 47) j++;
  while (isDigit(t.charCodeAt(j))) j++;
  return within(j, i, end);
}
/** JavaScript's `\s`. */
function isWs(c: number): boolean {
  return (
    c === 32 ||
    (c >= 9 && c <= 13) ||
    c === 0xa0 ||
    c === 0x1680 ||
    (c >= 0x2000 && c <= 0x200a) ||
    c === 0x2028 ||
    c === 0x2029 ||
    c === 0x202f ||
    c === 0x205f ||
    c === 0x3000 ||
    c === 0xfeff
  );
}
function scanWs(t: string, i: number, end: number): number {
  let j = i;
  while (isWs(t.charCodeAt(j))) j++;
  return within(j, i, end);
}
/** `\.?-` */
function scanTie(t: string, i: number, end: number): number {
  const c = t.charCodeAt(i);
  if (c === 45) return within(i + 1, i, end);
  return c === 46 && t.charCodeAt(i + 1) === 45 ? within(i + 2, i, end) : i;
}
/** `[<>]+` */
function scanBroken(t: string, i: number, end: number): number {
  let j = i;
  for (let c = t.charCodeAt(j); c === 60 || c === 62; c = t.charCodeAt(++j));
  return within(j, i, end);
}

function readNote(t: string, i: number, end: number): WrittenNote | null {
  const a = scanAcc(t, i, end);
  const n = scanNote(t, a, end);
  if (n === a) return null;
  const j = scanLen(t, n, end);
  const acc = a === i ? "" : t.slice(i, a);
  return {
    start: i,
    letterStart: a,
    end: j,
    acc,
    name: t.slice(a, n),
    len: lengthAt(t, i, n, j),
    tie: "",
  };
}

function closing(t: string, i: number, ch: string, end: number): number {
  const k = t.indexOf(ch, i + 1);
  return k < 0 || k >= end ? end : k + 1;
}

const isSpace = (c: string): boolean => c === " " || c === "\t" || c === "\n" || c === "\r";
const isNoteStart = (c: string): boolean =>
  (c >= "A" && c <= "G") || (c >= "a" && c <= "g") || c === "^" || c === "_" || c === "=";

// Tokens are gathered here and copied out at their exact count: an array grown by push from empty
// reserves room for 16, and a long tune keeps thousands of these alive through its analysis.
const scratch: Tok[] = [];

/** Lex the span [start, end) of `t`. `shorthands` maps single-character decorations to names. */
export function lexSpan(t: string, start: number, end: number, shorthands: Record<string, string>): Lexed {
  let n = 0; // tokens written to scratch (its length is left alone, so its room is kept)
  let body: Body | null = null;
  let odd: Tok | null = null;
  let i = start;
  while (i < end) {
    const c = t[i];
    let kind: TokKind = "other";
    let j = i + 1;
    let name = "";
    if (isSpace(c)) {
      kind = "ws";
      j = Math.max(i + 1, scanWs(t, i, end));
    } else if (c === '"') {
      kind = "gchord";
      j = closing(t, i, '"', end);
    } else if ((c === "!" || c === "+") && !body) {
      // a decoration is !name! (ABC 2.1 §4.14); a lone "!" (abc 2.0's line break) is not one
      j = closing(t, i, c, end);
      const closed = j > i + 1 && t[j - 1] === c;
      kind = closed ? "deco" : "other";
      if (!closed) j = i + 1;
      name = closed ? t.slice(i + 1, j - 1) : "";
    } else if (c === "{") {
      kind = "grace";
      j = closing(t, i, "}", end);
      name = t[i + 1] === "/" ? "acciaccatura" : "appoggiatura";
    } else if (c === "(") {
      TUPLET.lastIndex = i;
      const m = TUPLET.exec(t);
      const tuplet = m && TUPLET.lastIndex <= end ? m[0] : "";
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
      j = scanTie(t, i, end);
      name = c === "." ? "dotted" : "";
    } else if (c === "<" || c === ">") {
      kind = "broken";
      j = scanBroken(t, i, end);
      name = t.slice(i, j);
    } else if (!body && (c === "z" || c === "x" || c === "Z" || c === "X")) {
      j = scanLen(t, i + 1, end);
      const note: WrittenNote = {
        start: i,
        letterStart: i,
        end: j,
        acc: "",
        name: c,
        len: lengthAt(t, i, i + 1, j),
        tie: "",
      };
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
    const tok: Tok = { kind, start: i, end: j, name };
    if (kind === "other" && c !== "\\" && odd === null) odd = tok;
    scratch[n++] = tok;
    i = j;
  }
  return { toks: scratch.slice(0, n), body, odd };
}

const ONE: Fraction = parseAbcLength("") ?? { num: 1, den: 1 };

function lexChord(t: string, i: number, end: number): Body {
  const notes: WrittenNote[] = [];
  let j = i + 1;
  while (j < end && t[j] !== "]") {
    const note = readNote(t, j, end);
    if (note) {
      const e = scanTie(t, note.end, end);
      note.tie = e === note.end ? "" : t.slice(note.end, e);
      note.end = e;
      j = note.end;
      notes.push(note);
    } else if (t[j] === "!" || t[j] === "+" || t[j] === '"') j = closing(t, j, t[j], end);
    else j += 1;
  }
  j = Math.min(end, j + 1);
  const e = scanLen(t, j, end);
  return { start: i, end: e, chord: true, rest: null, notes, outerLen: lengthAt(t, i, j, e) };
}
