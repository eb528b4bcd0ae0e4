// Bars of one voice from its elements: numbering (a pickup is bar 0), parts from P: in the body,
// numbered endings (ABC 2.1 §4.9) and the bar line on each side.
import { add, cmp, frac, sub, ZERO } from "./fraction";
import { valueAt, type HeaderInfo } from "./header";
import type { BarEl, El, NoteEl } from "./model";
import type { BarLineKind, Fraction } from "./types";

export interface VBar {
  index: number; // position in the voice's bar list
  number: number; // 1-based; 0 for a pickup
  part: string;
  ending: string | null;
  left: BarEl | null;
  right: BarEl | null;
  notes: NoteEl[];
  startChar: number;
  endChar: number;
  length: Fraction;
  meter: Fraction | null;
  shift: Fraction; // added to an onset to place it on the beat grid
  opensPart: boolean; // after a P: field, a repeat or a double bar
}

const LINE: Record<string, BarLineKind | null> = {
  bar_thin: "single",
  bar_thin_thin: "double",
  bar_thin_thick: "final",
  bar_thick_thin: "double",
  bar_left_repeat: "repeatStart",
  bar_right_repeat: "repeatEnd",
  bar_dbl_repeat: "repeatBoth",
  bar_invisible: null,
};
export const lineKind = (b: BarEl | null): BarLineKind | null => (b ? (LINE[b.barType] ?? "single") : null);

const PART_BOUNDARY = new Set<BarLineKind | null>([
  "repeatStart",
  "repeatEnd",
  "repeatBoth",
  "double",
  "final",
  "start",
]);

export function assembleBars(els: El[], header: HeaderInfo): VBar[] {
  const bars: VBar[] = [];
  let part = "A";
  let ending: string | null = null;
  let left: BarEl | null = null;
  // The bar's notes as they come, copied out at their count when it closes (as in lex.ts).
  const pending: NoteEl[] = [];
  let count = 0;
  let partAtStart = part;
  let partChanged = false;
  const close = (right: BarEl | null): void => {
    if (count === 0) return;
    const notes = pending.slice(0, count);
    count = 0;
    let length = ZERO;
    for (const n of notes) length = add(length, n.duration);
    bars.push({
      index: bars.length,
      number: -1,
      part: partAtStart,
      ending,
      left,
      right,
      notes,
      startChar: left ? left.end : notes[0].start,
      endChar: right ? right.end : notes[notes.length - 1].end,
      length,
      meter: valueAt(header.meters, notes[0].start),
      shift: ZERO,
      opensPart: partChanged || PART_BOUNDARY.has(lineKind(left)),
    });
    partChanged = false;
  };
  for (const el of els) {
    if (el.type === "part") {
      part = el.title || part;
      partChanged = true;
    } else if (el.type === "note") {
      if (count === 0) partAtStart = part;
      pending[count++] = el;
    } else {
      close(el);
      if (el.endEnding) ending = null;
      if (el.startEnding !== null) ending = el.startEnding;
      // Several bar elements in a row (":|" then "[2") open the next bar with the last of them.
      if (count === 0) left = el.barType === "bar_invisible" && left && left.end === el.start ? left : el;
    }
  }
  close(null);
  number(bars);
  return bars;
}

/**
 * A pickup (bar 0, not counted) is a short first bar, or a short bar opening a part whose
 * previous bar is short by exactly its length (the A part's last bar and the B part's pickup
 * together make one bar: common practice in dance-tune notation).
 */
function number(bars: VBar[]): void {
  let n = 0;
  bars.forEach((bar, i) => {
    const full = bar.meter;
    const short = full !== null && cmp(bar.length, full) < 0;
    const prev = bars[i - 1];
    const pickup =
      short &&
      full !== null &&
      (i === 0 ||
        (bar.opensPart &&
          prev !== undefined &&
          prev.meter !== null &&
          cmp(add(prev.length, bar.length), full) === 0 &&
          cmp(prev.length, full) < 0));
    if (pickup && full) bar.shift = sub(full, bar.length);
    bar.number = pickup ? 0 : ++n;
    let onset = frac(0);
    for (const note of bar.notes) {
      note.bar = bar;
      note.onset = onset;
      note.grid = bar.shift.num === 0 ? onset : add(onset, bar.shift); // onsets are already reduced
      onset = add(onset, note.duration);
    }
  });
}
