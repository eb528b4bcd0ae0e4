// Heard notes aligned to the written ones by dynamic programming: an edit alignment (each heard note
// matches a written one, right or wrong, or is extra; a written note may be missed) in which the
// position in the music may also jump — freely where the music itself repeats or skips a first
// ending, and at a price anywhere else (a stop and restart, a bar played twice). This is the
// "JumpDTW" idea of C. Fremerey, M. Müller and M. Clausen, "Handling Repeats and Jumps in
// Score-Performance Synchronization" (ISMIR 2010), on notes rather than on frames. Timing plays no
// part in the match, so a slow, drifting or late-starting performance aligns as well as a steady one.
import type { HeardNote } from "./notes";
import type { Score } from "./expected";

export type Step =
  | { kind: "match"; heard: number; note: number } // right or wrong pitch: `off` says which
  | { kind: "miss"; note: number }
  | { kind: "extra"; heard: number; position: number }
  | { kind: "jump"; from: number; to: number; heard: number; free: boolean };

// Scores of one step (the path with the highest total wins).
const RIGHT = 1;
const WRONG = -0.5; // less than a missed note plus an extra one: a wrong note is one fault, not two
const MISS = -1;
const EXTRA = -1;
const AROUND = -0.3; // a sound before the music starts or after it ends (tuning, a breath)
// A jump anywhere costs about six missed notes; after a pause it is what a restart looks like.
const JUMP = -6;
const JUMP_AFTER_PAUSE = -2.5;
export const PAUSE_SECONDS = 0.6;

/** Semitones from the written pitch to the nearest equal-tempered note heard. */
export const semitonesOff = (heardMidi: number, writtenMidi: number): number => Math.round(heardMidi) - writtenMidi;

function matchScore(heardMidi: number, writtenMidi: number): number {
  const off = semitonesOff(heardMidi, writtenMidi);
  if (off === 0) return RIGHT;
  return WRONG - 0.02 * Math.min(Math.abs(off), 12);
}

// Back-pointer kinds.
const FROM_MATCH = 1;
const FROM_EXTRA = 2;
const FROM_MISS = 3;
const FROM_FREE = 4;
const FROM_JUMP = 5;

export function align(heard: HeardNote[], score: Score): Step[] {
  const N = heard.length;
  const M = score.notes.length;
  const W = M + 1;
  const value = new Float64Array((N + 1) * W).fill(-Infinity);
  const kind = new Uint8Array((N + 1) * W);
  const from = new Int32Array((N + 1) * W);
  const written = score.notes.map((n) => n.midi);

  const relax = (at: number, v: number, k: number, src: number) => {
    if (v > value[at]) {
      value[at] = v;
      kind[at] = k;
      from[at] = src;
    }
  };
  const misses = (row: number) => {
    for (let p = 1; p <= M; p++) relax(row + p, value[row + p - 1] + MISS, FROM_MISS, p - 1);
  };
  const moves = (i: number) => {
    const row = i * W;
    for (let pass = 0; pass < 2; pass++) {
      misses(row);
      for (const j of score.jumps) relax(row + j.to, value[row + j.from], FROM_FREE, j.from);
    }
    misses(row);
    let best = 0;
    for (let p = 1; p <= M; p++) if (value[row + p] > value[row + best]) best = p;
    const paused = i === 0 || (i < N && heard[i].start - heard[i - 1].end >= PAUSE_SECONDS);
    const cost = i === 0 ? JUMP : paused ? JUMP_AFTER_PAUSE : JUMP;
    const top = value[row + best] + cost;
    for (let p = 0; p <= M; p++) if (p !== best) relax(row + p, top, FROM_JUMP, best);
  };

  value[0] = 0;
  moves(0);
  for (let i = 1; i <= N; i++) {
    const row = i * W;
    const prev = (i - 1) * W;
    const h = heard[i - 1].midi;
    for (let p = 0; p <= M; p++) {
      const around = p === 0 || p === M ? AROUND : EXTRA;
      relax(row + p, value[prev + p] + around, FROM_EXTRA, p);
      if (p > 0) relax(row + p, value[prev + p - 1] + matchScore(h, written[p - 1]), FROM_MATCH, p - 1);
    }
    moves(i);
  }

  let end = 0;
  // on a tie the furthest position: a free jump back at the very end is not a place the music stopped
  for (let p = 1; p <= M; p++) if (value[N * W + p] >= value[N * W + end]) end = p;
  const steps: Step[] = [];
  let i = N;
  let p = end;
  while (i > 0 || kind[i * W + p] !== 0) {
    const at = i * W + p;
    const k = kind[at];
    const src = from[at];
    if (k === FROM_MATCH) {
      steps.push({ kind: "match", heard: i - 1, note: src });
      i--;
    } else if (k === FROM_EXTRA) {
      steps.push({ kind: "extra", heard: i - 1, position: p });
      i--;
    } else if (k === FROM_MISS) steps.push({ kind: "miss", note: src });
    else if (k === FROM_FREE || k === FROM_JUMP)
      steps.push({ kind: "jump", from: src, to: p, heard: i, free: k === FROM_FREE });
    else break;
    p = src;
  }
  return steps.reverse();
}
