// One abcjs parse → the engine's model: every note and bar element with its lexed parts, exact
// sounding time, sounding pitches and place in its bar. Everything else derives from this.
import type { TuneObject } from "abcjs";
import { div, fromNumber, mul, frac } from "./fraction";
import { readHeader, valueAt, type HeaderInfo } from "./header";
import { lexSpan, type Body, type Lexed, type Tok } from "./lex";
import { BarAccidentals, keyAccOf, staffPos, type KeyAcc } from "./pitch";
import { shorthandsOf } from "./decorations";
import { assembleBars, type VBar } from "./bars";
import type { Fraction } from "./types";

export interface Tuplet {
  spec: string; // "3", "3:2:4" …
  p: number;
  mult: Fraction; // time factor, e.g. 2/3 for (3
  els: NoteEl[];
}

export interface NoteEl {
  type: "note";
  voice: string;
  start: number;
  end: number;
  lex: Lexed;
  body: Body;
  duration: Fraction; // sounding time, tuplets and broken rhythm applied
  unit: Fraction; // unit note length in force
  midi: (number | null)[]; // sounding pitch of each written note of the body (null: rest)
  pos: number[]; // staff position of each written note
  tieOut: boolean;
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
  voice: string;
  start: number;
  end: number;
  toks: Tok[];
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

const num = (o: object, k: string): number | undefined => {
  const v: unknown = Reflect.get(o, k);
  return typeof v === "number" ? v : undefined;
};
const str = (o: object, k: string): string | undefined => {
  const v: unknown = Reflect.get(o, k);
  return typeof v === "string" ? v : undefined;
};

export function readModel(abc: string, tune: TuneObject): TuneModel {
  const header = readHeader(abc);
  const shorthands = shorthandsOf(abc);
  const voices = new Map<string, El[]>();
  const seen = new Set<number>();
  const acc = new Map<string, BarAccidentals>();
  const openTuplet = new Map<string, Tuplet | null>();
  const lastNote = new Map<string, NoteEl>();
  const tuplets: Tuplet[] = [];
  for (const line of tune.lines) {
    (line.staff ?? []).forEach((staff, si) => {
      (staff.voices ?? []).forEach((items, vi) => {
        const voice = `${si}.${vi}`;
        const els = voices.get(voice) ?? [];
        voices.set(voice, els);
        const state = acc.get(voice) ?? new BarAccidentals(keyAccOf(staff.key));
        acc.set(voice, state);
        if (staff.key) state.key = keyAccOf(staff.key);
        for (const item of items) {
          const start = num(item, "startChar");
          const end = num(item, "endChar");
          if (start === undefined || end === undefined || start < header.headerEnd) continue;
          if (item.el_type === "key") state.key = keyAccOf(item);
          else if (item.el_type === "part") els.push({ type: "part", voice, start, end, title: str(item, "title") ?? "" });
          else if (item.el_type === "bar") {
            state.reset();
            if (seen.has(start)) continue;
            seen.add(start);
            const toks = hasMarks(abc, start, end) ? lexSpan(abc, start, end, {}).toks.filter((t) => t.kind === "deco" || t.kind === "gchord") : [];
            const startEnding = str(item, "startEnding") ?? null;
            els.push({ type: "bar", voice, start, end, toks, barType: item.type, startEnding, endEnding: Reflect.get(item, "endEnding") === true });
          } else if (item.el_type === "note" && !seen.has(start)) {
            const lex = lexSpan(abc, start, end, shorthands);
            if (!lex.body) continue;
            seen.add(start);
            const el = noteEl(item, voice, start, end, lex, lex.body, state, header, lastNote.get(voice));
            const tStart = num(item, "startTriplet");
            if (tStart !== undefined) {
              const spec = lex.toks.find((t) => t.kind === "tuplet")?.name ?? String(tStart);
              const mult = tupletMultiplier(spec, valueAt(header.meters, start)) ?? fromNumber(num(item, "tripletMultiplier") ?? 1);
              const t: Tuplet = { spec, p: tStart, mult, els: [] };
              tuplets.push(t);
              openTuplet.set(voice, t);
            }
            const t = openTuplet.get(voice) ?? null;
            if (t) {
              el.tuplet = t;
              t.els.push(el);
              el.duration = mul(el.duration, t.mult);
              if (Reflect.get(item, "endTriplet") === true) openTuplet.set(voice, null);
            }
            const prevNote = lastNote.get(voice);
            if (prevNote) prevNote.next = el;
            lastNote.set(voice, el);
            els.push(el);
          }
        }
      });
    });
  }
  const melody = voices.keys().next().value ?? "0.0";
  const bars = new Map<string, VBar[]>();
  for (const [voice, els] of voices) bars.set(voice, assembleBars(els, header));
  const edits: (NoteEl | BarEl)[] = [];
  for (const els of voices.values()) for (const e of els) if (e.type !== "part") edits.push(e);
  edits.sort((a, b) => a.start - b.start);
  return { abc, header, shorthands, voices, melody, bars, edits, tuplets };
}

/** Most bar lines carry nothing to lex: skip the lexer unless a decoration or quote is there. */
function hasMarks(abc: string, start: number, end: number): boolean {
  for (let i = start; i < end; i++) {
    const c = abc[i];
    if (c === "!" || c === "+" || c === '"') return true;
  }
  return false;
}

function noteEl(
  item: object, voice: string, start: number, end: number, lex: Lexed, body: Body,
  state: BarAccidentals, header: HeaderInfo, prev: NoteEl | undefined,
): NoteEl {
  const written = mul(body.notes[0]?.len ?? frac(1), body.outerLen);
  const duration = fromNumber(num(item, "duration") ?? 0);
  let brokenOut = false;
  for (const t of lex.toks) if (t.kind === "broken") brokenOut = true;
  // The unit abcjs used is exact when no broken rhythm touches the note; it follows L: changes
  // abcjs applied (including inline [L:]) without a second reading of the fields.
  const unit = !brokenOut && !prev?.brokenOut && written.num > 0 && duration.num > 0
    ? div(duration, written)
    : valueAt(header.units, start);
  const pos = body.notes.map((n) => (body.rest ? 0 : staffPos(n.name)));
  const midi = body.notes.map((n, i) => (body.rest ? null : state.sound(pos[i], n.acc)));
  let tieOut = false;
  for (const t of lex.toks) if (t.kind === "tie" && t.start >= body.end) tieOut = true;
  for (const n of body.notes) if (n.tie !== "") tieOut = true;
  return {
    type: "note", voice, start, end, lex, body, duration, unit, midi, pos, tieOut,
    tiedFromPrevious: prev?.tieOut ?? false, next: null, brokenOut, tuplet: null, key: state.key,
    bar: null, onset: frac(0), grid: frac(0),
  };
}

/**
 * ABC 2.1 §4.13: "(p:q:r" puts p notes into the time of q. Without q: 3 for (2, (4 and (8; 2 for
 * (3 and (6; for (5, (7 and (9, 3 in compound meter and 2 otherwise. abcjs 6.7 takes 2 for (5 in
 * 6/8, so the standard's rule is applied here rather than trusting its multiplier.
 */
export function tupletMultiplier(spec: string, meter: Fraction | null): Fraction | null {
  const [pText, qText] = spec.split(":");
  const p = Number(pText);
  if (!(p > 1)) return null;
  const compound = meter !== null && meter.num % 3 === 0 && meter.num > 3;
  const q = qText ? Number(qText) : [2, 4, 8].includes(p) ? 3 : [3, 6].includes(p) ? 2 : compound ? 3 : 2;
  return q > 0 ? frac(q, p) : null;
}
