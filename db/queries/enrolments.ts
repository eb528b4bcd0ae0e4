// SQL for a member's place on a course and the teacher who follows it: enrolling (the course's lead
// teacher comes with it), the admin's reassignment, and the teacher's new members. Who may do what is
// decided in lib/courses/; these only read and write rows.
import { and, asc, eq, gte, inArray, isNull, lt, sql } from "drizzle-orm";
import { addToRoster, type Tx as Db } from "./auth";
import { courses, enrolments, users } from "../schema";

export type EnrolmentStatus = "active" | "paused" | "ended";

/**
 * Enrols a person in a course with the course's lead teacher, and puts them on that teacher's roster.
 * Returns the new enrolment, or null when they already had one (left as it was).
 */
export async function insertEnrolment(
  db: Db,
  v: { userId: string; courseId: string; status?: EnrolmentStatus; at?: Date },
): Promise<{ id: string; teacherId: string } | null> {
  const at = v.at ?? new Date();
  const status = v.status ?? "active";
  const rows = await db.execute<{ id: string; teacher_id: string }>(sql`
    insert into ${enrolments} (user_id, course_id, status, teacher_id, enrolled_at, teacher_since, ended_at)
    select ${v.userId}, c.id, ${status}, c.lead_teacher_id, ${at.toISOString()}::timestamptz, ${at.toISOString()}::timestamptz,
      ${status === "ended" ? at.toISOString() : null}::timestamptz
    from ${courses} c where c.id = ${v.courseId}
    on conflict (user_id, course_id) do nothing
    returning id, teacher_id`);
  const made = rows[0];
  if (!made) return null;
  await addToRoster(db, made.teacher_id, v.userId);
  return { id: made.id, teacherId: made.teacher_id };
}

/** One person's enrolment in one course, with the teacher who follows it. */
export async function enrolmentOf(db: Db, userId: string, courseId: string) {
  const [row] = await db
    .select({
      id: enrolments.id,
      status: enrolments.status,
      teacherId: enrolments.teacherId,
      teacherSince: enrolments.teacherSince,
    })
    .from(enrolments)
    .where(and(eq(enrolments.userId, userId), eq(enrolments.courseId, courseId)))
    .limit(1);
  return row ?? null;
}

/**
 * Hands enrolments to another teacher (who gets the students on their roster). Returns the ids that
 * changed; enrolments already with that teacher are left alone.
 */
export async function reassignEnrolments(db: Db, ids: string[], teacherId: string, at: Date): Promise<string[]> {
  if (ids.length === 0) return [];
  const changed = await db
    .update(enrolments)
    .set({ teacherId, teacherSince: at, welcomedAt: null })
    .where(and(inArray(enrolments.id, ids), sql`${enrolments.teacherId} <> ${teacherId}`))
    .returning({ id: enrolments.id, userId: enrolments.userId });
  for (const r of new Set(changed.map((c) => c.userId))) await addToRoster(db, teacherId, r);
  return changed.map((c) => c.id);
}

/** Enrolments that exist, of the given ids (for refusing unknown ones by name). */
export async function existingEnrolments(db: Db, ids: string[]): Promise<string[]> {
  if (ids.length === 0) return [];
  const rows = await db.select({ id: enrolments.id }).from(enrolments).where(inArray(enrolments.id, ids));
  return rows.map((r) => r.id);
}

/** People who may follow members: teachers and admins, by name. */
export async function teachingStaff(db: Db) {
  return db
    .select({ id: users.id, name: users.name, role: users.role })
    .from(users)
    .where(and(inArray(users.role, ["teacher", "admin"]), eq(users.disabled, false)))
    .orderBy(asc(users.name));
}

const memberColumns = {
  enrolmentId: enrolments.id,
  studentId: users.id,
  studentName: users.name,
  studentEmail: users.email,
  courseId: courses.id,
  courseTitle: courses.title,
  courseSlug: courses.slug,
  teacherId: enrolments.teacherId,
  since: enrolments.teacherSince,
  welcomedAt: enrolments.welcomedAt,
};

/** A teacher's members who came to them in [from, to) (every teacher's: null), newest first. */
export async function newMembers(db: Db, teacherId: string | null, from: Date, to: Date) {
  return db
    .select(memberColumns)
    .from(enrolments)
    .innerJoin(users, eq(users.id, enrolments.userId))
    .innerJoin(courses, eq(courses.id, enrolments.courseId))
    .where(
      and(
        teacherId === null ? undefined : eq(enrolments.teacherId, teacherId),
        eq(enrolments.status, "active"),
        gte(enrolments.teacherSince, from),
        lt(enrolments.teacherSince, to),
      ),
    )
    .orderBy(sql`${enrolments.teacherSince} desc`, asc(users.name));
}

export type NewMemberRow = Awaited<ReturnType<typeof newMembers>>[number];

/** One enrolment with its member and course, for the welcome note. */
export async function memberOf(db: Db, enrolmentId: string) {
  const [row] = await db
    .select(memberColumns)
    .from(enrolments)
    .innerJoin(users, eq(users.id, enrolments.userId))
    .innerJoin(courses, eq(courses.id, enrolments.courseId))
    .where(eq(enrolments.id, enrolmentId))
    .limit(1);
  return row ?? null;
}

/** Marks the welcome as sent once; false when it already was (a double click sends one note). */
export async function markWelcomed(db: Db, enrolmentId: string, at: Date): Promise<boolean> {
  const rows = await db
    .update(enrolments)
    .set({ welcomedAt: at })
    .where(and(eq(enrolments.id, enrolmentId), isNull(enrolments.welcomedAt)))
    .returning({ id: enrolments.id });
  return rows.length > 0;
}

/** Teachers (and admins) with members who came to them in [from, to), with their name, address and zone. */
export async function teachersWithNewMembers(db: Db, from: Date, to: Date) {
  return db
    .selectDistinct({ id: users.id, name: users.name, email: users.email, timeZone: users.timeZone })
    .from(enrolments)
    .innerJoin(users, eq(users.id, enrolments.teacherId))
    .where(
      and(
        eq(enrolments.status, "active"),
        eq(users.disabled, false),
        gte(enrolments.teacherSince, from),
        lt(enrolments.teacherSince, to),
      ),
    );
}
