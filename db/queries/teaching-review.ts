// SQL for the teacher's review queue and roster table (issue 6 item 4). Whose rows they are is the
// `teacherId` argument (null: an admin, everyone's), always the signed-in person's id.
import { and, asc, eq, sql } from "drizzle-orm";
import type { Tx } from "./auth";
import { assignments, assignmentStudents, checkIns, practiceLogs, rosterEntries, stageStates, tunes, users } from "../schema";

/** Check-ins waiting for review on active assignments, oldest first. */
export async function waitingForReview(db: Tx, teacherId: string | null) {
  return db
    .select({
      checkInId: checkIns.id,
      createdAt: checkIns.createdAt,
      selfRating: checkIns.selfRating,
      fromMemory: checkIns.fromMemory,
      uploadId: checkIns.uploadId,
      stageIndex: stageStates.stageIndex,
      studentId: users.id,
      studentName: users.name,
      assignmentId: assignments.id,
      stagePlan: assignments.stagePlan,
      tuneId: tunes.id,
      tuneTitle: tunes.title,
    })
    .from(checkIns)
    .innerJoin(stageStates, eq(stageStates.id, checkIns.stageStateId))
    .innerJoin(assignmentStudents, eq(assignmentStudents.id, stageStates.assignmentStudentId))
    .innerJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .innerJoin(tunes, eq(tunes.id, assignments.tuneId))
    .innerJoin(users, eq(users.id, checkIns.studentId))
    .where(and(eq(checkIns.status, "waiting"), eq(assignments.status, "active"), teacherId === null ? undefined : eq(assignments.teacherId, teacherId)))
    .orderBy(asc(checkIns.createdAt), asc(checkIns.id));
}

export async function findCheckIn(db: Tx, id: string) {
  const [row] = await db.select({ id: checkIns.id, stageStateId: checkIns.stageStateId }).from(checkIns).where(eq(checkIns.id, id));
  return row ?? null;
}

/**
 * The roster with each student's last practice day and open / overdue assignments (of this teacher;
 * of anyone for an admin, who sees every student). "Open": active and not every stage signed off.
 */
export async function rosterFigures(db: Tx, teacherId: string | null, now: Date) {
  const mine = teacherId === null ? sql`true` : sql`${assignments.teacherId} = ${teacherId}`;
  const unfinished = sql`exists (select 1 from ${stageStates} where ${stageStates.assignmentStudentId} = ${assignmentStudents.id} and ${stageStates.state} <> 'signed_off')`;
  const cols = {
    studentId: users.id,
    name: users.name,
    email: users.email,
    lastPractice: sql<string | null>`(select max(${practiceLogs.practisedOn})::text from ${practiceLogs} where ${practiceLogs.userId} = ${users.id})`,
    openAssignments: sql<number>`(select count(*)::int from ${assignmentStudents} join ${assignments} on ${assignments.id} = ${assignmentStudents.assignmentId}
      where ${assignmentStudents.studentId} = ${users.id} and ${assignments.status} = 'active' and ${mine} and ${unfinished})`,
    overdueAssignments: sql<number>`(select count(*)::int from ${assignmentStudents} join ${assignments} on ${assignments.id} = ${assignmentStudents.assignmentId}
      where ${assignmentStudents.studentId} = ${users.id} and ${assignments.status} = 'active' and ${mine} and ${unfinished} and ${assignments.dueAt} < ${now.toISOString()}::timestamptz)`,
  };
  if (teacherId === null) return db.select(cols).from(users).where(eq(users.role, "student")).orderBy(asc(users.name));
  return db
    .select(cols)
    .from(rosterEntries)
    .innerJoin(users, eq(users.id, rosterEntries.studentId))
    .where(eq(rosterEntries.teacherId, teacherId))
    .orderBy(asc(users.name));
}
