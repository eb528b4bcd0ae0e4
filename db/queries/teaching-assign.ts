// SQL for the teacher's assignments (issue 6 item 1). Whose roster, whose tune and which dates are
// allowed is decided in lib/teaching/assignments.ts; these only read and write rows.
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import type { Tx } from "./auth";
import { assignments, assignmentStudents, checkIns, rosterEntries, stageStates, tunes, users } from "../schema";

export type AssignmentRow = typeof assignments.$inferSelect;

/** Those of `ids` the teacher may assign to: their roster, or any student for an admin (teacherId null). */
export async function assignableStudents(db: Tx, teacherId: string | null, ids: string[]) {
  const cols = {
    id: users.id,
    name: users.name,
    email: users.email,
    timeZone: users.timeZone,
  };
  if (teacherId === null)
    return db
      .select(cols)
      .from(users)
      .where(and(inArray(users.id, ids), eq(users.role, "student")));
  return db
    .select(cols)
    .from(rosterEntries)
    .innerJoin(users, eq(users.id, rosterEntries.studentId))
    .where(and(eq(rosterEntries.teacherId, teacherId), inArray(users.id, ids)));
}

export async function insertAssignment(db: Tx, v: typeof assignments.$inferInsert): Promise<string> {
  return (await db.insert(assignments).values(v).returning({ id: assignments.id }))[0].id;
}

/** One assignment's rows for its students, in one statement; each student's new row id, in the order given. */
export async function insertAssignmentStudents(db: Tx, assignmentId: string, studentIds: string[]): Promise<string[]> {
  if (!studentIds.length) return [];
  const rows = await db
    .insert(assignmentStudents)
    .values(studentIds.map((studentId) => ({ assignmentId, studentId })))
    .returning({ id: assignmentStudents.id, studentId: assignmentStudents.studentId });
  // RETURNING's order is not promised to follow VALUES' (PostgreSQL docs: INSERT), so match by student.
  const byStudent = new Map(rows.map((r) => [r.studentId, r.id]));
  return studentIds.map((s) => byStudent.get(s)!);
}

/** For each of the students' assignments, stage 1 open from now and the rest locked (shared design), in one statement. */
export async function insertStageStates(
  db: Tx,
  assignmentStudentIds: string[],
  count: number,
  now: Date,
): Promise<void> {
  const rows = assignmentStudentIds.flatMap((assignmentStudentId) =>
    Array.from({ length: count }, (_, i) => ({
      assignmentStudentId,
      stageIndex: i + 1,
      state: i === 0 ? ("open" as const) : ("locked" as const),
      openedAt: i === 0 ? now : null,
    })),
  );
  if (rows.length) await db.insert(stageStates).values(rows);
}

export async function findAssignment(db: Tx, id: string): Promise<AssignmentRow | null> {
  return (await db.select().from(assignments).where(eq(assignments.id, id)))[0] ?? null;
}

/** The assignment row locked for an edit, so two edits (or an edit and a check-in) take turns. */
export async function lockAssignment(db: Tx, id: string): Promise<AssignmentRow | null> {
  return (await db.select().from(assignments).where(eq(assignments.id, id)).for("update"))[0] ?? null;
}

export async function updateAssignment(
  db: Tx,
  id: string,
  set: Partial<typeof assignments.$inferInsert>,
): Promise<void> {
  await db.update(assignments).set(set).where(eq(assignments.id, id));
}

export async function studentsOfAssignment(db: Tx, assignmentId: string) {
  return db
    .select({
      assignmentStudentId: assignmentStudents.id,
      studentId: users.id,
      name: users.name,
      email: users.email,
      timeZone: users.timeZone,
    })
    .from(assignmentStudents)
    .innerJoin(users, eq(users.id, assignmentStudents.studentId))
    .where(eq(assignmentStudents.assignmentId, assignmentId))
    .orderBy(asc(users.name));
}

export async function countCheckIns(db: Tx, assignmentId: string): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(checkIns)
    .innerJoin(stageStates, eq(stageStates.id, checkIns.stageStateId))
    .innerJoin(assignmentStudents, eq(assignmentStudents.id, stageStates.assignmentStudentId))
    .where(eq(assignmentStudents.assignmentId, assignmentId));
  return row?.n ?? 0;
}

/** Marks the check-ins still waiting for review on an assignment as withdrawn (the assignment was). */
export async function withdrawWaitingCheckIns(db: Tx, assignmentId: string): Promise<number> {
  const stages = db
    .select({ id: stageStates.id })
    .from(stageStates)
    .innerJoin(assignmentStudents, eq(assignmentStudents.id, stageStates.assignmentStudentId))
    .where(eq(assignmentStudents.assignmentId, assignmentId));
  const done = await db
    .update(checkIns)
    .set({ status: "withdrawn" })
    .where(and(eq(checkIns.status, "waiting"), inArray(checkIns.stageStateId, stages)))
    .returning({ id: checkIns.id });
  return done.length;
}

/** Drops the stage rows of every student of the assignment (only before anyone checked in). */
export async function deleteStageStates(db: Tx, assignmentId: string): Promise<void> {
  const ids = db
    .select({ id: assignmentStudents.id })
    .from(assignmentStudents)
    .where(eq(assignmentStudents.assignmentId, assignmentId));
  await db.delete(stageStates).where(inArray(stageStates.assignmentStudentId, ids));
}

function assignmentsOf(teacherId: string | null, onlyId?: string) {
  return and(
    teacherId === null ? undefined : eq(assignments.teacherId, teacherId),
    onlyId ? eq(assignments.id, onlyId) : undefined,
  );
}

/** How many assignments a teacher has (every teacher's for an admin: teacherId null). */
export async function countAssignments(db: Tx, teacherId: string | null): Promise<number> {
  const [{ n }] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(assignments)
    .where(assignmentsOf(teacherId));
  return n;
}

/**
 * A teacher's assignments (every one for an admin: teacherId null), open ones first, newest due
 * first, with each student's progress: one page of them (`page` from 1), or the one `onlyId`.
 */
export async function listAssignments(
  db: Tx,
  teacherId: string | null,
  which: { onlyId: string } | { page: number; pageSize: number },
) {
  const onlyId = "onlyId" in which ? which.onlyId : undefined;
  const [limit, offset] = "onlyId" in which ? [1, 0] : [which.pageSize, (which.page - 1) * which.pageSize];
  const heads = await db
    .select({
      a: assignments,
      tuneTitle: tunes.title,
      tunePlan: tunes.stagePlan,
      teacherName: users.name,
      teacherZone: users.timeZone,
    })
    .from(assignments)
    .innerJoin(tunes, eq(tunes.id, assignments.tuneId))
    .innerJoin(users, eq(users.id, assignments.teacherId))
    .where(assignmentsOf(teacherId, onlyId))
    .orderBy(asc(assignments.status), desc(assignments.dueAt), desc(assignments.id))
    .limit(limit)
    .offset(offset);
  if (!heads.length) return [];
  const progress = await db
    .select({
      assignmentId: assignmentStudents.assignmentId,
      assignmentStudentId: assignmentStudents.id,
      studentId: users.id,
      name: users.name,
      timeZone: users.timeZone,
      stages: sql<number>`count(${stageStates.id})::int`,
      signedOff: sql<number>`count(*) filter (where ${stageStates.state} = 'signed_off')::int`,
      waiting: sql<number>`count(*) filter (where ${stageStates.state} = 'checked_in')::int`,
    })
    .from(assignmentStudents)
    .innerJoin(users, eq(users.id, assignmentStudents.studentId))
    .leftJoin(stageStates, eq(stageStates.assignmentStudentId, assignmentStudents.id))
    .where(
      inArray(
        assignmentStudents.assignmentId,
        heads.map((h) => h.a.id),
      ),
    )
    .groupBy(assignmentStudents.id, users.id)
    .orderBy(asc(users.name));
  return heads.map((h) => ({
    ...h,
    students: progress.filter((p) => p.assignmentId === h.a.id),
  }));
}
export type AssignmentListRow = Awaited<ReturnType<typeof listAssignments>>[number];

/** What the assign form offers: the teacher's tunes (every tune for an admin) and students they may assign to. */
export async function assignFormData(db: Tx, teacherId: string | null) {
  const tuneRows = await db
    .select({ id: tunes.id, title: tunes.title, stagePlan: tunes.stagePlan })
    .from(tunes)
    .where(teacherId === null ? undefined : eq(tunes.teacherId, teacherId))
    .orderBy(asc(tunes.title));
  const cols = { id: users.id, name: users.name, timeZone: users.timeZone };
  const students =
    teacherId === null
      ? await db.select(cols).from(users).where(eq(users.role, "student")).orderBy(asc(users.name))
      : await db
          .select(cols)
          .from(rosterEntries)
          .innerJoin(users, eq(users.id, rosterEntries.studentId))
          .where(eq(rosterEntries.teacherId, teacherId))
          .orderBy(asc(users.name));
  return { tunes: tuneRows, students };
}
