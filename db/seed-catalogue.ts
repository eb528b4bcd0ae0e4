// The demo catalogue into the database (issue 5, item 8): tunes with their stages, three courses
// with grades and rungs, and some enrolments. Run after seed() has made the people.
import { readFileSync } from "node:fs";
import { and, eq, inArray, sql } from "drizzle-orm";
import type { Db } from "./client";
import { insertEnrolment } from "./queries/enrolments";
import { courses, grades, rungs, tunes, tuneStages, tuneTypeEnum, users } from "./schema";
import { DEMO_COURSES, DEMO_TUNES, type DemoCourse } from "./seed-data/catalogue";
import { STUDENTS, TEACHERS } from "./seed-data/people";
import { analyze } from "@/lib/abc/index";
import { headerField, tuneTypeOf } from "@/lib/tunes/header";

// Moved to lib/tunes/header.ts (the tune editor reads them in the browser); still exported from here.
export { headerField, tuneTypeOf };

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
export type TuneType = (typeof tuneTypeEnum.enumValues)[number];

/** The ABC text of one demo tune file. */
export function demoTuneAbc(file: string): string {
  return readFileSync(new URL(`./seed-data/tunes/${file}`, import.meta.url), "utf8");
}

async function idsByEmail(db: Db, emails: string[]): Promise<Map<string, string>> {
  const rows = await db
    .select({ id: users.id, email: users.email })
    .from(users)
    .where(
      inArray(
        sql`lower(${users.email})`,
        emails.map((e) => e.toLowerCase()),
      ),
    );
  return new Map(rows.map((r) => [r.email.toLowerCase(), r.id]));
}

/**
 * One tune, keyed by (teacher, title). A changed source rewrites the stages the engine made; a
 * stage a teacher edited by hand is kept as written and flagged (PRODUCT.md §4.4).
 */
async function upsertTune(tx: Tx, teacherId: string, file: string): Promise<string> {
  const abc = demoTuneAbc(file);
  const result = analyze(abc);
  if (!result.ok)
    throw new Error(
      `demo tune ${file}: ${result.problems.map((p) => `${p.line}:${p.column} ${p.message}`).join("; ")}`,
    );
  const a = result.value;
  const fields = { title: a.title, tuneType: tuneTypeOf(abc), key: a.key, meter: headerField(abc, "M"), abc };
  const found = await tx
    .select({ id: tunes.id, abc: tunes.abc })
    .from(tunes)
    .where(and(eq(tunes.teacherId, teacherId), eq(tunes.title, a.title)));
  let id = found[0]?.id;
  if (id && found[0]?.abc === abc) return id;
  if (id)
    await tx
      .update(tunes)
      .set({ ...fields, updatedAt: new Date() })
      .where(eq(tunes.id, id));
  else
    id = (
      await tx
        .insert(tunes)
        .values({ teacherId, ...fields })
        .returning({ id: tunes.id })
    )[0].id;
  await tx
    .update(tuneStages)
    .set({ sourceChanged: true })
    .where(and(eq(tuneStages.tuneId, id), eq(tuneStages.handEdited, true)));
  for (const s of a.stages) {
    await tx
      .insert(tuneStages)
      .values({ tuneId: id, index: s.index, name: s.name, kinds: s.kinds, abc: s.abc })
      .onConflictDoUpdate({
        target: [tuneStages.tuneId, tuneStages.index],
        set: { name: s.name, kinds: s.kinds, abc: s.abc, sourceChanged: false, updatedAt: new Date() },
        setWhere: eq(tuneStages.handEdited, false),
      });
  }
  return id;
}

/** A course keyed by slug; its grades and rungs are made with it and left alone afterwards (a teacher may have changed them). */
async function seedCourse(
  tx: Tx,
  c: DemoCourse,
  teacherId: string,
  tuneIds: Map<string, string>,
  studentIds: Map<string, string>,
): Promise<void> {
  const made = await tx
    .insert(courses)
    .values({
      teacherId,
      leadTeacherId: teacherId,
      pace: c.pace,
      slug: c.slug,
      title: c.title,
      summary: c.summary,
      publishedAt: new Date(),
    })
    .onConflictDoNothing({ target: courses.slug })
    .returning({ id: courses.id });
  let courseId = made[0]?.id;
  if (courseId) {
    for (const [g, grade] of c.grades.entries()) {
      const [row] = await tx
        .insert(grades)
        .values({ courseId, position: g + 1, title: grade.title })
        .returning({ id: grades.id });
      await tx.insert(rungs).values(
        grade.rungs.map((r, i) => ({
          gradeId: row.id,
          tuneId: need(tuneIds, r.tune, "tune"),
          position: i + 1,
          requiredStage: r.requiredStage,
          isTaster: r.isTaster ?? false,
        })),
      );
    }
  } else {
    courseId = (await tx.select({ id: courses.id }).from(courses).where(eq(courses.slug, c.slug)))[0].id;
  }
  for (const e of c.enrolments) {
    const student = STUDENTS[e.student];
    if (!student) throw new Error(`course ${c.slug}: no demo student ${e.student}`);
    await insertEnrolment(tx, {
      userId: need(studentIds, student.email.toLowerCase(), "student"),
      courseId,
      status: e.status,
    });
  }
}

function need(map: Map<string, string>, key: string, what: string): string {
  const v = map.get(key);
  if (!v) throw new Error(`demo catalogue: no ${what} "${key}" (run seed() for the people first)`);
  return v;
}

/** Idempotent: running it twice leaves one copy of every tune, stage, course, rung and enrolment. */
export async function seedCatalogue(db: Db): Promise<{ courses: number; tunes: number }> {
  const teacherIds = await idsByEmail(
    db,
    TEACHERS.map((t) => t.email),
  );
  const studentIds = await idsByEmail(
    db,
    STUDENTS.map((s) => s.email),
  );
  const teacherId = (i: number): string =>
    need(teacherIds, TEACHERS[i]?.email.toLowerCase() ?? `teacher ${i}`, "teacher");

  const tuneIds = new Map<string, string>();
  for (const t of DEMO_TUNES) {
    tuneIds.set(t.file, await db.transaction((tx) => upsertTune(tx, teacherId(t.teacher), t.file)));
  }
  for (const c of DEMO_COURSES) {
    await db.transaction((tx) => seedCourse(tx, c, teacherId(c.teacher), tuneIds, studentIds));
  }
  const [courseCount] = await db.select({ n: sql<number>`count(*)::int` }).from(courses);
  const [tuneCount] = await db.select({ n: sql<number>`count(*)::int` }).from(tunes);
  return { courses: courseCount.n, tunes: tuneCount.n };
}
