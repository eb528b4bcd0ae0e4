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
  /** Lead-ins, not counted as bars: leading bars shorter than a full bar, and any bar the model numbered 0. */
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
    // a P: section holding only a lead-in (no full bar) is the pickup of the part after it
    segments = mergeFragments(runs, fullBar, 1).map((run) => {
      const full = localFullBar(run, fullBar);
      const base = (run.find((b) => !isShort(b, full)) ?? run[0])?.part ?? "A";
      const times = (seen.get(base) ?? 0) + 1;
      seen.set(base, times);
      // a label that comes back later names a new part of its own (ids stay unique)
      const label = times === 1 ? base : `${base}(${times})`;
      return { label, foundBy: "P: label", bars: run };
    });
  } else {
    const marked = mergeFragments(splitRuns(bars, structuralBoundary), fullBar, 2);
    const pieces = marked.flatMap((run) =>
      halve(run, localFullBar(run, fullBar)).map((bars) => ({ bars, halved: bars !== run })),
    );
    const label0 = bars[0]?.part ?? "A";
    const how =
      marked.length === 1 ? "no P: labels, repeats or double bars divide the tune" : "repeat marks and double bars";
    segments = pieces.map((piece, i) => ({
      label:
        pieces.length === 1 ? label0 : String.fromCharCode(65 + (i % 26)) + (i >= 26 ? String(Math.floor(i / 26)) : ""),
      foundBy: piece.halved
        ? `${how}; a stretch of more than 16 bars without marks is halved (strains are 8 or 16 bars: common practice)`
        : how,
      bars: piece.bars,
    }));
  }
  return segments.map((s) => planPart(s.label, s.foundBy, s.bars, localFullBar(s.bars, fullBar)));
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

/**
 * A stretch of more than 16 bars with no part marks (an AABB tune written out, a 32-bar waltz)
 * is split in halves, again while a half is longer than 16 bars, so its phrases stay 2 to 4 bars
 * long. An odd count, or a middle inside numbered endings, leaves it whole.
 */
function halve(run: Bar[], fullBar: number): Bar[][] {
  let lead = 0;
  while (lead < run.length - 1 && isShort(run[lead] as Bar, fullBar)) lead++;
  const counted = run.slice(lead); // a last bar cut short by a pickup still counts
  if (counted.length <= 16 || counted.length % 2 !== 0) return [run];
  const lastOfFirst = counted[counted.length / 2 - 1] as Bar;
  const cut = run.indexOf(lastOfFirst) + 1;
  const next = run[cut];
  if (lastOfFirst.ending !== null || next === undefined || next.ending !== null) return [run];
  return [...halve(run.slice(0, cut), fullBar), ...halve(run.slice(cut), fullBar)];
}

const isShort = (bar: Bar, fullBar: number): boolean => bar.number === 0 || toNumber(bar.length) < fullBar - 1e-9;

/**
 * The length of a full bar in this stretch of the tune: its most common bar length (the longer on
 * a tie), so a part in another meter (a 2/4 part beside a 6/8 one) keeps its own; a single bar is
 * measured against the whole tune's.
 */
export function localFullBar(bars: Bar[], fullBar: number): number {
  if (bars.length < 2) return fullBar;
  const counts = new Map<number, number>();
  for (const b of bars) {
    const v = Math.round(toNumber(b.length) * 1e6) / 1e6;
    counts.set(v, (counts.get(v) ?? 0) + 1);
  }
  let best = 0;
  let bestCount = 0;
  for (const [v, c] of counts) if (c > bestCount || (c === bestCount && v > best)) [best, bestCount] = [v, c];
  return best;
}

/** A piece with fewer than `min` counted bars (a lead-in, a stray double bar) joins the piece after it. */
function mergeFragments(pieces: Bar[][], fullBar: number, min: number): Bar[][] {
  const out: Bar[][] = [];
  let carry: Bar[] = [];
  for (const piece of pieces) {
    const joined = [...carry, ...piece];
    const full = localFullBar(joined, fullBar);
    const counted = joined.filter((b) => !isShort(b, full)).length;
    if (counted < min) carry = joined;
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
  // leading short bars followed by more music are the anacrusis (a lead-in section and the part's own pickup)
  while (i < bars.length - 1 && isShort(bars[i] as Bar, fullBar)) pickups.push(bars[i++] as Bar);
  const main: Bar[] = [];
  const endingSets: EndingSet[] = [];
  let set: EndingSet | null = null;
  let run: { ending: string; bars: Bar[] } | null = null;
  for (; i < bars.length; i++) {
    const bar = bars[i] as Bar;
    if (bar.number === 0) {
      pickups.push(bar); // the model's own verdict: a lead-in wherever it stands (e.g. after a final double bar)
      continue;
    }
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
