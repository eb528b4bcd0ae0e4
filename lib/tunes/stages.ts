// Hand-editing one stage and rebuilding it from the source (PRODUCT.md §4.4).
import type { Db } from "@/db/client";
import { putStage, stagesOf, updateStage, type TuneRow } from "@/db/queries/tunes";
import { analyze } from "@/lib/abc/analyze";
import type { Problem } from "@/lib/abc/types";
import { notFound, unprocessable } from "@/lib/auth/errors";
import { checkTune, sortProblems } from "./check";
import { storedPlan, storedTurns } from "./schemas";

export type StageOutcome = { ok: true } | { ok: false; problems: Problem[] };

async function stageCount(db: Db, tuneId: string, index: number): Promise<number> {
  const count = (await stagesOf(db, tuneId)).length;
  if (index > count) throw notFound(`This tune has ${count} stages, so there is no stage ${index}.`);
  return count;
}

/** Kept exactly as written, as long as its music reads as written; the flag from an earlier source change is cleared. */
export async function editStage(db: Db, tune: TuneRow, index: number, rawAbc: string): Promise<StageOutcome> {
  const count = await stageCount(db, tune.id, index);
  if (index === count) throw unprocessable("The last stage is the full setting itself: change the tune's ABC instead.");
  const abc = rawAbc.replace(/\r\n?/g, "\n");
  const result = analyze(abc);
  if (!result.ok) return { ok: false, problems: sortProblems(result.problems) };
  await updateStage(db, tune.id, index, { abc, handEdited: true, sourceChanged: false });
  return { ok: true };
}

/** Drops the hand edit: the stage is made again from the tune's source and plan. */
export async function rebuildStage(db: Db, tune: TuneRow, index: number): Promise<void> {
  await stageCount(db, tune.id, index);
  const check = checkTune(tune.abc, {
    stagePlan: storedPlan(tune.stagePlan),
    turnedBars: storedTurns(tune.turnedBars),
  });
  // A stored tune passed this check when it was saved; the engine changing under it is our fault.
  if (!check.ok) throw new Error(`stored tune ${tune.id} no longer reads cleanly`);
  const stage = check.value.stages[index - 1];
  if (!stage) throw notFound(`There is no stage ${index} in this tune's plan.`);
  await putStage(db, tune.id, stage);
}
