// The ladder bench's changes (issue 5 item 1). Each change runs in one transaction and is
// checked against the rules afterwards (lib/courses/rules.ts): a change that would bring in a new
// problem — or leave a published course empty — is rolled back with the rule's words.
import type { Db } from "@/db/client";
import * as q from "@/db/queries/courses";
import { teachingStaff } from "@/db/queries/enrolments";
import { findTune } from "@/db/queries/tunes";
import type { CurrentUser } from "@/lib/auth/current-user";
import { conflict, notFound, unprocessable } from "@/lib/auth/errors";
import { mayEdit, type Editor } from "@/lib/tunes/access";
import type { CourseView } from "./api-types";
import { courseHints, courseProblems, newProblems, orderMismatch, type LadderOrder } from "./rules";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

export async function editableCourse(db: Db, user: Editor, courseId: string): Promise<q.CourseRow> {
  const course = await q.findCourse(db, courseId);
  if (!course || !mayEdit(user, course.teacherId)) throw notFound("We couldn't find that course among yours.");
  return course;
}

export async function courseView(db: Db, course: q.CourseRow): Promise<CourseView> {
  const [grades, staff] = await Promise.all([q.courseLadder(db, course.id), teachingStaff(db)]);
  return {
    id: course.id,
    title: course.title,
    slug: course.slug,
    summary: course.summary,
    published: course.publishedAt !== null,
    leadTeacherId: course.leadTeacherId,
    pace: course.pace,
    staff: staff.map((s) => ({ id: s.id, name: s.name })),
    grades: grades.map((g) => ({ id: g.id, title: g.title, rungs: g.rungs })),
    problems: courseProblems(grades, { published: true }),
    hints: courseHints(grades),
  };
}

/** Runs a change and keeps it only if it brings no new problem to the ladder. */
async function change(db: Db, course: q.CourseRow, run: (tx: Tx) => Promise<void>): Promise<void> {
  const published = course.publishedAt !== null;
  await db.transaction(async (tx) => {
    const before = courseProblems(await q.courseLadder(tx, course.id), { published });
    await run(tx);
    const added = newProblems(before, courseProblems(await q.courseLadder(tx, course.id), { published }));
    if (added.length) throw unprocessable(added.map((p) => p.message).join(" "), { ladder: added[0].message });
    await q.updateCourse(tx, course.id, {});
  });
}

/** A URL-safe slug from the title, made unique with -2, -3 … (it never changes afterwards, so links keep working). */
async function freeSlug(db: Db, title: string): Promise<string> {
  const base =
    title
      .normalize("NFKD")
      .replace(/[\u0300-\u036f]/g, "")
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-|-$/g, "")
      .slice(0, 60) || "course";
  for (let n = 1; ; n++) {
    const slug = n === 1 ? base : `${base}-${n}`;
    if (!(await q.slugTaken(db, slug))) return slug;
  }
}

export async function createCourse(
  db: Db,
  user: Pick<CurrentUser, "id">,
  v: { title: string; summary: string },
): Promise<string> {
  return q.insertCourse(db, user.id, { ...v, slug: await freeSlug(db, v.title) });
}

export async function patchCourse(
  db: Db,
  course: q.CourseRow,
  v: {
    title?: string;
    summary?: string;
    published?: boolean;
    leadTeacherId?: string;
    pace?: "self_paced" | "teacher_sign_off";
  },
): Promise<void> {
  if (v.leadTeacherId !== undefined && !(await teachingStaff(db)).some((s) => s.id === v.leadTeacherId))
    throw unprocessable("The lead teacher must be one of the school's teachers.", {
      leadTeacherId: "Choose one of the school's teachers.",
    });
  if (v.published === true && course.publishedAt === null) {
    const problems = courseProblems(await q.courseLadder(db, course.id), { published: true });
    if (problems.length)
      throw unprocessable(`Not published yet: ${problems.map((p) => p.message).join(" ")}`, {
        published: problems[0].message,
      });
  }
  const publishedAt = v.published === undefined ? undefined : v.published ? (course.publishedAt ?? new Date()) : null;
  await q.updateCourse(db, course.id, {
    title: v.title,
    summary: v.summary,
    publishedAt,
    leadTeacherId: v.leadTeacherId,
    pace: v.pace,
  });
}

export async function removeCourse(db: Db, course: q.CourseRow): Promise<void> {
  if (course.publishedAt) throw conflict("Unpublish the course before deleting it.");
  const enrolled = await q.enrolmentCount(db, course.id);
  if (enrolled)
    throw conflict(
      `${enrolled} student${enrolled === 1 ? " is" : "s are"} enrolled in this course, so it stays; unpublish it instead.`,
    );
  await q.deleteCourse(db, course.id);
}

export async function addGrade(db: Db, course: q.CourseRow, title: string): Promise<string> {
  let id = "";
  await change(db, course, async (tx) => {
    id = await q.insertGrade(tx, course.id, title);
  });
  return id;
}

async function gradeIn(db: Db, courseId: string, gradeId: string) {
  const grade = await q.gradeOf(db, courseId, gradeId);
  if (!grade) throw notFound("That grade is not in this course.");
  return grade;
}

export async function renameGrade(db: Db, course: q.CourseRow, gradeId: string, title: string): Promise<void> {
  await gradeIn(db, course.id, gradeId);
  await change(db, course, (tx) => q.updateGrade(tx, gradeId, title));
}

export async function removeGrade(db: Db, course: q.CourseRow, gradeId: string): Promise<void> {
  await gradeIn(db, course.id, gradeId);
  await change(db, course, (tx) => q.deleteGrade(tx, gradeId));
}

export async function addRung(
  db: Db,
  user: Editor,
  course: q.CourseRow,
  v: { gradeId: string; tuneId: string; requiredStage: number; isTaster: boolean },
): Promise<string> {
  await gradeIn(db, course.id, v.gradeId);
  const tune = await findTune(db, v.tuneId);
  if (!tune || !mayEdit(user, tune.teacherId)) throw notFound("We couldn't find that tune among yours.");
  let id = "";
  await change(db, course, async (tx) => {
    id = await q.insertRung(tx, v.gradeId, { tuneId: v.tuneId, requiredStage: v.requiredStage, isTaster: v.isTaster });
  });
  return id;
}

async function rungIn(db: Db, courseId: string, rungId: string) {
  const rung = await q.rungOf(db, courseId, rungId);
  if (!rung) throw notFound("That rung is not in this course.");
  return rung;
}

export async function patchRung(
  db: Db,
  course: q.CourseRow,
  rungId: string,
  set: { requiredStage?: number; isTaster?: boolean },
): Promise<void> {
  await rungIn(db, course.id, rungId);
  await change(db, course, (tx) => q.updateRung(tx, rungId, set));
}

export async function removeRung(db: Db, course: q.CourseRow, rungId: string): Promise<void> {
  await rungIn(db, course.id, rungId);
  await change(db, course, (tx) => q.deleteRung(tx, rungId));
}

export async function reorderLadder(db: Db, course: q.CourseRow, order: LadderOrder): Promise<void> {
  const mismatch = orderMismatch(await q.courseLadder(db, course.id), order);
  if (mismatch) throw conflict(mismatch);
  await change(db, course, (tx) => q.applyLadderOrder(tx, course.id, order));
}
