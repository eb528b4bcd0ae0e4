// The listening aid's findings against the truth of a rendering: which wrong and missed notes it found
// (precision and recall), what it measured on the notes played sharp or flat, and its tempo.
import { readFileSync } from "node:fs";
import path from "node:path";
import { analyze } from "@/lib/abc";
import { listen, type ListenResult } from "@/lib/listen";
import { pitchName } from "@/lib/listen/expected";
import type { Performance } from "@/lib/listen/perform";
import { renderPerformance, type RecordingOptions } from "@/lib/listen/recording";

export function stageOf(file: string, stage = 1): string {
  const a = analyze(readFileSync(path.join("db/seed-data/tunes", file), "utf8"));
  if (!a.ok) throw new Error(`${file}: ${a.problems.map((p) => p.message).join("; ")}`);
  const s = a.value.stages.find((x) => x.index === stage);
  if (!s) throw new Error(`${file} has no stage ${stage}`);
  return s.abc;
}

export async function hear(abc: string, opts: RecordingOptions): Promise<{ perf: Performance; result: ListenResult }> {
  const r = await renderPerformance(abc, opts);
  return { perf: r.performance, result: listen(abc, { samples: r.samples, sampleRate: r.sampleRate }) };
}

export interface Tally {
  found: number; // reported and true
  reported: number;
  truth: number;
}
export const tally = (): Tally => ({ found: 0, reported: 0, truth: 0 });
export const precision = (t: Tally) => (t.reported ? t.found / t.reported : 1);
export const recall = (t: Tally) => (t.truth ? t.found / t.truth : 1);

// A finding is the truth's when it names the same written note in the same bar within this time.
const NEAR_SECONDS = 0.4;

type Finding = { bar: number; expected: string; heard: string | null; at: number | null; cents: number | null };

function findings(result: ListenResult): Finding[] {
  return result.bars.flatMap((b) => b.notes.map((n) => ({ bar: b.bar, ...n })));
}

/** Adds one rendering's wrong and missed notes to the tallies; returns the cents heard on each detuned note. */
export function score(
  perf: Performance,
  result: ListenResult,
  wrong: Tally,
  missed: Tally,
  extra: Tally,
): { injected: number; heard: number | null }[] {
  const flats = perf.score.notes.some((n) => n.name.includes("b"));
  const all = findings(result);
  const reportedWrong = all.filter((f) => f.heard !== null && f.heard !== f.expected);
  const reportedMissed = all.filter((f) => f.heard === null && f.at !== null);
  const near = (f: Finding, bar: number, expected: string, at: number) =>
    f.bar === bar && f.expected === expected && f.at !== null && Math.abs(f.at - at) < NEAR_SECONDS;
  const match = (
    reported: Finding[],
    truth: { bar: number; expected: string; at: number; heard?: string }[],
    t: Tally,
  ) => {
    const used = new Set<Finding>();
    t.reported += reported.length;
    t.truth += truth.length;
    for (const x of truth) {
      const f = reported.find(
        (r) => !used.has(r) && near(r, x.bar, x.expected, x.at) && (!x.heard || r.heard === x.heard),
      );
      if (f) {
        used.add(f);
        t.found++;
      }
    }
  };
  const name = (k: number) => perf.score.notes[k].name;
  match(
    reportedWrong,
    perf.truth
      .filter((x) => x.played === "wrong")
      .map((x) => ({ bar: x.bar, expected: name(x.note), at: x.at, heard: pitchName(x.midi as number, flats) })),
    wrong,
  );
  match(
    reportedMissed,
    perf.truth.filter((x) => x.played === "missed").map((x) => ({ bar: x.bar, expected: name(x.note), at: x.at })),
    missed,
  );
  extra.reported += result.extra.filter((e) => e.bar !== null).length;
  extra.truth += perf.extras.length;
  for (const x of perf.extras) if (result.extra.some((e) => Math.abs(e.at - x.at) < 0.1)) extra.found++;
  return perf.truth
    .filter((x) => x.played === "detuned")
    .map((x) => {
      const f = all.find((r) => near(r, x.bar, name(x.note), x.at) && r.heard === r.expected);
      return { injected: x.cents, heard: f?.cents ?? null };
    });
}
