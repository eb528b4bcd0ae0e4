// The "checkin-feedback" e-mail of a review (shared design: dedupe key checkin-feedback:<checkInId>),
// queued inside the transition's transaction so it exists exactly when the review does.
import type { Tx } from "@/db/queries/auth";
import { mailPeople, type LockedStage } from "@/db/queries/teaching";
import { appLink } from "@/lib/auth/links";
import { enqueueEmail } from "@/lib/mail/outbox";
import { assignmentStages } from "./teach-stages";

export async function mailFeedback(
  tx: Tx,
  stage: LockedStage,
  checkInId: string,
  feedback: string,
  outcome: "signed_off" | "needs_more_time",
  openedStage: number | null,
) {
  const people = await mailPeople(tx, stage.studentId, stage.teacherId, stage.tuneId);
  if (!people.student) return;
  const stages = await assignmentStages(tx, stage.tuneId, stage.stagePlan);
  const nameOf = (i: number) => stages.find((s) => s.index === i)?.name ?? `Stage ${i}`;
  await enqueueEmail(tx, {
    to: people.student.email,
    template: "checkin-feedback",
    data: {
      studentName: people.student.name,
      teacherName: people.teacherName,
      tuneTitle: people.tuneTitle,
      stageName: nameOf(stage.stageIndex),
      outcome,
      feedback: feedback,
      nextStageName: openedStage === null ? null : nameOf(openedStage),
      assignmentUrl: appLink(`/learn/assignments/${stage.assignmentStudentId}`),
    },
    dedupeKey: `checkin-feedback:${checkInId}`,
  });
}
