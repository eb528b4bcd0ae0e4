// Tempo from the aligned notes: beats of the music against seconds of the recording, bar by bar, as
// the slope of a least-squares line through the onsets heard in the bar and the first of the next.

import type { TempoPoint, TempoReport } from "./types";

export interface TimedVisit {
  bar: number;
  pass: number; // which time through the music this bar was (its index among the bar passes)
  beat: number; // beats into the performance (repeats and restarts counted as played)
  at: number | null; // onset heard, null for a missed note
  segment: number; // a restart begins a new segment: beats do not run on across it
}

/** Beats per minute through points (seconds, beats); null when they span too little to say. */
export function slopeBpm(points: { at: number; beat: number }[]): number | null {
  if (points.length < 2) return null;
  const n = points.length;
  let st = 0;
  let sb = 0;
  for (const p of points) {
    st += p.at;
    sb += p.beat;
  }
  const mt = st / n;
  const mb = sb / n;
  let num = 0;
  let den = 0;
  for (const p of points) {
    num += (p.at - mt) * (p.beat - mb);
    den += (p.at - mt) * (p.at - mt);
  }
  const spanBeats = points[n - 1].beat - points[0].beat;
  if (den <= 0 || spanBeats < 1) return null;
  const bpm = (60 * num) / den;
  return bpm > 0 ? bpm : null;
}

// Bar-by-bar tempo spread (coefficient of variation) that reads as steady or a little uneven:
// Rosinwood's own thresholds, not a published standard.
const STEADY = 4;
const A_LITTLE = 8;

const round1 = (x: number) => Math.round(x * 10) / 10;

/** Points of a run of passes: the onsets in them and the first onset after them in the same segment. */
function pointsOf(visits: TimedVisit[], passes: Set<number>): { at: number; beat: number }[] {
  const points: { at: number; beat: number }[] = [];
  let lastIn = -1;
  visits.forEach((v, i) => {
    if (passes.has(v.pass) && v.at !== null) {
      points.push({ at: v.at, beat: v.beat });
      lastIn = i;
    }
  });
  if (lastIn >= 0) {
    const seg = visits[lastIn].segment;
    const next = visits.slice(lastIn + 1).find((v) => v.at !== null && v.segment === seg && !passes.has(v.pass));
    if (next?.at != null) points.push({ at: next.at, beat: next.beat });
  }
  return points;
}

export function tempoOf(
  visits: TimedVisit[],
  beatName: string,
  barBeats: (bar: number) => number,
  expected: number | null,
): TempoReport {
  const passIds = [...new Set(visits.map((v) => v.pass))];
  const overTime: TempoPoint[] = [];
  for (const pass of passIds) {
    const inPass = visits.filter((v) => v.pass === pass);
    const first = inPass.find((v) => v.at !== null);
    if (!first || barBeats(first.bar) < 1) continue;
    const bpm = slopeBpm(pointsOf(visits, new Set([pass])));
    if (bpm !== null) overTime.push({ at: round1(first.at ?? 0), bpm: round1(bpm), bar: first.bar });
  }
  // The opening and the closing: two bars (at least four beats) of the playing, within one segment.
  const edge = (order: number[]): number | null => {
    const chosen = new Set<number>();
    let beats = 0;
    let segment: number | null = null;
    for (const pass of order) {
      const v = visits.find((x) => x.pass === pass && x.at !== null);
      if (!v) continue;
      if (segment !== null && v.segment !== segment) break;
      segment = v.segment;
      chosen.add(pass);
      beats += barBeats(v.bar);
      if (chosen.size >= 2 && beats >= 4) break;
    }
    const bpm = slopeBpm(pointsOf(visits, chosen));
    return bpm === null ? null : round1(bpm);
  };
  const start = edge(passIds);
  const end = edge([...passIds].reverse());
  const values = overTime.map((p) => p.bpm);
  let spreadPercent: number | null = null;
  if (values.length >= 3) {
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    const sd = Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / (values.length - 1));
    spreadPercent = round1((100 * sd) / mean);
  }
  const steadiness =
    spreadPercent === null
      ? null
      : spreadPercent <= STEADY
        ? "steady"
        : spreadPercent <= A_LITTLE
          ? "a little uneven"
          : "uneven";
  return {
    start,
    end,
    expected: expected === null ? null : round1(expected),
    beat: beatName,
    overTime,
    spreadPercent,
    steadiness,
  };
}
