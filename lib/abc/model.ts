// One abcjs parse → the engine's model: every note and bar element with its lexed parts, exact
// sounding time, sounding pitches and place in its bar. Everything else derives from this.
import type { TuneObject } from "abcjs";
import { fromNumber, mul, frac, ZERO } from "./fraction";
import { readHeader, valueAt, type HeaderInfo } from "./header";
import { lexSpan, type Body, type Lexed, type Tok } from "./lex";
import { BarAccidentals, keyAccOf, staffPos, type KeyAcc } from "./pitch";
import { shorthandsOf, tokMask } from "./decorations";
import { assembleBars, type VBar } from "./bars";
import { tupletMultiplier, unitOf } from "./note-time";
import type { Fraction } from "./types";

const ONE = frac(1);

export interface Tuplet {
  spec: string; // "3", "3:2:4" …
  /** The marker's text when abcjs left it outside the first note's element ("(3" before a chord symbol). */
  marker: { start: number; end: number } | null;
  p: number;
  mult: Fraction; // time factor, e.g. 2/3 for (3
  els: NoteEl[];
  /** abcjs counted all its notes (a tuplet cut short by the end of its line or of the tune is not). */
  complete: boolean;
}

export interface NoteEl {
  type: "note";
  index: number; // place in TuneModel.edits
  voice: string;
  start: number;
  end: number;
  lex: Lexed;
  body: Body;
  duration: Fraction; // sounding time, tuplets and broken rhythm applied
  unit: Fraction; // unit note length in force
  midi: readonly (number | null)[]; // sounding pitch of each written note of the body (null: rest)
  pos: readonly number[]; // staff position of each written note
  tieOut: boolean;
  kinds: number; // embellishment kinds among its tokens, as bits (decorations.ts)
  tiedFromPrevious: boolean;
  next: NoteEl | null; // the next note of the same voice
  brokenOut: boolean; // a broken-rhythm mark follows this note
  tuplet: Tuplet | null;
  key: KeyAcc;
  bar: VBar | null;
  onset: Fraction; // from the start of its bar
  grid: Fraction; // onset on the beat grid (pickups are aligned to the end of the bar)
}

export interface BarEl {
  type: "bar";
  index: number; // place in TuneModel.edits
  voice: string;
  start: number;
  end: number;
  toks: Tok[];
  kinds: number;
  barType: string;
  startEnding: string | null;
  endEnding: boolean;
}

export interface PartEl {
  type: "part";
  voice: string;
  start: number;
  end: number;
  title: string;
}

export type El = NoteEl | BarEl | PartEl;

export interface TuneModel {
  abc: string;
  header: HeaderInfo;
  shorthands: Record<string, string>;
  voices: Map<string, El[]>; // in text order, per voice; the first voice is the melody
  melody: string;
  bars: Map<string, VBar[]>;
  edits: (NoteEl | BarEl)[]; // every editable element, sorted by offset
  tuplets: Tuplet[];
}

/** The fields of an abcjs voice item read here (abcjs's own types leave some of them out). */
interface ItemFields {
  el_type: string;
  startChar?: unknown;
  endChar?: unknown;
  type?: unknown;
  title?: unknown;
  startEnding?: unknown;
  endEnding?: unknown;
  duration?: unknown;
  startTriplet?: unknown;
  tripletMultiplier?: unknown;
  endTriplet?: unknown;
}
const num = (v: unknown): number | undefined => (typeof v === "number" ? v : undefined);
const str = (v: unknown): string | undefined => (typeof v === "string" ? v : undefined);

interface VoiceState {
  els: El[];
  acc: BarAccidentals;
  tuplet: Tuplet | null;
  last: NoteEl | undefined;
}

export function readModel(abc: string, tune: TuneObject): TuneModel {
  const header = readHeader(abc);
  const shorthands = shorthandsOf(abc);
  const voices = new Map<string, El[]>();
  const states = new Map<string, VoiceState>();
  const seen = seenMarks(abc.length);
  const tuplets: Tuplet[] = [];
  for (const line of tune.lines) {
    const staves = line.staff ?? [];
    for (let si = 0; si < staves.length; si++) {
      const staff = staves[si];
      const staffVoices = staff.voices ?? [];
      for (let vi = 0; vi < staffVoices.length; vi++) {
        const voice = `${si}.${vi}`;
        let v = states.get(voice);
        if (!v) {
          v = { els: [], acc: new BarAccidentals(keyAccOf(staff.key)), tuplet: null, last: undefined };
          states.set(voice, v);
          voices.set(voice, v.els);
        } else if (staff.key) v.acc.key = keyAccOf(staff.key);
        readVoice(abc, staffVoices[vi] as readonly ItemFields[], voice, v, header, shorthands, seen, tuplets);
      }
    }
  }
  const melody = voices.keys().next().value ?? "0.0";
  const bars = new Map<string, VBar[]>();
  for (const [voice, els] of voices) bars.set(voice, assembleBars(els, header));
  const edits: (NoteEl | BarEl)[] = [];
  let sorted = true;
  for (const els of voices.values()) {
    for (const e of els) {
      if (e.type === "part") continue;
      if (edits.length && edits[edits.length - 1].start > e.start) sorted = false;
      edits.push(e);
    }
  }
  if (!sorted) edits.sort((a, b) => a.start - b.start);
  for (let i = 0; i < edits.length; i++) edits[i].index = i;
  return { abc, header, shorthands, voices, melody, bars, edits, tuplets };
}

function readVoice(
  abc: string,
  items: readonly ItemFields[],
  voice: string,
  v: VoiceState,
  header: HeaderInfo,
  shorthands: Record<string, string>,
  seen: Seen,
  tuplets: Tuplet[],
): void {
  const state = v.acc;
  const els = v.els;
  for (const item of items) {
    const start = num(item.startChar);
    const end = num(item.endChar);
    if (start === undefined || end === undefined || start < header.headerEnd) continue;
    const type = item.el_type;
    if (type === "key") state.key = keyAccOf(item);
    else if (type === "part") els.push({ type: "part", voice, start, end, title: str(item.title) ?? "" });
    else if (type === "bar") {
      state.reset();
      if (isSeen(seen, start)) continue;
      markSeen(seen, start);
      const toks = hasMarks(abc, start, end)
        ? lexSpan(abc, start, end, {}).toks.filter((t) => t.kind === "deco" || t.kind === "gchord")
        : [];
      const startEnding = str(item.startEnding) ?? null;
      els.push({
        type: "bar",
        index: -1,
        voice,
        start,
        end,
        toks,
        kinds: tokMask(toks),
        barType: str(item.type) ?? "",
        startEnding,
        endEnding: item.endEnding === true,
      });
    } else if (type === "note" && !isSeen(seen, start)) {
      const lex = lexSpan(abc, start, end, shorthands);
      if (!lex.body) continue;
      markSeen(seen, start);
      const el = noteEl(num(item.duration), voice, start, end, lex, lex.body, state, header, v.last);
      const tStart = num(item.startTriplet);
      if (tStart !== undefined) {
        const inner = lex.toks.find((t) => t.kind === "tuplet");
        const marker = inner ? null : markerBefore(abc, start, v.last?.end ?? header.headerEnd);
        const spec = inner?.name ?? (marker ? abc.slice(marker.start + 1, marker.end) : String(tStart));
        const mult =
          tupletMultiplier(spec, valueAt(header.meters, start)) ?? fromNumber(num(item.tripletMultiplier) ?? 1);
        const t: Tuplet = { spec, marker, p: tStart, mult, els: [], complete: false };
        tuplets.push(t);
        v.tuplet = t;
      }
      let t = v.tuplet;
      // abcjs counts a tuplet's notes within one line of text: a line break ends it, complete or not
      const lastOfTuplet = t?.els[t.els.length - 1];
      if (t && tStart === undefined && lastOfTuplet && lineBreakIn(abc, lastOfTuplet.end, start)) {
        v.tuplet = null;
        t = null;
      }
      if (t) {
        el.tuplet = t;
        t.els.push(el);
        el.duration = mul(el.duration, t.mult);
        if (item.endTriplet === true) {
          t.complete = true;
          v.tuplet = null;
        }
      }
      if (v.last) v.last.next = el;
      v.last = el;
      els.push(el);
    }
  }
}

function lineBreakIn(abc: string, from: number, to: number): boolean {
  for (let i = from; i < to; i++) if (abc.charCodeAt(i) === 10) return true;
  return false;
}

/**
 * A tuplet marker abcjs read before a note's element rather than in it: "(3" then a chord symbol
 * or a space, then the notes. Found between the previous element and the note.
 */
function markerBefore(abc: string, start: number, after: number): { start: number; end: number } | null {
  const at = abc.lastIndexOf("(", start - 1);
  if (at < after) return null;
  const m = /^\((\d+)(:\d*)?(:\d*)?/.exec(abc.slice(at, at + 12));
  return m ? { start: at, end: at + m[0].length } : null;
}

// Elements already read, by offset (abcjs may list one element in several voices). One array
// serves every reading: an offset is marked with the reading's number, so nothing is cleared or
// made per tune, and a reading cut short by an exception leaves no stale mark.
let marks = new Uint32Array(1 << 14);
let reading = 0;
interface Seen {
  marks: Uint32Array;
  reading: number;
}
function seenMarks(length: number): Seen {
  if (marks.length <= length || reading === 0xffffffff) {
    marks = new Uint32Array(Math.max(length + 1, marks.length * 2));
    reading = 0;
  }
  return { marks, reading: ++reading };
}
const isSeen = (seen: Seen, at: number): boolean => seen.marks[at] === seen.reading;
const markSeen = (seen: Seen, at: number): void => {
  seen.marks[at] = seen.reading;
};

/** Most bar lines carry nothing to lex: skip the lexer unless a decoration or quote is there. */
function hasMarks(abc: string, start: number, end: number): boolean {
  for (let i = start; i < end; i++) {
    const c = abc[i];
    if (c === "!" || c === "+" || c === '"') return true;
  }
  return false;
}

function noteEl(
  abcjsDuration: number | undefined,
  voice: string,
  start: number,
  end: number,
  lex: Lexed,
  body: Body,
  state: BarAccidentals,
  header: HeaderInfo,
  prev: NoteEl | undefined,
): NoteEl {
  const first = body.notes[0]?.len ?? ONE;
  const outer = body.outerLen;
  // Lengths come reduced from the lexer, so a single note's written length is its own.
  const written = outer.num === 1 && outer.den === 1 ? first : mul(first, outer);
  const duration = fromNumber(abcjsDuration ?? 0);
  let brokenOut = false;
  let tieOut = false;
  for (const t of lex.toks) {
    if (t.kind === "broken") brokenOut = true;
    else if (t.kind === "tie" && t.start >= body.end) tieOut = true;
  }
  // The unit abcjs used is exact when no broken rhythm touches the note; it follows L: changes
  // abcjs applied (including inline [L:]) without a second reading of the fields.
  const unit =
    !brokenOut && !prev?.brokenOut && written.num > 0 && duration.num > 0
      ? unitOf(duration, written)
      : valueAt(header.units, start);
  const notes = body.notes;
  let pos: readonly number[];
  let midi: readonly (number | null)[];
  if (notes.length === 1) {
    // Most bodies are one note: one shared array per value, with no callback per note.
    const p = body.rest ? 0 : staffPos(notes[0].name);
    pos = single(p);
    midi = single(body.rest ? null : state.sound(p, notes[0].acc));
  } else {
    pos = notes.map((n) => (body.rest ? 0 : staffPos(n.name)));
    midi = notes.map((n, i) => (body.rest ? null : state.sound(pos[i], n.acc)));
  }
  for (const n of notes) if (n.tie !== "") tieOut = true;
  return {
    type: "note",
    index: -1,
    voice,
    start,
    end,
    lex,
    body,
    duration,
    unit,
    midi,
    pos,
    tieOut,
    kinds: tokMask(lex.toks),
    tiedFromPrevious: prev?.tieOut ?? false,
    next: null,
    brokenOut,
    tuplet: null,
    key: state.key,
    bar: null,
    onset: ZERO, // both set when the bars are assembled
    grid: ZERO,
  };
}

// One-element arrays by value, shared by every note of that value (the model never writes to
// them): a long tune has thousands of single notes, and each array is an object the garbage
// collector must copy while the tune is analysed.
const SINGLES = new Map<number | null, readonly (number | null)[]>();
function single<T extends number | null>(v: T): readonly T[] {
  let a = SINGLES.get(v);
  if (!a) {
    a = [v];
    if (SINGLES.size < 1000) SINGLES.set(v, a);
  }
  return a as readonly T[];
}
