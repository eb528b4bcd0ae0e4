// Time helpers for the phrase map and the setting comparison.
import type { Bar, Fraction } from "./types";
import { toNumber } from "./fraction";
import { beatOf } from "./header";

export { toNumber };

/** True when `t` is a whole multiple of `step` (both exact fractions). */
export function isMultiple(t: Fraction, step: Fraction): boolean {
  // t / step = (t.num * step.den) / (t.den * step.num)
  return (t.num * step.den) % (t.den * step.num) === 0;
}

/** 1-based beat number of an onset (fractional when between beats), rounded to 1/1000. */
export function beatNumber(onset: number, meter: Fraction): number {
  return Math.round((1 + onset / toNumber(beatOf(meter))) * 1000) / 1000;
}

/**
 * The grid the phrases are sampled on. It starts at the unit note length (issue 3 §5) and is
 * refined by halves while skeleton notes start between grid points, so a tune written with L:1/4
 * and eighth notes still compares its eighths. Triplet onsets never fall on a halving grid; the
 * refinement stops at a 1/32 note, below which no skeleton note should start.
 */
export function gridStep(bars: Bar[], unit: Fraction): Fraction {
  let step: Fraction = { num: unit.num, den: unit.den };
  for (;;) {
    if (step.num / step.den <= 1 / 32) return step;
    const half: Fraction =
      step.num % 2 === 0 ? { num: step.num / 2, den: step.den } : { num: step.num, den: step.den * 2 };
    let needsHalf = false;
    for (const bar of bars) {
      for (const n of bar.notes) {
        if (!isMultiple(n.onset, step) && isMultiple(n.onset, half)) {
          needsHalf = true;
          break;
        }
      }
      if (needsHalf) break;
    }
    if (!needsHalf) return step;
    step = half;
  }
}

/** The most common bar length (ties go to the meter): the length a full bar of this tune has. */
export function fullBarLength(bars: Bar[], meter: Fraction): number {
  const counts = new Map<number, number>();
  for (const b of bars) {
    const v = Math.round(toNumber(b.length) * 1e6) / 1e6;
    counts.set(v, (counts.get(v) ?? 0) + 1);
  }
  let best = toNumber(meter);
  let bestCount = counts.get(Math.round(best * 1e6) / 1e6) ?? 0;
  for (const [v, c] of counts) {
    if (c > bestCount) {
      best = v;
      bestCount = c;
    }
  }
  return best;
}

const NAMES = ["C", "C#", "D", "D#", "E", "F", "F#", "G", "G#", "A", "A#", "B"];
/** Scientific pitch name of a MIDI number (middle C = C4), "rest" for null. */
export function pitchName(p: number | null): string {
  if (p === null) return "rest";
  return `${NAMES[((p % 12) + 12) % 12]}${Math.floor(p / 12) - 1}`;
}
