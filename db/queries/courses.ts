// SQL for the ladder bench (issue 5 item 1). Who may change which course and what the ladder
// must keep are decided in lib/courses/*; these only read and write rows.
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { courses, enrolments, grades, rungs, tunes, tuneStages, users } from "../schema";
import type { GradeFacts } from "@/lib/courses/rules";

export type CourseRow = typeof courses.$inferSelect;

export async function listCourses(db: Db, teacherId: string | null) {
  return db
    .select({
      id: courses.id,
      title: courses.title,
      slug: courses.slug,
      summary: courses.summary,
      publishedAt: courses.publishedAt,
      updatedAt: courses.updatedAt,
      teacherName: users.name,
      gradeCount: sql<number>`(select count(*)::int from ${grades} where ${grades.courseId} = ${courses.id})`,
      rungCount: sql<number>`(select count(*)::int from ${rungs} join ${grades} on ${grades.id} = ${rungs.gradeId} where ${grades.courseId} = ${courses.id})`,
    })
    .from(courses)
    .innerJoin(users, eq(users.id, courses.teacherId))
    .where(teacherId === null ? undefined : eq(courses.teacherId, teacherId))
    .orderBy(desc(courses.updatedAt), asc(courses.title));
}

export async function findCourse(db: Db, id: string): Promise<CourseRow | null> {
  return (await db.select().from(courses).where(eq(courses.id, id)).limit(1))[0] ?? null;
}

export async function slugTaken(db: Db, slug: string): Promise<boolean> {
  return (await db.select({ id: courses.id }).from(courses).where(eq(courses.slug, slug)).limit(1)).length > 0;
}

export async function insertCourse(
  db: Db,
  teacherId: string,
  v: { title: string; summary: string; slug: string },
): Promise<string> {
  return (
    await db
      .insert(courses)
      .values({ teacherId, leadTeacherId: teacherId, ...v })
      .returning({ id: courses.id })
  )[0].id;
}

export async function updateCourse(
  db: Db,
  id: string,
  set: Partial<Pick<CourseRow, "title" | "summary" | "publishedAt" | "leadTeacherId" | "pace">>,
): Promise<void> {
  await db
    .update(courses)
    .set({ ...set, updatedAt: new Date() })
    .where(eq(courses.id, id));
}

export async function deleteCourse(db: Db, id: string): Promise<void> {
  await db.delete(courses).where(eq(courses.id, id));
}

export async function enrolmentCount(db: Db, courseId: string): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(enrolments)
    .where(eq(enrolments.courseId, courseId));
  return row?.n ?? 0;
}

/** Stage names per tune (index order), for the required-stage choices and the rules' stage counts. */
async function stageNames(db: Db, tuneIds: string[]): Promise<Map<string, string[]>> {
  const out = new Map<string, string[]>();
  if (tuneIds.length === 0) return out;
  const rows = await db
    .select({ tuneId: tuneStages.tuneId, name: tuneStages.name })
    .from(tuneStages)
    .where(inArray(tuneStages.tuneId, tuneIds))
    .orderBy(asc(tuneStages.tuneId), asc(tuneStages.index));
  for (const r of rows) out.set(r.tuneId, [...(out.get(r.tuneId) ?? []), r.name]);
  return out;
}

export type LadderGrade = GradeFacts & {
  position: number;
  rungs: (GradeFacts["rungs"][number] & { tuneId: string; stageNames: string[] })[];
};

/** The course's grades in order, each with its rungs in order, tune titles and stage names. */
export async function courseLadder(db: Db, courseId: string): Promise<LadderGrade[]> {
  const gs = await db.select().from(grades).where(eq(grades.courseId, courseId)).orderBy(asc(grades.position));
  const rs = gs.length
    ? await db
        .select({
          id: rungs.id,
          gradeId: rungs.gradeId,
          tuneId: rungs.tuneId,
          tuneTitle: tunes.title,
          requiredStage: rungs.requiredStage,
          isTaster: rungs.isTaster,
        })
        .from(rungs)
        .innerJoin(tunes, eq(tunes.id, rungs.tuneId))
        .where(
          inArray(
            rungs.gradeId,
            gs.map((g) => g.id),
          ),
        )
        .orderBy(asc(rungs.position))
    : [];
  const names = await stageNames(db, [...new Set(rs.map((r) => r.tuneId))]);
  return gs.map((g) => ({
    id: g.id,
    title: g.title,
    position: g.position,
    rungs: rs
      .filter((r) => r.gradeId === g.id)
      .map(({ gradeId: _g, ...r }) => ({
        ...r,
        stageNames: names.get(r.tuneId) ?? [],
        stageCount: names.get(r.tuneId)?.length ?? 0,
      })),
  }));
}

export async function gradeOf(db: Db, courseId: string, gradeId: string) {
  return (
    (
      await db
        .select()
        .from(grades)
        .where(and(eq(grades.id, gradeId), eq(grades.courseId, courseId)))
        .limit(1)
    )[0] ?? null
  );
}

export async function rungOf(db: Db, courseId: string, rungId: string) {
  const rows = await db
    .select({ id: rungs.id, gradeId: rungs.gradeId })
    .from(rungs)
    .innerJoin(grades, eq(grades.id, rungs.gradeId))
    .where(and(eq(rungs.id, rungId), eq(grades.courseId, courseId)))
    .limit(1);
  return rows[0] ?? null;
}

export async function insertGrade(db: Db, courseId: string, title: string): Promise<string> {
  const [{ next }] = await db
    .select({ next: sql<number>`coalesce(max(${grades.position}), 0)::int + 1` })
    .from(grades)
    .where(eq(grades.courseId, courseId));
  return (await db.insert(grades).values({ courseId, title, position: next }).returning({ id: grades.id }))[0].id;
}

export async function updateGrade(db: Db, gradeId: string, title: string): Promise<void> {
  await db.update(grades).set({ title }).where(eq(grades.id, gradeId));
}

export async function deleteGrade(db: Db, gradeId: string): Promise<void> {
  await db.delete(grades).where(eq(grades.id, gradeId));
}

export async function insertRung(
  db: Db,
  gradeId: string,
  v: { tuneId: string; requiredStage: number; isTaster: boolean },
): Promise<string> {
  const [{ next }] = await db
    .select({ next: sql<number>`coalesce(max(${rungs.position}), 0)::int + 1` })
    .from(rungs)
    .where(eq(rungs.gradeId, gradeId));
  return (
    await db
      .insert(rungs)
      .values({ gradeId, position: next, ...v })
      .returning({ id: rungs.id })
  )[0].id;
}

export async function updateRung(
  db: Db,
  rungId: string,
  set: { requiredStage?: number; isTaster?: boolean },
): Promise<void> {
  await db.update(rungs).set(set).where(eq(rungs.id, rungId));
}

export async function deleteRung(db: Db, rungId: string): Promise<void> {
  await db.delete(rungs).where(eq(rungs.id, rungId));
}

/**
 * Grades and rungs in a new order (rungs may change grade). Positions are unique per grade, so
 * everything first moves to negative positions, then to its place: no two rows ever collide.
 * Run inside a transaction.
 */
export async function applyLadderOrder(
  db: Db,
  courseId: string,
  order: { grades: { id: string; rungs: string[] }[] },
): Promise<void> {
  const gradeIds = order.grades.map((g) => g.id);
  if (gradeIds.length === 0) return;
  await db
    .update(grades)
    .set({ position: sql`-${grades.position}` })
    .where(eq(grades.courseId, courseId));
  await db
    .update(rungs)
    .set({ position: sql`-${rungs.position}` })
    .where(inArray(rungs.gradeId, gradeIds));
  for (const [g, grade] of order.grades.entries()) {
    await db
      .update(grades)
      .set({ position: g + 1 })
      .where(eq(grades.id, grade.id));
    // Every rung not yet placed sits below zero, so position r + 1 in any grade is free.
    for (const [r, rungId] of grade.rungs.entries())
      await db
        .update(rungs)
        .set({ gradeId: grade.id, position: r + 1 })
        .where(eq(rungs.id, rungId));
  }
}
