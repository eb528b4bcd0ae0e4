// Meter and unit note length in force at each point of a tune, read from the text: abcjs applies
// L: and M: changes but does not report them all as elements (inline [L:] never appears).
import { frac, toNumber } from "./fraction";
import type { Fraction } from "./types";

export interface FieldChange<T> {
  at: number; // offset in the tune text where the change takes effect
  value: T;
}

export interface HeaderInfo {
  headerEnd: number; // just after the first K: line (where the music begins)
  meter: Fraction | null; // header meter, null for free meter or no M:
  unit: Fraction; // header L:, or the §3.1.7 default
  meters: FieldChange<Fraction | null>[]; // header meter first, then body changes in order
  units: FieldChange<Fraction>[];
  title: string;
}

/** M: value → fraction of a whole note. C = 4/4 and C| = 2/2 (ABC 2.1 §3.1.6); none → null. */
export function parseMeter(v: string): Fraction | null {
  const s = v.replace(/%.*/, "").trim();
  // Kept unreduced: 6/8 and 3/4 are the same length but not the same beat.
  if (s === "C") return { num: 4, den: 4 };
  if (s === "C|") return { num: 2, den: 2 };
  const m = /^\(?([\d+ ]+)\)?\s*\/\s*(\d+)/.exec(s);
  if (!m) return null;
  const num = m[1].split("+").reduce((a, b) => a + (Number(b.trim()) || 0), 0);
  const den = Number(m[2]);
  return num > 0 && den > 0 ? { num, den } : null;
}

function parseUnit(v: string): Fraction | null {
  const m = /^\s*(\d+)\s*\/\s*(\d+)/.exec(v);
  return m && Number(m[1]) > 0 && Number(m[2]) > 0 ? frac(Number(m[1]), Number(m[2])) : null;
}

/**
 * ABC 2.1 §3.1.7: with no L:, the unit is 1/16 when the meter as a decimal is below 0.75, else
 * 1/8; M:C, M:C| and free meter (or no M:) give 1/8.
 */
export function defaultUnit(meter: Fraction | null): Fraction {
  if (!meter) return frac(1, 8);
  return toNumber(meter) < 0.75 ? frac(1, 16) : frac(1, 8);
}

export function readHeader(abc: string): HeaderInfo {
  const k = /^K:.*$/m.exec(abc);
  const headerEnd = k ? k.index + k[0].length : 0;
  const head = abc.slice(0, headerEnd);
  const mField = /^M:(.*)$/m.exec(head);
  const lField = /^L:(.*)$/m.exec(head);
  const meter = mField ? parseMeter(mField[1]) : null;
  const unit = (lField && parseUnit(lField[1])) || defaultUnit(meter);
  const meters: FieldChange<Fraction | null>[] = [{ at: 0, value: meter }];
  const units: FieldChange<Fraction>[] = [{ at: 0, value: unit }];
  const body = /^([ML]):(.*)$|\[([ML]):([^\]]*)\]/gm;
  body.lastIndex = headerEnd;
  // Most tunes change neither in the body: two plain searches spare the pattern's scan.
  const changes = abc.indexOf("M:", headerEnd) >= 0 || abc.indexOf("L:", headerEnd) >= 0;
  for (let m = changes ? body.exec(abc) : null; m; m = body.exec(abc)) {
    const field = m[1] ?? m[3];
    const value = m[2] ?? m[4] ?? "";
    if (field === "M") meters.push({ at: m.index, value: parseMeter(value) });
    else {
      const u = parseUnit(value);
      if (u) units.push({ at: m.index, value: u });
    }
  }
  const title = /^T:(.*)$/m.exec(head)?.[1]?.trim() ?? "";
  return { headerEnd, meter, unit, meters, units, title };
}

/** The value in force at `offset` (changes are in text order). */
export function valueAt<T>(changes: FieldChange<T>[], offset: number): T {
  let v = changes[0].value;
  for (const c of changes) {
    if (c.at > offset) break;
    v = c.value;
  }
  return v;
}

/** Beat length: compound meters (6/8, 9/8, 12/8 …) beat in dotted quarters; others in 1/den. */
export function beatOf(m: Fraction | null): Fraction {
  if (!m) return frac(1, 4);
  if (m.num % 3 === 0 && m.num > 3 && m.den >= 8) return frac(3, m.den);
  return frac(1, m.den);
}
