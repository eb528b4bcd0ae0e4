// SQL for the teacher's side of issue 6 and the stage transitions. Who may do what is decided in
// lib/teaching/*; these only read and write rows.
import { and, desc, eq, gte, max, sql, type SQL } from "drizzle-orm";
import type { Tx } from "./auth";
import {
  assignments,
  assignmentStudents,
  checkIns,
  courses,
  emailOutbox,
  enrolments,
  enrolmentTunes,
  practiceLogs,
  stageStates,
  tuneProgress,
  tunes,
  uploads,
  users,
} from "../schema";

/**
 * The stage's assignment row held FOR SHARE before the stage row is locked: an edit that rebuilds
 * the stages (or a withdrawal) holds it FOR UPDATE, so the two take turns, always in this order
 * (assignment, then stage), which keeps them from deadlocking.
 */
export async function shareAssignmentOfStage(tx: Tx, stageStateId: string): Promise<void> {
  await tx
    .select({ id: assignments.id })
    .from(assignments)
    .innerJoin(assignmentStudents, eq(assignmentStudents.assignmentId, assignments.id))
    .innerJoin(stageStates, eq(stageStates.assignmentStudentId, assignmentStudents.id))
    .where(eq(stageStates.id, stageStateId))
    .for("share", { of: assignments });
}

/**
 * The stage row locked for the rest of the transaction, with what the state machine needs to decide.
 * A stage belongs to an assignment (its teacher, plan, rule and status) or to a tune a member climbs
 * on a course (the enrolment's teacher, the tune's own stages, the course's pace, the enrolment's status).
 */
export async function lockStage(tx: Tx, stageStateId: string) {
  const rows = await tx
    .select({
      id: stageStates.id,
      stageIndex: stageStates.stageIndex,
      state: stageStates.state,
      openedAt: stageStates.openedAt,
      assignmentStudentId: stageStates.assignmentStudentId,
      enrolmentTuneId: stageStates.enrolmentTuneId,
      studentId: sql<string>`coalesce(${assignmentStudents.studentId}, ${enrolments.userId})`,
      assignmentId: assignments.id,
      teacherId: sql<string>`coalesce(${assignments.teacherId}, ${enrolments.teacherId})`,
      tuneId: sql<string>`coalesce(${assignments.tuneId}, ${enrolmentTunes.tuneId})`,
      stagePlan: assignments.stagePlan,
      status: sql<"active" | "withdrawn">`case
        when ${assignments.id} is not null then ${assignments.status}::text
        when ${enrolments.status} = 'active' then 'active' else 'withdrawn' end`,
      unlockRule: sql<
        "teacher_sign_off" | "self_check_in" | "self_paced"
      >`coalesce(${assignments.unlockRule}::text, ${courses.pace}::text)`,
      unlockMinutes: assignments.unlockMinutes,
    })
    .from(stageStates)
    .leftJoin(assignmentStudents, eq(assignmentStudents.id, stageStates.assignmentStudentId))
    .leftJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .leftJoin(enrolmentTunes, eq(enrolmentTunes.id, stageStates.enrolmentTuneId))
    .leftJoin(enrolments, eq(enrolments.id, enrolmentTunes.enrolmentId))
    .leftJoin(courses, eq(courses.id, enrolments.courseId))
    .where(eq(stageStates.id, stageStateId))
    .for("update", { of: stageStates });
  return rows[0] ?? null;
}
export type LockedStage = NonNullable<Awaited<ReturnType<typeof lockStage>>>;

/** The stage rows that belong with this one: the same student's assignment, or the same climbed tune. */
export function sameHolder(stage: Pick<LockedStage, "assignmentStudentId" | "enrolmentTuneId">): SQL {
  return stage.assignmentStudentId
    ? eq(stageStates.assignmentStudentId, stage.assignmentStudentId)
    : eq(stageStates.enrolmentTuneId, stage.enrolmentTuneId ?? "");
}

export async function lastStageIndex(
  tx: Tx,
  stage: Pick<LockedStage, "assignmentStudentId" | "enrolmentTuneId">,
): Promise<number> {
  const [row] = await tx
    .select({ n: max(stageStates.stageIndex) })
    .from(stageStates)
    .where(sameHolder(stage));
  return row?.n ?? 0;
}

/** Minutes the student logged on this tune on or after `sinceDay` (YYYY-MM-DD in the student's zone). */
export async function practiceMinutesSince(
  tx: Tx,
  studentId: string,
  tuneId: string,
  sinceDay: string,
): Promise<number> {
  const [row] = await tx
    .select({
      total: sql<number>`coalesce(sum(${practiceLogs.minutes}), 0)::int`,
    })
    .from(practiceLogs)
    .where(
      and(eq(practiceLogs.userId, studentId), eq(practiceLogs.tuneId, tuneId), gte(practiceLogs.practisedOn, sinceDay)),
    );
  return row?.total ?? 0;
}

export async function findUpload(tx: Tx, id: string) {
  const [row] = await tx.select().from(uploads).where(eq(uploads.id, id));
  return row ?? null;
}

/** The newest check-in of a stage, whatever its status. */
export async function latestCheckIn(tx: Tx, stageStateId: string) {
  const [row] = await tx
    .select()
    .from(checkIns)
    .where(eq(checkIns.stageStateId, stageStateId))
    .orderBy(desc(checkIns.createdAt), desc(checkIns.id))
    .limit(1);
  return row ?? null;
}

/** Takes back a message not sent yet; false when it has gone (or is being sent right now). */
export async function unsendQueued(tx: Tx, dedupeKey: string): Promise<boolean> {
  const rows = await tx
    .delete(emailOutbox)
    .where(and(eq(emailOutbox.dedupeKey, dedupeKey), eq(emailOutbox.status, "queued")))
    .returning({ id: emailOutbox.id });
  return rows.length > 0;
}

export async function waitingCheckIn(tx: Tx, stageStateId: string) {
  const [row] = await tx
    .select()
    .from(checkIns)
    .where(and(eq(checkIns.stageStateId, stageStateId), eq(checkIns.status, "waiting")));
  return row ?? null;
}

export async function setStageState(
  tx: Tx,
  id: string,
  state: "open" | "checked_in" | "signed_off",
  now: Date,
): Promise<void> {
  await tx
    .update(stageStates)
    .set({ state, ...(state === "signed_off" ? { signedOffAt: now } : {}) })
    .where(eq(stageStates.id, id));
}

/** Opens stage `index` when it is still locked; returns whether it did. */
export async function openStage(
  tx: Tx,
  stage: Pick<LockedStage, "assignmentStudentId" | "enrolmentTuneId">,
  index: number,
  now: Date,
): Promise<boolean> {
  const rows = await tx
    .update(stageStates)
    .set({ state: "open", openedAt: now })
    .where(and(sameHolder(stage), eq(stageStates.stageIndex, index), eq(stageStates.state, "locked")))
    .returning({ id: stageStates.id });
  return rows.length > 0;
}

export async function raiseTuneProgress(
  tx: Tx,
  userId: string,
  tuneId: string,
  stage: number,
  now: Date,
): Promise<void> {
  await tx
    .insert(tuneProgress)
    .values({ userId, tuneId, reachedStage: stage, updatedAt: now })
    .onConflictDoUpdate({
      target: [tuneProgress.userId, tuneProgress.tuneId],
      set: {
        reachedStage: sql`greatest(${tuneProgress.reachedStage}, ${stage})`,
        updatedAt: now,
      },
    });
}

/** Names and addresses for the feedback e-mail. */
export async function mailPeople(tx: Tx, studentId: string, teacherId: string, tuneId: string) {
  const [student] = await tx
    .select({ name: users.name, email: users.email, timeZone: users.timeZone })
    .from(users)
    .where(eq(users.id, studentId));
  const [teacher] = await tx.select({ name: users.name }).from(users).where(eq(users.id, teacherId));
  const [tune] = await tx.select({ title: tunes.title }).from(tunes).where(eq(tunes.id, tuneId));
  return {
    student,
    teacherName: teacher?.name ?? "Your teacher",
    tuneTitle: tune?.title ?? "your tune",
  };
}
