// SQL for the catalogue, the ladders and the tune page (issue 5). Who may see what is decided in
// lib/catalogue/access.ts; these only read rows.
import { and, asc, eq, inArray, isNotNull, sql } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { courses, enrolments, grades, rungs, tuneProgress, tunes, tuneStages, users } from "../schema";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** An id from a URL: PostgreSQL rejects a malformed uuid, and such an id names nothing anyway. */
export const isUuid = (s: string): boolean => UUID.test(s);

export interface CourseRow {
  id: string;
  slug: string;
  title: string;
  summary: string;
  teacherId: string;
  teacherName: string;
  published: boolean;
  /** Who follows new members; "taught by" on the catalogue and the ladder. */
  leadTeacherId: string;
  leadTeacherName: string;
  pace: "self_paced" | "teacher_sign_off";
}

export interface RungRow {
  rungId: string;
  gradeId: string;
  gradeTitle: string;
  gradePosition: number;
  position: number;
  requiredStage: number;
  isTaster: boolean;
  tuneId: string;
  tuneTitle: string;
  tuneType: string;
  tuneKey: string;
}

const courseColumns = {
  id: courses.id,
  slug: courses.slug,
  title: courses.title,
  summary: courses.summary,
  teacherId: courses.teacherId,
  teacherName: users.name,
  published: sql<boolean>`${courses.publishedAt} is not null`,
  leadTeacherId: courses.leadTeacherId,
  leadTeacherName: sql<string>`(select l.name from ${users} l where l.id = ${courses.leadTeacherId})`,
  pace: courses.pace,
};

export async function publishedCourses(db: Db): Promise<CourseRow[]> {
  return db
    .select(courseColumns)
    .from(courses)
    .innerJoin(users, eq(users.id, courses.teacherId))
    .where(isNotNull(courses.publishedAt))
    .orderBy(asc(courses.title));
}

/** A course by id or slug, published or not. */
export async function findCourse(db: Db, idOrSlug: string): Promise<CourseRow | null> {
  const where = isUuid(idOrSlug) ? eq(courses.id, idOrSlug) : eq(courses.slug, idOrSlug);
  const rows = await db
    .select(courseColumns)
    .from(courses)
    .innerJoin(users, eq(users.id, courses.teacherId))
    .where(where)
    .limit(1);
  return rows[0] ?? null;
}

/** Courses by id (any state), e.g. the ones a person is enrolled in or teaches. */
export async function coursesByIds(db: Db, ids: string[]): Promise<CourseRow[]> {
  if (ids.length === 0) return [];
  return db
    .select(courseColumns)
    .from(courses)
    .innerJoin(users, eq(users.id, courses.teacherId))
    .where(inArray(courses.id, ids))
    .orderBy(asc(courses.title));
}

export async function coursesTaughtBy(db: Db, teacherId: string): Promise<string[]> {
  const rows = await db.select({ id: courses.id }).from(courses).where(eq(courses.teacherId, teacherId));
  return rows.map((r) => r.id);
}

/** The rungs of some courses in ladder order: grade by grade, rung by rung. */
export async function rungsOf(db: Db, courseIds: string[]): Promise<(RungRow & { courseId: string })[]> {
  if (courseIds.length === 0) return [];
  return db
    .select({
      courseId: grades.courseId,
      rungId: rungs.id,
      gradeId: grades.id,
      gradeTitle: grades.title,
      gradePosition: grades.position,
      position: rungs.position,
      requiredStage: rungs.requiredStage,
      isTaster: rungs.isTaster,
      tuneId: tunes.id,
      tuneTitle: tunes.title,
      tuneType: sql<string>`${tunes.tuneType}::text`,
      tuneKey: tunes.key,
    })
    .from(rungs)
    .innerJoin(grades, eq(grades.id, rungs.gradeId))
    .innerJoin(tunes, eq(tunes.id, rungs.tuneId))
    .where(inArray(grades.courseId, courseIds))
    .orderBy(asc(grades.courseId), asc(grades.position), asc(rungs.position));
}

/** Grades of a course, including empty ones, in order. */
export async function gradesOf(db: Db, courseId: string) {
  return db
    .select({ id: grades.id, title: grades.title, position: grades.position })
    .from(grades)
    .where(eq(grades.courseId, courseId))
    .orderBy(asc(grades.position));
}

/** Courses (ids) whose ladders hold a tune, and the course a rung belongs to. */
export async function coursesWithTune(db: Db, tuneId: string): Promise<string[]> {
  const rows = await db
    .selectDistinct({ id: grades.courseId })
    .from(rungs)
    .innerJoin(grades, eq(grades.id, rungs.gradeId))
    .where(eq(rungs.tuneId, tuneId));
  return rows.map((r) => r.id);
}

export async function courseOfRung(db: Db, rungId: string): Promise<string | null> {
  if (!isUuid(rungId)) return null;
  const rows = await db
    .select({ id: grades.courseId })
    .from(rungs)
    .innerJoin(grades, eq(grades.id, rungs.gradeId))
    .where(eq(rungs.id, rungId))
    .limit(1);
  return rows[0]?.id ?? null;
}

export type EnrolmentStatus = "active" | "paused" | "ended";

export async function enrolmentsOf(db: Db, userId: string): Promise<{ courseId: string; status: EnrolmentStatus }[]> {
  return db
    .select({ courseId: enrolments.courseId, status: enrolments.status })
    .from(enrolments)
    .where(eq(enrolments.userId, userId));
}

export async function enrolmentIn(db: Db, userId: string, courseId: string): Promise<EnrolmentStatus | null> {
  const rows = await db
    .select({ status: enrolments.status })
    .from(enrolments)
    .where(and(eq(enrolments.userId, userId), eq(enrolments.courseId, courseId)))
    .limit(1);
  return rows[0]?.status ?? null;
}

/** Stage reached per tune for one person (tunes not started are absent). */
export async function progressOf(db: Db, userId: string, tuneIds: string[]): Promise<Map<string, number>> {
  if (tuneIds.length === 0) return new Map();
  const rows = await db
    .select({ tuneId: tuneProgress.tuneId, reached: tuneProgress.reachedStage })
    .from(tuneProgress)
    .where(and(eq(tuneProgress.userId, userId), inArray(tuneProgress.tuneId, tuneIds)));
  return new Map(rows.map((r) => [r.tuneId, r.reached]));
}

export async function findTune(db: Db, tuneId: string) {
  if (!isUuid(tuneId)) return null;
  const rows = await db
    .select({
      id: tunes.id,
      teacherId: tunes.teacherId,
      title: tunes.title,
      tuneType: sql<string>`${tunes.tuneType}::text`,
      key: tunes.key,
      meter: tunes.meter,
      abc: tunes.abc,
    })
    .from(tunes)
    .where(eq(tunes.id, tuneId))
    .limit(1);
  return rows[0] ?? null;
}

/** The stages of some tunes without their ABC: index, name and kinds. */
export async function stageListOf(db: Db, tuneIds: string[]) {
  if (tuneIds.length === 0) return [];
  return db
    .select({ tuneId: tuneStages.tuneId, index: tuneStages.index, name: tuneStages.name, kinds: tuneStages.kinds })
    .from(tuneStages)
    .where(inArray(tuneStages.tuneId, tuneIds))
    .orderBy(asc(tuneStages.tuneId), asc(tuneStages.index));
}

export async function stageOf(db: Db, tuneId: string, index: number) {
  const rows = await db
    .select({ index: tuneStages.index, name: tuneStages.name, kinds: tuneStages.kinds, abc: tuneStages.abc })
    .from(tuneStages)
    .where(and(eq(tuneStages.tuneId, tuneId), eq(tuneStages.index, index)))
    .limit(1);
  return rows[0] ?? null;
}
