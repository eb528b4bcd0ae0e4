// The whole analysis of one tune from one parse (issue 3): embellishments, stages, skeleton,
// phrase map and the twin-swapped learning version.
import { classify } from "./classify";
import type { BarVoices, DoubleStop, StopChoice } from "./double-stops";
import { phraseMapWithParts, type PhraseMap } from "./phrase-map";
import { picksOf, shapeOf, skeletonFrom, type TuneShape } from "./skeleton";
import { buildStages, DEFAULT_PLAN, validatePlan, withoutRepeats } from "./stages";
import { Locator } from "./locate";
import { guard, prepareTune } from "./tune";
import { twinSwap } from "./twin-swap";
import type { Embellishment, Result, Stage, StagePlan } from "./types";

export interface Analysis {
  title: string;
  key: string;
  embellishments: Embellishment[];
  skeleton: TuneShape;
  stages: Stage[];
  phraseMap: PhraseMap;
  /** The full setting with every near twin played exactly like its twin (issue 3 §6). */
  learning: string;
  /** The same for the skeleton. */
  learningSkeleton: string;
  /** The melody's double stops: the note each stage before double stops come back keeps, and why. */
  doubleStops: StopChoice[];
}

export interface AnalyzeOptions {
  /** A teacher's plan, kept as made; without one, the default plan fitted to the tune (withoutRepeats). */
  plan?: StagePlan;
  doubleStop?: DoubleStop;
  /** Bars (melody bar index) a teacher turned to their other voice. */
  turnedBars?: BarVoices;
  lineOffset?: number;
}

export function analyze(abc: string, opts: AnalyzeOptions = {}): Result<Analysis> {
  const lineOffset = opts.lineOffset ?? 0;
  const plan = opts.plan ?? DEFAULT_PLAN;
  const check = validatePlan(plan);
  if (!check.ok)
    return {
      ok: false,
      problems: check.reasons.map((message) => ({ line: 1 + lineOffset, column: 1, message })),
      notes: [],
    };
  const prepared = prepareTune(abc, lineOffset);
  if (!prepared.ok) return prepared;
  const p = prepared.value;
  return guard(new Locator(abc, lineOffset), () => {
    const picks = picksOf(p, opts);
    const skeleton = skeletonFrom(p, picks);
    const { map, partOf } = phraseMapWithParts(skeleton.bars, skeleton.meter, skeleton.unit);
    const source = shapeOf(p, null, picks);
    const stages = buildStages(p, plan, picks, skeleton.abc);
    const value: Analysis = {
      title: skeleton.title,
      key: skeleton.key,
      // the skeleton has one bar for each melody bar, in order
      embellishments: classify(p, (vb) => {
        const b = skeleton.bars[vb.index];
        return b === undefined ? undefined : partOf.get(b);
      }),
      skeleton,
      stages: opts.plan ? stages : withoutRepeats(stages),
      phraseMap: map,
      learning: twinSwap(source.abc, source.bars, map),
      learningSkeleton: twinSwap(skeleton.abc, skeleton.bars, map),
      doubleStops: picks.choices,
    };
    return { ok: true, value, notes: p.notes };
  });
}
