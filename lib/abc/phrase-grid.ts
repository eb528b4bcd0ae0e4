// Sampling bars on the tune's grid and comparing two sampled phrases note by note.
import type { Bar, Fraction } from "./types";
import { toNumber } from "./phrase-time";

/** A bar sampled on the grid: the pitch sounding at each grid point and which note sounds it. */
export interface BarGrid {
  bar: Bar;
  pitches: number[]; // MIDI pitch; REST for a rest; GAP where no note sounds
  notes: number[]; // id of the sounding note: a tie chain is one note
}
export const REST = -1;
export const GAP = -2;

const EPS = 1e-9;

/**
 * Samples every bar once, in text order. A tied note keeps the id (and, if it has none, the pitch)
 * of the note it continues, so a tie chain counts as one note wherever it is compared.
 */
export function sampleBars(bars: Bar[], step: Fraction): Map<Bar, BarGrid> {
  const out = new Map<Bar, BarGrid>();
  const s = toNumber(step);
  let nextId = 0;
  let prevId = -1;
  let prevPitch = GAP;
  for (const bar of bars) {
    const cells = Math.max(0, Math.ceil(toNumber(bar.length) / s - 1e-6));
    const pitches = new Array<number>(cells).fill(GAP);
    const notes = new Array<number>(cells).fill(-1);
    for (const n of bar.notes) {
      let pitch = n.pitch === null ? REST : n.pitch;
      let id: number;
      if (n.tiedFromPrevious && prevId >= 0) {
        id = prevId;
        if (n.pitch === null) pitch = prevPitch;
      } else id = nextId++;
      prevId = id;
      prevPitch = pitch;
      const start = toNumber(n.onset);
      const end = start + toNumber(n.duration);
      for (let k = Math.max(0, Math.ceil(start / s - EPS)); k < cells && k * s < end - EPS; k++) {
        pitches[k] = pitch;
        notes[k] = id;
      }
    }
    // an empty cell is its own "note" so that differences there are still counted
    for (let k = 0; k < cells; k++) if (notes[k] === -1) notes[k] = -nextId++ - 2;
    out.set(bar, { bar, pitches, notes });
  }
  return out;
}

/** One place where two phrases differ: a run of grid points linked by the notes sounding there. */
export interface Difference {
  firstBar: number;
  secondBar: number;
  lastFirstBar: number; // a difference may run on into the next bar (a tied or long note)
  lastSecondBar: number;
  onset: number; // whole notes from the start of the bar
  firstPitch: number | null; // at the first differing grid point; null for a rest or silence
  secondPitch: number | null;
  notes: number; // notes that differ here: the larger count of the two sides
}

export interface Comparison {
  differingNotes: number;
  /** Notes sounded in the compared stretch, on the side with fewer. */
  notes: number;
  differences: Difference[];
  /** The two phrases have different lengths and were compared over the shorter one. */
  partial: boolean;
}

/** A phrase flattened onto the grid: typed arrays, so comparing allocates nothing per point. */
export interface Cells {
  pitch: Int32Array;
  note: Int32Array;
  bars: Bar[];
  barStart: number[]; // index of each bar's first grid point
  step: number; // grid step in whole notes
}

/** Flattens a phrase (a list of bars) onto the grid. */
export const NO_CELLS: Cells = { pitch: new Int32Array(0), note: new Int32Array(0), bars: [], barStart: [], step: 1 };

export function cellsOf(bars: Bar[], grids: Map<Bar, BarGrid>, step: Fraction): Cells {
  let len = 0;
  for (const bar of bars) len += grids.get(bar)?.pitches.length ?? 0;
  const pitch = new Int32Array(len);
  const note = new Int32Array(len);
  const barStart: number[] = [];
  const kept: Bar[] = [];
  let at = 0;
  for (const bar of bars) {
    const g = grids.get(bar);
    if (g === undefined) continue;
    kept.push(bar);
    barStart.push(at);
    for (let k = 0; k < g.pitches.length; k++, at++) {
      pitch[at] = g.pitches[k] as number;
      note[at] = g.notes[k] as number;
    }
  }
  return { pitch, note, bars: kept, barStart, step: toNumber(step) };
}

const asPitch = (p: number): number | null => (p < 0 ? null : p);

/** The bar holding grid point k, and the point's onset in that bar. */
function place(c: Cells, k: number): { bar: number; onset: number } {
  let i = c.barStart.length - 1;
  while (i > 0 && (c.barStart[i] as number) > k) i--;
  return { bar: c.bars[i]?.number ?? 0, onset: (k - (c.barStart[i] ?? 0)) * c.step };
}

/**
 * Counts differing NOTES, not grid points: consecutive differing points that share a note on
 * either side are one difference, worth as many notes as the busier side plays there (B2 against
 * cd is two notes to change; B2 against cB is one). A note lasts over consecutive grid points, so
 * "shares a note" only needs the last note seen on each side.
 */
export function compareCells(x: Cells, y: Cells, stopAbove = Infinity): Comparison {
  const len = Math.min(x.pitch.length, y.pitch.length);
  const differences: Difference[] = [];
  let total = 0;
  let current: Difference | null = null;
  let lastX = 0;
  let lastY = 0;
  let nx = 0;
  let ny = 0;
  let k = 0;
  for (; k <= len; k++) {
    const differs = k < len && x.pitch[k] !== y.pitch[k];
    const a = k < len ? (x.note[k] as number) : 0;
    const b = k < len ? (y.note[k] as number) : 0;
    if (current !== null && (!differs || (a !== lastX && b !== lastY))) {
      if (!differs) {
        // a differing run may pause and resume on the same notes: keep it open until a new note starts
        if (k < len && (a === lastX || b === lastY)) continue;
      }
      current.notes = Math.max(nx, ny);
      total += current.notes;
      differences.push(current);
      current = null;
      // past the limit the exact count no longer matters: skip the note counts too
      if (total > stopAbove)
        return { differingNotes: total, notes: 0, differences, partial: x.pitch.length !== y.pitch.length };
    }
    if (!differs) continue;
    if (current === null) {
      const px = place(x, k);
      const py = place(y, k);
      current = {
        firstBar: px.bar,
        secondBar: py.bar,
        lastFirstBar: px.bar,
        lastSecondBar: py.bar,
        onset: px.onset,
        firstPitch: asPitch(x.pitch[k] as number),
        secondPitch: asPitch(y.pitch[k] as number),
        notes: 0,
      };
      nx = 0;
      ny = 0;
      lastX = Number.NaN;
      lastY = Number.NaN;
    }
    if (a !== lastX) nx++;
    if (b !== lastY) ny++;
    lastX = a;
    lastY = b;
    current.lastFirstBar = place(x, k).bar;
    current.lastSecondBar = place(y, k).bar;
  }
  return {
    differingNotes: total,
    notes: Math.min(countNotes(x, len), countNotes(y, len)),
    differences,
    partial: x.pitch.length !== y.pitch.length,
  };
}

function countNotes(c: Cells, len: number): number {
  let n = 0;
  let last = Number.NaN;
  for (let k = 0; k < len; k++) {
    const id = c.note[k] as number;
    if (id !== last && c.pitch[k] !== GAP) n++;
    last = id;
  }
  return n;
}
