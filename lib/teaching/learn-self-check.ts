// The student's self-check after a check-in: the listening aid's hearing of their latest recording,
// with that stage's music and the recording to play from any bar. An aid; the teacher's word counts.
import type { Tx as Db } from "@/db/queries/auth";
import type { checkInsOfStages } from "@/db/queries/learning";
import { listeningsOf } from "@/db/queries/listening";
import { listeningView, type ListeningView } from "@/lib/listen/view";
import type { CheckInStatus } from "./state-machine";
import type { AssignmentStage } from "./teach-stages";

export type SelfCheck = {
  checkInId: string;
  checkInStatus: CheckInStatus;
  createdAt: string;
  stageIndex: number;
  stageName: string;
  abc: string;
  uploadId: string;
  listening: ListeningView | null;
};

type CheckInRow = Awaited<ReturnType<typeof checkInsOfStages>>[number];

/** The newest check-in with a recording (not withdrawn), heard or still being heard; null when none. */
export async function selfCheckOf(
  db: Db,
  checks: CheckInRow[], // newest first
  stageIndexOf: (stageStateId: string) => number | undefined,
  planned: AssignmentStage[],
): Promise<SelfCheck | null> {
  const latest = checks.find((c) => c.uploadId !== null && c.status !== "withdrawn");
  const stageIndex = latest ? stageIndexOf(latest.stageStateId) : undefined;
  const stage = planned.find((p) => p.index === stageIndex);
  if (!latest?.uploadId || !stage) return null;
  const [row] = await listeningsOf(db, [latest.id]);
  return {
    checkInId: latest.id,
    checkInStatus: latest.status,
    createdAt: latest.createdAt.toISOString(),
    stageIndex: stage.index,
    stageName: stage.name,
    abc: stage.abc,
    uploadId: latest.uploadId,
    listening: listeningView(true, row),
  };
}
