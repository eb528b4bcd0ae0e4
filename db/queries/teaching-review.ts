// SQL for the teacher's review queue and roster table (issue 6 item 4). Whose rows they are is the
// `teacherId` argument (null: an admin, everyone's), always the signed-in person's id.
import { and, asc, eq, sql } from "drizzle-orm";
import type { Tx } from "./auth";
import { assignments, checkIns, courses, rosterEntries, stageStates, tunes, users } from "../schema";
import { placeOf, toPlace } from "./check-in-place";

/** Check-ins waiting for review on active assignments and enrolments (a teacher sign-off course's), oldest first. */
const waitingOn = (teacherId: string | null) =>
  and(
    eq(checkIns.status, "waiting"),
    placeOf.active,
    teacherId === null ? undefined : sql`${placeOf.teacherId} = ${teacherId}`,
  );

/** The `limit` oldest check-ins waiting on a teacher's assignments (every teacher's: null). */
export async function waitingForReview(db: Tx, teacherId: string | null, limit: number) {
  const fields = {
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
    courseTitle: courses.title,
    tuneId: tunes.id,
    tuneTitle: tunes.title,
  };
  return toPlace(db.select(fields).from(checkIns).$dynamic())
    .innerJoin(tunes, sql`${tunes.id} = ${placeOf.tuneId}`)
    .innerJoin(users, eq(users.id, checkIns.studentId))
    .where(waitingOn(teacherId))
    .orderBy(asc(checkIns.createdAt), asc(checkIns.id))
    .limit(limit);
}

/** How many check-ins wait on a teacher's assignments (every teacher's: null). */
export async function countWaiting(db: Tx, teacherId: string | null): Promise<number> {
  const [row] = await toPlace(
    db
      .select({ n: sql<number>`count(*)::int` })
      .from(checkIns)
      .$dynamic(),
  ).where(waitingOn(teacherId));
  return row?.n ?? 0;
}

export async function findCheckIn(db: Tx, id: string) {
  const [row] = await db
    .select({ id: checkIns.id, stageStateId: checkIns.stageStateId })
    .from(checkIns)
    .where(eq(checkIns.id, id));
  return row ?? null;
}

/**
 * The roster with each student's last practice day and open / overdue assignments (of this teacher;
 * of anyone for an admin, who sees every student). "Open": active and not every stage signed off.
 */
export async function rosterFigures(db: Tx, teacherId: string | null, now: Date) {
  // Written with qualified names: drizzle leaves columns bare in a one-table select, which the
  // correlated subqueries below would find ambiguous.
  const mine = teacherId === null ? sql`true` : sql`a.teacher_id = ${teacherId}`;
  const open = sql`from assignment_students s join assignments a on a.id = s.assignment_id
    where s.student_id = "users"."id" and a.status = 'active' and ${mine}
    and exists (select 1 from stage_states st where st.assignment_student_id = s.id and st.state <> 'signed_off')`;
  const cols = {
    studentId: users.id,
    name: users.name,
    email: users.email,
    lastPractice: sql<
      string | null
    >`(select max(p.practised_on)::text from practice_logs p where p.user_id = "users"."id")`,
    openAssignments: sql<number>`(select count(*)::int ${open})`,
    overdueAssignments: sql<number>`(select count(*)::int ${open} and a.due_at < ${now.toISOString()}::timestamptz)`,
  };
  if (teacherId === null) return db.select(cols).from(users).where(eq(users.role, "student")).orderBy(asc(users.name));
  return db
    .select(cols)
    .from(rosterEntries)
    .innerJoin(users, eq(users.id, rosterEntries.studentId))
    .where(eq(rosterEntries.teacherId, teacherId))
    .orderBy(asc(users.name));
}
