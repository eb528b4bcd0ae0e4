// One tune as the editor loads it.
import type { Db } from "@/db/client";
import { coursesUsingTune, stagesOf, type TuneRow } from "@/db/queries/tunes";
import type { TuneView } from "./api-types";
import { storedPlan, storedTurns } from "./schemas";

export async function tuneView(db: Db, tune: TuneRow): Promise<TuneView> {
  const [stages, courses] = await Promise.all([stagesOf(db, tune.id), coursesUsingTune(db, tune.id)]);
  return {
    id: tune.id,
    title: tune.title,
    tuneType: tune.tuneType,
    key: tune.key,
    meter: tune.meter,
    abc: tune.abc,
    stagePlan: storedPlan(tune.stagePlan),
    acceptedSwaps: tune.acceptedSwaps,
    turnedBars: storedTurns(tune.turnedBars),
    updatedAt: tune.updatedAt.toISOString(),
    stages: stages.map((s) => ({
      index: s.index,
      name: s.name,
      kinds: s.kinds,
      abc: s.abc,
      handEdited: s.handEdited,
      sourceChanged: s.sourceChanged,
    })),
    courses,
  };
}
