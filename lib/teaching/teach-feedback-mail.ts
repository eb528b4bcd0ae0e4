// The "checkin-feedback" e-mail of a review or a comment (dedupe key checkin-feedback:<checkInId>),
// queued inside the transition's transaction so it exists exactly when the review does.
import { eq } from "drizzle-orm";
import type { Tx } from "@/db/queries/auth";
import { mailPeople, type LockedStage } from "@/db/queries/teaching";
import { checkIns, courses, enrolments, enrolmentTunes } from "@/db/schema";
import { appLink } from "@/lib/auth/links";
import { enqueueEmail } from "@/lib/mail/outbox";
import { assignmentStages } from "./teach-stages";

/** One note per check-in: a review's, or a comment on a check-in that needed no review. */
export const feedbackKey = (checkInId: string) => `checkin-feedback:${checkInId}`;

type Place = Pick<LockedStage, "studentId" | "teacherId" | "tuneId" | "stagePlan" | "stageIndex"> & {
  assignmentStudentId: string | null;
  enrolmentTuneId: string | null;
};

async function courseTitleOf(tx: Tx, enrolmentTuneId: string): Promise<string | null> {
  const [row] = await tx
    .select({ title: courses.title })
    .from(enrolmentTunes)
    .innerJoin(enrolments, eq(enrolments.id, enrolmentTunes.enrolmentId))
    .innerJoin(courses, eq(courses.id, enrolments.courseId))
    .where(eq(enrolmentTunes.id, enrolmentTuneId));
  return row?.title ?? null;
}

export async function mailFeedback(
  tx: Tx,
  stage: Place,
  checkInId: string,
  feedback: string,
  outcome: "signed_off" | "needs_more_time" | "comment",
  openedStage: number | null,
  o: { sendAfter?: Date } = {},
) {
  const people = await mailPeople(tx, stage.studentId, stage.teacherId, stage.tuneId);
  if (!people.student) return;
  const stages = await assignmentStages(tx, stage.tuneId, stage.stagePlan);
  const nameOf = (i: number) => stages.find((s) => s.index === i)?.name ?? `Stage ${i}`;
  const [checkIn] = await tx.select({ uploadId: checkIns.uploadId }).from(checkIns).where(eq(checkIns.id, checkInId));
  const courseTitle = stage.enrolmentTuneId ? await courseTitleOf(tx, stage.enrolmentTuneId) : null;
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
      assignmentUrl: stage.assignmentStudentId
        ? appLink(`/learn/assignments/${stage.assignmentStudentId}`)
        : appLink(`/learn/tunes/${stage.tuneId}`),
      courseTitle,
      recorded: Boolean(checkIn?.uploadId),
    },
    dedupeKey: feedbackKey(checkInId),
    sendAfter: o.sendAfter,
  });
}
