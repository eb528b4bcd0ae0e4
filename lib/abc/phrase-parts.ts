// Finding a tune's parts, their pickups and their endings (issue 3 §5).
import type { Bar, BarLineKind } from "./types";
import { toNumber } from "./phrase-time";

export interface EndingSet {
  /** Index in `main` of the first bar of the first ending, and how many bars it has. */
  start: number;
  length: number;
  /** The other endings (second, third …), each played instead of the first. */
  alternatives: { ending: string; bars: Bar[] }[];
}

export interface PartPlan {
  label: string;
  /** How the part was found, in plain English. */
  foundBy: string;
  /** Every bar of the part in text order (pickups, main path, alternative endings). */
  bars: Bar[];
  /** Leading bars shorter than a full bar: the anacrusis, not counted as bars. */
  pickups: Bar[];
  /** The counted bars of the part as first played: through the first ending. */
  main: Bar[];
  endingSets: EndingSet[];
}

const CLOSING: ReadonlySet<BarLineKind> = new Set<BarLineKind>(["repeatEnd", "repeatBoth", "double", "final"]);
const OPENING: ReadonlySet<BarLineKind> = new Set<BarLineKind>(["repeatStart", "repeatBoth"]);

/**
 * Parts come from P: labels when the tune has more than one; otherwise from repeat marks and
 * double bars (a part ends at `:|`, `::`, `||`, `|]` or before `|:`), except between a first and
 * a second ending, which belong to one part. A part ends after its last ending even at a plain bar
 * line, since a second ending closes its part (common practice).
 */
export function findParts(bars: Bar[], fullBar: number): PartPlan[] {
  const runs = splitRuns(bars, (prev, next) => prev.part !== next.part);
  let segments: { label: string; foundBy: string; bars: Bar[] }[];
  if (runs.length > 1) {
    const seen = new Map<string, number>();
    segments = runs.map((run) => {
      const base = run[0]?.part ?? "A";
      const times = (seen.get(base) ?? 0) + 1;
      seen.set(base, times);
      // a label that comes back later names a new part of its own (ids stay unique)
      const label = times === 1 ? base : `${base}(${times})`;
      return { label, foundBy: "P: label", bars: run };
    });
  } else {
    const pieces = mergeFragments(splitRuns(bars, structuralBoundary), fullBar);
    const label0 = bars[0]?.part ?? "A";
    segments = pieces.map((run, i) => ({
      label: pieces.length === 1 ? label0 : String.fromCharCode(65 + (i % 26)) + (i >= 26 ? String(Math.floor(i / 26)) : ""),
      foundBy: pieces.length === 1 ? "the whole tune (no P: labels, repeats or double bars divide it)" : "repeat marks and double bars",
      bars: run,
    }));
  }
  return segments.map((s) => planPart(s.label, s.foundBy, s.bars, fullBar));
}

function splitRuns(bars: Bar[], boundary: (prev: Bar, next: Bar) => boolean): Bar[][] {
  const runs: Bar[][] = [];
  let current: Bar[] = [];
  for (const bar of bars) {
    const prev = current[current.length - 1];
    if (prev !== undefined && boundary(prev, bar)) {
      runs.push(current);
      current = [];
    }
    current.push(bar);
  }
  if (current.length > 0) runs.push(current);
  return runs;
}

function structuralBoundary(prev: Bar, next: Bar): boolean {
  if (prev.ending !== null && next.ending !== null) return false; // first ending → second ending
  if (prev.ending !== null && next.ending === null && prev.ending !== firstEndingOf(prev)) return true;
  return (
    (prev.rightLine !== null && CLOSING.has(prev.rightLine)) ||
    (next.leftLine !== null && (OPENING.has(next.leftLine) || CLOSING.has(next.leftLine)))
  );
}

// The "1" in "1", "1,3", "1-2": an ending label that is played first.
const firstEndingOf = (bar: Bar): string | null =>
  bar.ending !== null && /^1(?![0-9])/.test(bar.ending) ? bar.ending : null;

const isPickup = (bar: Bar, fullBar: number): boolean => bar.number === 0 || toNumber(bar.length) < fullBar - 1e-9;

/** A piece with fewer than two counted bars (a stray double bar) joins the piece after it. */
function mergeFragments(pieces: Bar[][], fullBar: number): Bar[][] {
  const out: Bar[][] = [];
  let carry: Bar[] = [];
  for (const piece of pieces) {
    const joined = [...carry, ...piece];
    const counted = joined.filter((b) => !isPickup(b, fullBar)).length;
    if (counted < 2) carry = joined;
    else {
      out.push(joined);
      carry = [];
    }
  }
  if (carry.length > 0) {
    const last = out.pop();
    out.push(last === undefined ? carry : [...last, ...carry]);
  }
  return out;
}

function planPart(label: string, foundBy: string, bars: Bar[], fullBar: number): PartPlan {
  const pickups: Bar[] = [];
  let i = 0;
  // only a leading short bar followed by more music is an anacrusis
  while (i < bars.length - 1 && pickups.length === 0 && isPickup(bars[i] as Bar, fullBar)) pickups.push(bars[i++] as Bar);
  const main: Bar[] = [];
  const endingSets: EndingSet[] = [];
  let set: EndingSet | null = null;
  let run: { ending: string; bars: Bar[] } | null = null;
  for (; i < bars.length; i++) {
    const bar = bars[i] as Bar;
    if (bar.ending === null) {
      set = null;
      run = null;
      main.push(bar);
      continue;
    }
    if (run !== null && run.ending === bar.ending) {
      run.bars.push(bar);
      if (set !== null && set.alternatives.length === 0) {
        set.length++;
        main.push(bar);
      }
      continue;
    }
    run = { ending: bar.ending, bars: [bar] };
    if (set === null) {
      set = { start: main.length, length: 1, alternatives: [] };
      endingSets.push(set);
      main.push(bar);
    } else set.alternatives.push(run);
  }
  return { label, foundBy, bars, pickups, main, endingSets };
}
