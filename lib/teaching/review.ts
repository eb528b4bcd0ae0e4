// The teacher's review queue (issue 6 item 4): check-ins waiting on the teacher's own assignments,
// oldest first, and the review itself through the state machine (transitions.ts).
import type { Tx } from "@/db/queries/auth";
import { countWaiting, findCheckIn, waitingForReview } from "@/db/queries/teaching-review";
import { listeningsOf } from "@/db/queries/listening";
import { listeningView } from "@/lib/listen/view";
import type { StagePlanJson } from "@/db/schema";
import { notFound } from "@/lib/auth/errors";
import type { Manager } from "./assignments";
import type { ReviewItem } from "./teach-api-types";
import { assignmentStages, type AssignmentStage } from "./teach-stages";
import { applyTransition, type ApplyResult } from "./transitions";

/** How many check-ins the queue shows at once: it is worked oldest first, and each review brings the next. */
export const REVIEW_BATCH = 20;

/** The oldest REVIEW_BATCH check-ins waiting, and how many wait in all. */
export async function reviewQueue(db: Tx, me: Manager): Promise<{ checkIns: ReviewItem[]; waiting: number }> {
  const teacherId = me.role === "admin" ? null : me.id;
  const [rows, waiting] = await Promise.all([
    waitingForReview(db, teacherId, REVIEW_BATCH),
    countWaiting(db, teacherId),
  ]);
  // Stages are worked out once per assignment: several students' check-ins often share one.
  const stagesOf = new Map<string, Promise<AssignmentStage[]>>();
  const stages = (assignmentId: string | null, tuneId: string, plan: StagePlanJson | null) => {
    const key = assignmentId ?? `tune:${tuneId}`; // a course's stage: the tune's own stages
    if (!stagesOf.has(key)) stagesOf.set(key, assignmentStages(db, tuneId, plan));
    return stagesOf.get(key) as Promise<AssignmentStage[]>;
  };
  const heard = new Map(
    (
      await listeningsOf(
        db,
        rows.map((r) => r.checkInId),
      )
    ).map((l) => [l.checkInId, l]),
  );
  const out: ReviewItem[] = [];
  for (const r of rows) {
    const all = await stages(r.assignmentId, r.tuneId, r.stagePlan);
    const stage = all.find((s) => s.index === r.stageIndex);
    out.push({
      checkInId: r.checkInId,
      createdAt: r.createdAt.toISOString(),
      student: { id: r.studentId, name: r.studentName },
      tune: { id: r.tuneId, title: r.tuneTitle },
      assignmentId: r.assignmentId,
      courseTitle: r.courseTitle,
      stage: {
        index: r.stageIndex,
        name: stage?.name ?? `Stage ${r.stageIndex}`,
        abc: stage?.abc ?? "",
        count: all.length,
      },
      selfRating: r.selfRating,
      fromMemory: r.fromMemory,
      uploadId: r.uploadId,
      listening: listeningView(r.uploadId !== null, heard.get(r.checkInId)),
    });
  }
  return { checkIns: out, waiting };
}

/** Takes back a "needs more time" within its minutes: the check-in waits in the queue again, its note unsent. */
export async function undoReview(db: Tx, me: Manager, checkInId: string, now: Date): Promise<ApplyResult> {
  const checkIn = await findCheckIn(db, checkInId);
  if (!checkIn) throw notFound("We couldn't find that check-in.");
  return applyTransition(db, {
    stageStateId: checkIn.stageStateId,
    transition: "undoNeedsMoreTime",
    actor: me,
    checkInId: checkIn.id,
    now,
  });
}

export async function reviewCheckIn(
  db: Tx,
  me: Manager,
  input: {
    checkInId: string;
    outcome: "signed_off" | "needs_more_time";
    feedback: string;
  },
  now: Date,
): Promise<ApplyResult> {
  const checkIn = await findCheckIn(db, input.checkInId);
  if (!checkIn) throw notFound("We couldn't find that check-in.");
  return applyTransition(db, {
    stageStateId: checkIn.stageStateId,
    transition: input.outcome === "signed_off" ? "signOff" : "needsMoreTime",
    actor: me,
    feedback: input.feedback,
    checkInId: checkIn.id,
    now,
  });
}
