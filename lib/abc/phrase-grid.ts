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
    for (let k = 0; k < cells; k++) if (notes[k] === -1) notes[k] = -(nextId++) - 2;
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

interface Cell {
  bar: Bar;
  onset: number;
  pitch: number;
  note: number;
}

/** Flattens a phrase (a list of bars) into grid cells. */
export function cellsOf(bars: Bar[], grids: Map<Bar, BarGrid>, step: Fraction): Cell[] {
  const s = toNumber(step);
  const cells: Cell[] = [];
  for (const bar of bars) {
    const g = grids.get(bar);
    if (g === undefined) continue;
    for (let k = 0; k < g.pitches.length; k++) {
      cells.push({ bar, onset: k * s, pitch: g.pitches[k] as number, note: g.notes[k] as number });
    }
  }
  return cells;
}

const asPitch = (p: number): number | null => (p < 0 ? null : p);

/**
 * Counts differing NOTES, not grid points: consecutive differing points that share a note on
 * either side are one difference, worth as many notes as the busier side plays there (B2 against
 * cd is two notes to change; B2 against cB is one).
 */
export function compareCells(x: Cell[], y: Cell[], stopAbove = Infinity): Comparison {
  const len = Math.min(x.length, y.length);
  const differences: Difference[] = [];
  let total = 0;
  let xs = new Set<number>();
  let ys = new Set<number>();
  let current: Difference | null = null;
  const close = (): void => {
    if (current === null) return;
    current.notes = Math.max(xs.size, ys.size);
    total += current.notes;
    differences.push(current);
    current = null;
  };
  for (let k = 0; k < len; k++) {
    const a = x[k] as Cell;
    const b = y[k] as Cell;
    if (a.pitch === b.pitch) continue;
    if (current === null || !(xs.has(a.note) || ys.has(b.note))) {
      close();
      if (total > stopAbove) break;
      xs = new Set<number>();
      ys = new Set<number>();
      current = {
        firstBar: a.bar.number,
        secondBar: b.bar.number,
        lastFirstBar: a.bar.number,
        lastSecondBar: b.bar.number,
        onset: a.onset,
        firstPitch: asPitch(a.pitch),
        secondPitch: asPitch(b.pitch),
        notes: 0,
      };
    }
    xs.add(a.note);
    ys.add(b.note);
    current.lastFirstBar = a.bar.number;
    current.lastSecondBar = b.bar.number;
  }
  close();
  return { differingNotes: total, notes: Math.min(countNotes(x, len), countNotes(y, len)), differences, partial: x.length !== y.length };
}

function countNotes(cells: Cell[], len: number): number {
  let n = 0;
  let last = Number.NaN;
  for (let k = 0; k < len; k++) {
    const c = cells[k] as Cell;
    if (c.note !== last && c.pitch !== GAP) n++;
    last = c.note;
  }
  return n;
}
