// Exact fractions for note times: floating-point sums of 1/3s and 1/16s drift, and the engine's
// invariants ("every bar keeps its exact length") need equality, not closeness.
import type { Fraction } from "./types";

function gcd(a: number, b: number): number {
  a = Math.abs(a);
  b = Math.abs(b);
  while (b) {
    const r = a % b;
    a = b;
    b = r;
  }
  return a || 1;
}

// Plain loops and no destructuring: fractions are made for every note of every analysis.
export function frac(num: number, den = 1): Fraction {
  if (den === 1) return { num, den: 1 };
  if (den === 0) throw new RangeError("fraction with zero denominator");
  if (den < 0) {
    num = -num;
    den = -den;
  }
  const g = gcd(num, den);
  return g === 1 ? { num, den } : { num: num / g, den: den / g };
}

export const ZERO: Fraction = { num: 0, den: 1 };
const ONE: Fraction = { num: 1, den: 1 };
export const add = (a: Fraction, b: Fraction): Fraction =>
  a.den === b.den ? frac(a.num + b.num, a.den) : frac(a.num * b.den + b.num * a.den, a.den * b.den);
export const sub = (a: Fraction, b: Fraction): Fraction => frac(a.num * b.den - b.num * a.den, a.den * b.den);
export const mul = (a: Fraction, b: Fraction): Fraction => frac(a.num * b.num, a.den * b.den);
export const div = (a: Fraction, b: Fraction): Fraction => frac(a.num * b.den, a.den * b.num);
export const cmp = (a: Fraction, b: Fraction): number => a.num * b.den - b.num * a.den;
export const eq = (a: Fraction, b: Fraction): boolean => cmp(a, b) === 0;
export const lt = (a: Fraction, b: Fraction): boolean => cmp(a, b) < 0;
export const toNumber = (a: Fraction): number => a.num / a.den;
export const toString = (a: Fraction): string => (a.den === 1 ? `${a.num}` : `${a.num}/${a.den}`);
export const isInteger = (a: Fraction): boolean => a.den === 1;
export function sum(xs: readonly Fraction[]): Fraction {
  let total = ZERO;
  for (const x of xs) total = add(total, x);
  return total;
}

/**
 * abcjs reports durations as floats (1/3 of an eighth is 0.041666…); recover the exact fraction
 * by continued fractions, which find the simplest fraction within rounding error.
 */
const FROM_NUMBER = new Map<number, Fraction>();
// Runs of notes share a length: the last answer is checked before the map.
let lastX = NaN;
let lastF: Fraction = ZERO;
export function fromNumber(x: number): Fraction {
  if (x === lastX) return lastF;
  let f = FROM_NUMBER.get(x);
  if (!f) {
    f = continued(x, 100000);
    if (FROM_NUMBER.size < 10000) FROM_NUMBER.set(x, f);
  }
  lastX = x;
  lastF = f;
  return f;
}

function continued(x: number, maxDen: number): Fraction {
  if (!Number.isFinite(x)) return ZERO;
  const sign = x < 0 ? -1 : 1;
  let v = Math.abs(x);
  let [h0, h1, k0, k1] = [0, 1, 1, 0];
  for (let i = 0; i < 40; i++) {
    const a = Math.floor(v);
    const h2 = a * h1 + h0;
    const k2 = a * k1 + k0;
    if (k2 > maxDen) break;
    [h0, h1, k0, k1] = [h1, h2, k1, k2];
    const rest = v - a;
    if (Math.abs(Math.abs(x) - h1 / k1) < 1e-9 || rest < 1e-12) break;
    v = 1 / rest;
  }
  return frac(sign * h1, k1);
}

/** A length as ABC writes it after a note, relative to the unit note length: 1 → "", 1/2 → "/". */
export function abcLength(f: Fraction): string {
  if (f.num === 1 && f.den === 1) return "";
  if (f.den === 1) return `${f.num}`;
  if (f.num === 1 && f.den === 2) return "/";
  return `${f.num === 1 ? "" : f.num}/${f.den}`;
}

/**
 * Parse an ABC length suffix ("", "2", "/", "//", "3/2", "/4", "3/") into a multiple of L (§4.3);
 * null for a length of nothing ("0", "/0"), which no note can have.
 */
const LENGTHS = new Map<string, Fraction | null>();
export function parseAbcLength(s: string): Fraction | null {
  if (s === "") return ONE;
  let f = LENGTHS.get(s);
  if (f === undefined) {
    f = readAbcLength(s);
    // Tunes use a handful of length suffixes; the bound only guards against odd input.
    if (LENGTHS.size < 1000) LENGTHS.set(s, f);
  }
  return f;
}

// A shift, not 2 ** k: ** yields a number V8 keeps as a float even when whole, and one such value
// stored in a fraction makes V8 box both fields of every fraction made after it.
const pow2 = (k: number): number => (k < 30 ? 1 << k : 2 ** k);

function readAbcLength(s: string): Fraction | null {
  const m = /^(\d*)(\/*)(\d*)$/.exec(s);
  if (!m) return frac(1);
  const num = m[1] ? Number(m[1]) : 1;
  const slashes = m[2].length;
  const den = slashes === 0 ? 1 : m[3] ? Number(m[3]) * pow2(slashes - 1) : pow2(slashes);
  return num > 0 && den > 0 && Number.isFinite(num) && Number.isFinite(den) ? frac(num, den) : null;
}
