// The stages of an assignment (shared design): the tune's own stages, or — when the teacher changed
// the plan for this assignment — the tune engine's stages for that plan. Count and names come from here.
import { asc, eq } from "drizzle-orm";
import type { Tx } from "@/db/queries/auth";
import { tunes, tuneStages, type StagePlanJson } from "@/db/schema";
import { checkTune } from "@/lib/tunes/check";
import { storedPlan, storedTurns } from "@/lib/tunes/schemas";

export type AssignmentStage = { index: number; name: string; abc: string };

/** Stages from a changed plan; null when the tune does not read cleanly with it (the plan is then refused). */
export function stagesForPlan(
  tune: { abc: string; acceptedSwaps: string[]; turnedBars: unknown },
  plan: StagePlanJson,
): AssignmentStage[] | null {
  const parsedPlan = storedPlan(plan);
  if (!parsedPlan) return null;
  const check = checkTune(tune.abc, {
    stagePlan: parsedPlan,
    acceptedSwaps: tune.acceptedSwaps,
    turnedBars: storedTurns(tune.turnedBars),
  });
  if (!check.ok) return null;
  return check.value.stages.map((s) => ({
    index: s.index,
    name: s.name,
    abc: s.abc,
  }));
}

export async function assignmentStages(db: Tx, tuneId: string, plan: StagePlanJson | null): Promise<AssignmentStage[]> {
  if (plan) {
    const [tune] = await db
      .select({ abc: tunes.abc, acceptedSwaps: tunes.acceptedSwaps, turnedBars: tunes.turnedBars })
      .from(tunes)
      .where(eq(tunes.id, tuneId));
    const stages = tune ? stagesForPlan(tune, plan) : null;
    // The plan was checked against this tune when saved; if the tune changed since, fall back to its own stages.
    if (stages) return stages;
  }
  const rows = await db
    .select({
      index: tuneStages.index,
      name: tuneStages.name,
      abc: tuneStages.abc,
    })
    .from(tuneStages)
    .where(eq(tuneStages.tuneId, tuneId))
    .orderBy(asc(tuneStages.index));
  return rows;
}
