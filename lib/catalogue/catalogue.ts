// Courses as the catalogue, "my courses" and the ladder show them (issue 5 items 4 and 5).
import type { Tx as Db } from "@/db/queries/auth";
import {
  coursesByIds,
  coursesTaughtBy,
  enrolmentsOf,
  findCourse,
  publishedCourses,
  rungsOf,
  type CourseRow,
  type RungRow,
} from "@/db/queries/catalogue";
import { buildLadder, canSeeCourse, ladderFor, type Ladder, type Viewer } from "./access";
import type { CatalogueCourse, LadderJson, MyCourse, SuggestedCourse } from "./api-types";

function gradesOfRows(rows: RungRow[]): CatalogueCourse["grades"] {
  const grades: CatalogueCourse["grades"] = [];
  let last: string | null = null;
  for (const r of rows) {
    if (r.gradeId !== last) grades.push({ title: r.gradeTitle, rungs: [] });
    last = r.gradeId;
    grades[grades.length - 1].rungs.push({
      tuneId: r.tuneId,
      tuneTitle: r.tuneTitle,
      tuneType: r.tuneType,
      tuneKey: r.tuneKey,
      isTaster: r.isTaster,
    });
  }
  return grades;
}

// "Taught by": the lead teacher, who follows the course's new members.
const courseHead = (c: CourseRow) => ({
  id: c.id,
  slug: c.slug,
  title: c.title,
  summary: c.summary,
  teacherName: c.leadTeacherName,
  pace: c.pace,
});

/** The public catalogue: every published course with its grades and tune titles. */
export async function catalogueCourses(db: Db): Promise<CatalogueCourse[]> {
  const list = await publishedCourses(db);
  const rows = await rungsOf(
    db,
    list.map((c) => c.id),
  );
  return list.map((c) => ({ ...courseHead(c), grades: gradesOfRows(rows.filter((r) => r.courseId === c.id)) }));
}

/** One course for the catalogue; null when it does not exist for this viewer. */
export async function catalogueCourse(db: Db, viewer: Viewer, idOrSlug: string): Promise<CatalogueCourse | null> {
  const course = await findCourse(db, idOrSlug);
  if (!course || !canSeeCourse(viewer, course)) return null;
  return { ...courseHead(course), grades: gradesOfRows(await rungsOf(db, [course.id])) };
}

function summaryOf(ladder: Ladder, relation: MyCourse["relation"]): MyCourse {
  const rungs = ladder.grades.flatMap((g) => g.rungs);
  const next = rungs.find((r) => r.open && r.state !== "done");
  return {
    ...courseHead(ladder.course),
    relation,
    rungs: rungs.length,
    done: rungs.filter((r) => r.state === "done").length,
    next: next ? { tuneId: next.tuneId, tuneTitle: next.tuneTitle } : null,
  };
}

/** The courses a person is enrolled in (any state) or teaches, with how far they have come. */
export async function myCourses(db: Db, viewer: NonNullable<Viewer>): Promise<MyCourse[]> {
  const enrolled = await enrolmentsOf(db, viewer.id);
  const taught = viewer.role === "student" ? [] : await coursesTaughtBy(db, viewer.id);
  const relation = new Map<string, MyCourse["relation"]>(enrolled.map((e) => [e.courseId, e.status]));
  for (const id of taught) relation.set(id, "teaching");
  const list = (await coursesByIds(db, [...relation.keys()])).filter((c) => canSeeCourse(viewer, c));
  const ladders = await Promise.all(list.map((c) => buildLadder(db, viewer, c)));
  return ladders.map((l) => summaryOf(l, relation.get(l.course.id) ?? "active"));
}

/** Published courses a student is not enrolled in, easiest first (fewest grades), to start next. */
export async function suggestedCourses(db: Db, viewer: NonNullable<Viewer>): Promise<SuggestedCourse[]> {
  if (viewer.role !== "student") return [];
  const enrolled = new Set((await enrolmentsOf(db, viewer.id)).map((e) => e.courseId));
  const list = (await publishedCourses(db)).filter((c) => !enrolled.has(c.id));
  const rows = await rungsOf(
    db,
    list.map((c) => c.id),
  );
  return list
    .map((c) => {
      const mine = rows.filter((r) => r.courseId === c.id);
      return { ...courseHead(c), grades: new Set(mine.map((r) => r.gradeId)).size, tunes: mine.length };
    })
    .sort((a, b) => a.grades - b.grades || a.tunes - b.tunes || a.title.localeCompare(b.title));
}

/** The ladder as JSON; null when the course does not exist for this viewer. */
export async function ladderJson(db: Db, viewer: Viewer, idOrSlug: string): Promise<LadderJson | null> {
  const ladder = await ladderFor(db, viewer, idOrSlug);
  if (!ladder) return null;
  const { standing } = ladder;
  return {
    course: courseHead(ladder.course),
    standing: standing.pathway === "taster" ? { pathway: "taster", why: standing.why } : { pathway: standing.pathway },
    grades: ladder.grades.map((g) => ({
      id: g.id,
      title: g.title,
      rungs: g.rungs.map((r) => ({
        rungId: r.rungId,
        tuneId: r.tuneId,
        tuneTitle: r.tuneTitle,
        tuneType: r.tuneType,
        tuneKey: r.tuneKey,
        isTaster: r.isTaster,
        position: r.position,
        requiredStage: r.requiredStage,
        requiredStageName: r.stageNames[r.requiredStage] ?? "",
        stageCount: r.stageCount,
        nextStageName: r.reached < r.stageCount ? (r.stageNames[r.reached + 1] ?? "") : null,
        state: r.state,
        reached: r.reached,
        ...(r.reason ? { reason: r.reason } : {}),
      })),
    })),
  };
}
