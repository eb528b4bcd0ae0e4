// Benchmark of the tune engine over the open corpus. Prints the median time of each step, the
// corpus total, the median over tunes of (full analysis / one abcjs parse), then how analysis time
// grows with a tune's length (bench-abc-scaling.ts) and the slowest of the fuzz test's inputs.
import { readdirSync, readFileSync } from "node:fs";
import { performance } from "node:perf_hooks";
import abcjs from "abcjs";
import { analyze, classify, buildStages, phraseMap, prepareTune, splitTunes, twinSwap } from "../lib/abc/index";
import { pickStops } from "../lib/abc/double-stops";
import { shapeOf, skeletonFrom } from "../lib/abc/skeleton";
import { benchScaling } from "./bench-abc-scaling";

const ROOT = "../shared/datasets/nottingham/ABC_cleaned";
const REPS = 3; // best of three per tune for each step: a stray GC pause is not the engine's cost
// The ratio is timed apart from the steps, with more care, since the machine is shared: each
// tune gets ROUNDS rounds of one parse and one full analysis, the order alternating from round
// to round, so that load from other processes and the state of caches fall on both sides
// alike; each side keeps its best time and the tune's ratio is best analysis / best parse.
const ROUNDS = 7;

const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};
const best = (f: () => void): number => {
  let t = Infinity;
  for (let i = 0; i < REPS; i++) {
    const t0 = performance.now();
    f();
    t = Math.min(t, performance.now() - t0);
  }
  return t;
};

const tunes = readdirSync(ROOT)
  .sort()
  .flatMap((f) => splitTunes(readFileSync(`${ROOT}/${f}`, "utf8")).map((t) => t.abc));
const steps: Record<string, number[]> = {
  parse: [],
  model: [],
  classify: [],
  doubleStops: [],
  stages: [],
  skeleton: [],
  phrases: [],
  swap: [],
  analysis: [],
};
const ratios: number[] = [];
const backToBack: number[] = []; // the earlier way: best of REPS parses, then best of REPS analyses
let failed = 0;

for (const abc of tunes) analyze(abc); // warm-up: let the JIT see every path first
for (const abc of tunes) abcjs.parseOnly(abc);

const time = (f: () => unknown): number => {
  const t0 = performance.now();
  f();
  return performance.now() - t0;
};
/** Best parse and best analysis of one tune, timed in alternating order. */
function paired(abc: string): { parse: number; full: number } {
  let parse = Infinity;
  let full = Infinity;
  for (let r = 0; r < ROUNDS; r++) {
    if (r % 2 === 0)
      parse = Math.min(
        parse,
        time(() => abcjs.parseOnly(abc)),
      );
    full = Math.min(
      full,
      time(() => analyze(abc)),
    );
    if (r % 2 === 1)
      parse = Math.min(
        parse,
        time(() => abcjs.parseOnly(abc)),
      );
  }
  return { parse, full };
}

const corpus0 = performance.now();
for (const abc of tunes) {
  const { parse, full } = paired(abc);
  const p = prepareTune(abc);
  if (!p.ok) {
    failed++;
    continue;
  }
  const picks = pickStops(p.value.model);
  const sk = skeletonFrom(p.value, picks);
  const map = phraseMap(sk.bars, sk.meter, sk.unit);
  steps.parse.push(parse);
  steps.model.push(best(() => prepareTune(abc)));
  steps.classify.push(best(() => classify(p.value)));
  steps.doubleStops.push(best(() => pickStops(p.value.model)));
  steps.stages.push(best(() => buildStages(p.value, undefined, picks)));
  steps.skeleton.push(best(() => skeletonFrom(p.value, picks)));
  steps.phrases.push(best(() => phraseMap(sk.bars, sk.meter, sk.unit)));
  const source = shapeOf(p.value, null, picks);
  steps.swap.push(
    best(() => {
      // the analysis swaps both the setting and its skeleton
      twinSwap(source.abc, source.bars, map);
      twinSwap(sk.abc, sk.bars, map);
    }),
  );
  steps.analysis.push(full);
  ratios.push(full / parse);
  const parse3 = best(() => abcjs.parseOnly(abc));
  backToBack.push(best(() => analyze(abc)) / parse3);
}
const corpusMs = performance.now() - corpus0;

console.log(`tunes: ${tunes.length} (${failed} rejected with problems)`);
for (const [step, xs] of Object.entries(steps)) {
  const total = xs.reduce((a, b) => a + b, 0);
  console.log(`${step.padEnd(11)} median ${median(xs).toFixed(3)} ms   corpus total ${total.toFixed(0)} ms`);
}
console.log(`corpus wall time (all measurements): ${(corpusMs / 1000).toFixed(1)} s`);
console.log(`(for comparison, timed back to back instead of alternating: ${median(backToBack).toFixed(2)})`);
console.log(`analysis/parse ratio: ${median(ratios).toFixed(2)}`);
benchScaling();
