// Time of a note: the unit note length in force, and the time factor of a tuplet.
import { div, frac } from "./fraction";
import type { Fraction } from "./types";

const ONE = frac(1);

// Lengths and durations come from caches (the same object for the same value), so a run of notes
// of one length finds its unit by identity instead of dividing again.
let lastDuration: Fraction | null = null;
let lastWritten: Fraction | null = null;
let lastUnit: Fraction = ONE;
export function unitOf(duration: Fraction, written: Fraction): Fraction {
  if (duration !== lastDuration || written !== lastWritten) {
    lastUnit = div(duration, written);
    lastDuration = duration;
    lastWritten = written;
  }
  return lastUnit;
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
