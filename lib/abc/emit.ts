// Writes a version of the tune with some embellishment kinds taken out, by editing the source
// text element by element (abcjs offsets); text between elements is copied as it is.
import { abcLength, div, mul } from "./fraction";
import { kindOfDecoration } from "./decorations";
import type { FillGroup } from "./groups";
import type { Tok } from "./lex";
import type { BarEl, NoteEl, TuneModel } from "./model";
import { BarAccidentals } from "./pitch";
import type { Fraction, Kind, MelodyNote } from "./types";

export type DoubleStop = "highest" | "lowest";

export interface Emitted {
  abc: string;
  /** Source element boundary → offset in the output (for bars and notes). */
  offsets: Map<number, number>;
  /** Melody notes as written in the output, keyed by the source element that starts them. */
  notes: Map<NoteEl, MelodyNote>;
}

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

/** Index of the melody note of a body: highest (or lowest) sounding pitch, first on a tie. */
export function melodyIndex(el: NoteEl, pick: DoubleStop): number {
  let best = 0;
  el.midi.forEach((m, i) => {
    const b = el.midi[best];
    if (m !== null && b !== null && (pick === "highest" ? m > b : m < b)) best = i;
  });
  return best;
}

/** `track`: also record offsets and melody notes (only the skeleton's bars need them). */
export function emit(
  model: TuneModel, removed: ReadonlySet<Kind>, groupOf: Map<NoteEl, FillGroup>, pick: DoubleStop, track = false,
): Emitted {
  const { abc } = model;
  const out: string[] = [];
  let outLen = 0;
  let pos = 0;
  const offsets = new Map<number, number>();
  const notes = new Map<NoteEl, MelodyNote>();
  const states = new Map<string, BarAccidentals>();
  const write = (s: string): void => {
    out.push(s);
    outLen += s.length;
  };
  const keep = (t: Tok): boolean => {
    const k = tokKind(t);
    return k === null || !removed.has(k);
  };
  const collapse = removed.has("fills");
  for (const el of model.edits) {
    if (el.start < pos) continue;
    write(abc.slice(pos, el.start));
    if (track) offsets.set(el.start, outLen);
    const state = states.get(el.voice) ?? new BarAccidentals(new Map());
    states.set(el.voice, state);
    if (el.type === "bar") {
      state.reset();
      write(renderBar(abc, el, keep));
    } else {
      state.key = el.key;
      const g = collapse ? groupOf.get(el) : undefined;
      if (!g || g.els[0] === el) {
        const start = outLen;
        const midi = writeNote(abc, el, g, state, removed, pick, keep, write);
        if (track && el.voice === model.melody) {
          notes.set(el, {
            onset: el.onset, duration: g ? g.total : el.duration, pitch: midi,
            tiedFromPrevious: el.tiedFromPrevious, startChar: start, endChar: outLen,
          });
        }
      }
    }
    if (track) offsets.set(el.end, outLen);
    pos = el.end;
  }
  write(abc.slice(pos));
  return { abc: out.join(""), offsets, notes };
}

function renderBar(abc: string, el: BarEl, keep: (t: Tok) => boolean): string {
  let s = abc.slice(el.start, el.end);
  for (const t of [...el.toks].reverse()) {
    if (!keep(t)) s = s.slice(0, t.start - el.start) + s.slice(t.end - el.start);
  }
  return s;
}

const PREFIX = new Set(["gchord", "deco", "short", "grace", "slurOpen"]);

/** Writes one note element (or a whole collapsed group); returns the melody pitch written. */
function writeNote(
  src: string, el: NoteEl, g: FillGroup | undefined, state: BarAccidentals, removed: ReadonlySet<Kind>, pick: DoubleStop,
  keep: (t: Tok) => boolean, write: (s: string) => void,
): number | null {
  const body = el.body;
  const reduce = body.chord && removed.has("doubleStops");
  const m = melodyIndex(el, pick);
  if (!g && !reduce && el.lex.toks.every(keep)) {
    // Nothing to take out: the element as written, unless an accidental must be re-spelt.
    const spelt = body.rest ? null : body.notes.map((n, i) => state.spell(el.pos[i], n.acc, el.midi[i] ?? 0));
    if (!spelt || spelt.every((a, i) => a === body.notes[i].acc)) write(src.slice(el.start, el.end));
    else for (const t of el.lex.toks) write(t.kind === "body" ? withAccidentals(src, el, spelt) : src.slice(t.start, t.end));
    return el.midi[m];
  }
  if (!g) {
    // A tie from a reduced chord survives only if the next note still sounds its pitch.
    const tieOk = !reduce || tiedPitches(el.next, removed, pick).includes(el.midi[m]);
    for (const t of el.lex.toks) {
      if (t.kind === "body") write(renderBody(src, el, state, reduce ? m : null, null, tieOk));
      else if (keep(t) && (t.kind !== "tie" || tieOk)) write(src.slice(t.start, t.end));
    }
    return el.midi[m];
  }
  // A collapsed group: every member's kept marks before one note of the group's whole time.
  const last = g.els[g.els.length - 1];
  for (const member of g.els) {
    for (const t of member.lex.toks) {
      const lead = member === el && t.kind === "ws" && t.end <= el.body.start;
      if (lead || (PREFIX.has(t.kind) && keep(t))) write(src.slice(t.start, t.end));
    }
  }
  write(renderBody(src, el, state, reduce ? m : null, div(g.total, el.unit)));
  const sameNote = el.midi[m] !== null && tiedPitches(last.next, removed, pick).includes(el.midi[m]);
  for (const t of last.lex.toks) if (t.kind === "tie" && sameNote) write(src.slice(t.start, t.end));
  for (const member of g.els) for (const t of member.lex.toks) if (t.kind === "slurClose" && keep(t)) write(src.slice(t.start, t.end));
  for (const t of last.lex.toks.slice(-1)) if (t.kind === "ws") write(src.slice(t.start, t.end));
  return el.midi[m];
}



/** Pitches a note element sounds once `removed` kinds are gone. */
function tiedPitches(el: NoteEl | null, removed: ReadonlySet<Kind>, pick: DoubleStop): (number | null)[] {
  if (!el) return [];
  return el.body.chord && removed.has("doubleStops") ? [el.midi[melodyIndex(el, pick)]] : el.midi;
}

/** The body as written, with `spelt` accidentals in place of the written ones. */
function withAccidentals(src: string, el: NoteEl, spelt: string[]): string {
  const b = el.body;
  let s = "";
  let at = b.start;
  b.notes.forEach((n, i) => {
    s += src.slice(at, n.start) + spelt[i];
    at = n.letterStart;
  });
  return s + src.slice(at, b.end);
}

/**
 * A body as written, or reduced to its melody note (`only`), or with a new length (`len`, a
 * multiple of L). Accidentals are re-spelt where the output's bar context differs from the source.
 */
function renderBody(
  src: string, el: NoteEl, state: BarAccidentals, only: number | null, len: Fraction | null, tieOk = true,
): string {
  const b = el.body;
  if (b.rest) return len ? b.rest + abcLength(len) : src.slice(b.start, b.end);
  const spelt = b.notes.map((n, i) => (only === null || only === i ? state.spell(el.pos[i], n.acc, el.midi[i] ?? 0) : ""));
  if (only !== null) {
    const n = b.notes[only];
    const l = len ?? mul(b.notes[0].len, b.outerLen);
    return spelt[only] + n.name + abcLength(l) + (len || !tieOk ? "" : n.tie);
  }
  if (len) {
    const pitches = b.notes.map((n, i) => spelt[i] + n.name).join("");
    return b.chord ? `[${pitches}]${abcLength(len)}` : pitches + abcLength(len);
  }
  return withAccidentals(src, el, spelt);
}
