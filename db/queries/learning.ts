// SQL for the student's side of issue 6: their assignments and stages, check-ins and feedback, the
// practice log. Who may see what is decided in lib/teaching/; these only read and write rows.
import { and, asc, desc, eq, gte, inArray, isNotNull, lte, sql } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { isUuid } from "./catalogue";
import { toAssignment } from "./check-in-place";
import {
  assignments,
  assignmentStudents,
  checkIns,
  courses,
  grades,
  practiceLogs,
  rungs,
  stageStates,
  tunes,
  uploads,
  users,
} from "../schema";

export async function userZone(db: Db, userId: string): Promise<string> {
  const rows = await db.select({ zone: users.timeZone }).from(users).where(eq(users.id, userId)).limit(1);
  return rows[0]?.zone ?? "Europe/London";
}

const assignmentColumns = {
  assignmentStudentId: assignmentStudents.id,
  studentId: assignmentStudents.studentId,
  assignmentId: assignments.id,
  teacherId: assignments.teacherId,
  teacherName: users.name,
  tuneId: assignments.tuneId,
  tuneTitle: tunes.title,
  dueAt: assignments.dueAt,
  stagePlan: assignments.stagePlan,
  unlockRule: assignments.unlockRule,
  unlockMinutes: assignments.unlockMinutes,
  note: assignments.note,
  status: assignments.status,
};

export type AssignmentRow = NonNullable<Awaited<ReturnType<typeof assignmentOfStudent>>>;

/** One assignment_students row with its assignment, tune title and teacher; null for a malformed or unknown id. */
export async function assignmentOfStudent(db: Db, assignmentStudentId: string) {
  if (!isUuid(assignmentStudentId)) return null;
  const rows = await db
    .select(assignmentColumns)
    .from(assignmentStudents)
    .innerJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .innerJoin(tunes, eq(tunes.id, assignments.tuneId))
    .innerJoin(users, eq(users.id, assignments.teacherId))
    .where(eq(assignmentStudents.id, assignmentStudentId))
    .limit(1);
  return rows[0] ?? null;
}

/** A student's active assignments, soonest due first. */
export async function assignmentsOfStudent(db: Db, studentId: string) {
  return db
    .select(assignmentColumns)
    .from(assignmentStudents)
    .innerJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .innerJoin(tunes, eq(tunes.id, assignments.tuneId))
    .innerJoin(users, eq(users.id, assignments.teacherId))
    .where(and(eq(assignmentStudents.studentId, studentId), eq(assignments.status, "active")))
    .orderBy(asc(assignments.dueAt));
}

export async function stageStatesOf(db: Db, assignmentStudentIds: string[]) {
  if (assignmentStudentIds.length === 0) return [];
  return db
    .select({
      id: stageStates.id,
      // Never null here: the rows are picked by it.
      assignmentStudentId: sql<string>`${stageStates.assignmentStudentId}`,
      index: stageStates.stageIndex,
      state: stageStates.state,
      openedAt: stageStates.openedAt,
      signedOffAt: stageStates.signedOffAt,
    })
    .from(stageStates)
    .where(inArray(stageStates.assignmentStudentId, assignmentStudentIds))
    .orderBy(asc(stageStates.assignmentStudentId), asc(stageStates.stageIndex));
}

/** Every check-in on some stage rows, newest first. */
export async function checkInsOfStages(db: Db, stageStateIds: string[]) {
  if (stageStateIds.length === 0) return [];
  return db
    .select({
      id: checkIns.id,
      stageStateId: checkIns.stageStateId,
      status: checkIns.status,
      selfRating: checkIns.selfRating,
      fromMemory: checkIns.fromMemory,
      feedback: checkIns.feedback,
      uploadId: checkIns.uploadId,
      reviewedAt: checkIns.reviewedAt,
      createdAt: checkIns.createdAt,
    })
    .from(checkIns)
    .where(inArray(checkIns.stageStateId, stageStateIds))
    .orderBy(desc(checkIns.createdAt));
}

/** The owner of a check-in and where it sits, for withdrawing it. */
export async function checkInOwner(db: Db, checkInId: string) {
  if (!isUuid(checkInId)) return null;
  const rows = await db
    .select({
      id: checkIns.id,
      stageStateId: checkIns.stageStateId,
      studentId: checkIns.studentId,
      status: checkIns.status,
      stageIndex: stageStates.stageIndex,
      assignmentStudentId: stageStates.assignmentStudentId,
    })
    .from(checkIns)
    .innerJoin(stageStates, eq(stageStates.id, checkIns.stageStateId))
    .where(eq(checkIns.id, checkInId))
    .limit(1);
  return rows[0] ?? null;
}

export async function uploadRow(db: Db, uploadId: string) {
  if (!isUuid(uploadId)) return null;
  const rows = await db.select().from(uploads).where(eq(uploads.id, uploadId)).limit(1);
  return rows[0] ?? null;
}

/** Whether a tune sits on a taster rung of a published course: such assignments never wait on a membership. */
export async function tuneIsTaster(db: Db, tuneId: string): Promise<boolean> {
  const rows = await db
    .select({ id: rungs.id })
    .from(rungs)
    .innerJoin(grades, eq(grades.id, rungs.gradeId))
    .innerJoin(courses, eq(courses.id, grades.courseId))
    .where(and(eq(rungs.tuneId, tuneId), eq(rungs.isTaster, true), isNotNull(courses.publishedAt)))
    .limit(1);
  return rows.length > 0;
}

/** The latest reviewed check-ins of a student with the teacher's words. */
export async function recentFeedback(db: Db, studentId: string, limit: number) {
  const fields = {
    checkInId: checkIns.id,
    status: checkIns.status,
    feedback: checkIns.feedback,
    reviewedAt: checkIns.reviewedAt,
    stageIndex: stageStates.stageIndex,
    assignmentStudentId: assignmentStudents.id,
    tuneTitle: tunes.title,
    reviewerName: users.name,
  };
  return toAssignment(db.select(fields).from(checkIns).$dynamic())
    .innerJoin(tunes, eq(tunes.id, assignments.tuneId))
    .innerJoin(users, eq(users.id, checkIns.reviewedBy))
    .where(
      and(
        eq(checkIns.studentId, studentId),
        isNotNull(checkIns.reviewedAt),
        sql`coalesce(${checkIns.feedback}, '') <> ''`,
      ),
    )
    .orderBy(desc(checkIns.reviewedAt))
    .limit(limit);
}

// ---- practice log ----

export type PracticeValues = { tuneId: string | null; practisedOn: string; minutes: number; note: string };

export async function practiceList(db: Db, userId: string, limit = 200) {
  return db
    .select({
      id: practiceLogs.id,
      tuneId: practiceLogs.tuneId,
      tuneTitle: tunes.title,
      practisedOn: practiceLogs.practisedOn,
      minutes: practiceLogs.minutes,
      note: practiceLogs.note,
    })
    .from(practiceLogs)
    .leftJoin(tunes, eq(tunes.id, practiceLogs.tuneId))
    .where(eq(practiceLogs.userId, userId))
    .orderBy(desc(practiceLogs.practisedOn), desc(practiceLogs.createdAt))
    .limit(limit);
}

export async function practiceEntry(db: Db, id: string) {
  if (!isUuid(id)) return null;
  const rows = await db.select().from(practiceLogs).where(eq(practiceLogs.id, id)).limit(1);
  return rows[0] ?? null;
}

export async function insertPractice(db: Db, userId: string, v: PracticeValues): Promise<string> {
  const [row] = await db
    .insert(practiceLogs)
    .values({ userId, ...v })
    .returning({ id: practiceLogs.id });
  return row.id;
}

export async function updatePractice(db: Db, id: string, userId: string, v: Partial<PracticeValues>): Promise<boolean> {
  if (!isUuid(id)) return false;
  const rows = await db
    .update(practiceLogs)
    .set(v)
    .where(and(eq(practiceLogs.id, id), eq(practiceLogs.userId, userId)))
    .returning({ id: practiceLogs.id });
  return rows.length > 0;
}

export async function deletePractice(db: Db, id: string, userId: string): Promise<boolean> {
  if (!isUuid(id)) return false; // a malformed id names nothing (PostgreSQL would reject it)
  const rows = await db
    .delete(practiceLogs)
    .where(and(eq(practiceLogs.id, id), eq(practiceLogs.userId, userId)))
    .returning({ id: practiceLogs.id });
  return rows.length > 0;
}

/** Minutes per calendar day (the day the student wrote down) between two days, both included. */
export async function minutesByDay(db: Db, userId: string, from: string, to: string): Promise<Map<string, number>> {
  const rows = await db
    .select({ day: practiceLogs.practisedOn, minutes: sql<number>`sum(${practiceLogs.minutes})::int` })
    .from(practiceLogs)
    .where(and(eq(practiceLogs.userId, userId), gte(practiceLogs.practisedOn, from), lte(practiceLogs.practisedOn, to)))
    .groupBy(practiceLogs.practisedOn);
  return new Map(rows.map((r) => [r.day, Number(r.minutes)]));
}

/** The days with practice up to a day, newest first (enough for any streak a person can have had). */
export async function practiceDaysUpTo(db: Db, userId: string, to: string, limit = 1000): Promise<string[]> {
  const rows = await db
    .selectDistinct({ day: practiceLogs.practisedOn })
    .from(practiceLogs)
    .where(and(eq(practiceLogs.userId, userId), lte(practiceLogs.practisedOn, to)))
    .orderBy(desc(practiceLogs.practisedOn))
    .limit(limit);
  return rows.map((r) => r.day);
}

/** Tunes a student has been assigned (active assignments), for the practice log's tune choice. */
export async function assignedTunes(db: Db, studentId: string) {
  return db
    .selectDistinct({ id: tunes.id, title: tunes.title })
    .from(assignmentStudents)
    .innerJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .innerJoin(tunes, eq(tunes.id, assignments.tuneId))
    .where(and(eq(assignmentStudents.studentId, studentId), eq(assignments.status, "active")));
}

/** Tunes on taster rungs of published courses: open to everyone. */
export async function tasterTunes(db: Db) {
  return db
    .selectDistinct({ id: tunes.id, title: tunes.title })
    .from(rungs)
    .innerJoin(grades, eq(grades.id, rungs.gradeId))
    .innerJoin(courses, eq(courses.id, grades.courseId))
    .innerJoin(tunes, eq(tunes.id, rungs.tuneId))
    .where(and(eq(rungs.isTaster, true), isNotNull(courses.publishedAt)));
}
