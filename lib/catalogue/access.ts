// The one server-side decision on who may open which course, rung and stage (issue 5 item 5).
// Every page and route handler of the catalogue, the ladders and the tune page asks here; the
// membership issue widens courseStanding and nothing else. The rules themselves are pure
// (./rules.ts) so they are unit-tested without a database.
import type { Tx as Db } from "@/db/queries/auth";
import {
  courseOfRung,
  coursesByIds,
  coursesWithTune,
  enrolmentIn,
  findCourse,
  findTune,
  gradesOf,
  progressOf,
  rungsOf,
  stageListOf,
  type CourseRow,
  type RungRow,
} from "@/db/queries/catalogue";
import { memberStanding } from "@/lib/billing/gate";
import { bestRung, decideLadder, decideStage, type RungDecision, type StageDecision, type Standing } from "./rules";

/** Who is asking: the signed-in person, or null for a visitor. */
export type Viewer = { id: string; role: "student" | "teacher" | "admin" } | null;

const isStaffOf = (viewer: Viewer, teacherId: string): boolean =>
  viewer !== null && (viewer.role === "admin" || viewer.id === teacherId);

/** Unpublished courses exist only for their teacher and admins. */
export function canSeeCourse(viewer: Viewer, course: CourseRow): boolean {
  return course.published || isStaffOf(viewer, course.teacherId);
}

/**
 * How the viewer may walk a course (see Standing). A student walks the ladder when the membership
 * gate (lib/billing/gate.ts) says they are in good standing AND they have an active enrolment (a
 * member starts a course with one button); otherwise only the taster rungs open, with the reason.
 */
export async function courseStanding(db: Db, viewer: Viewer, course: CourseRow): Promise<Standing> {
  if (isStaffOf(viewer, course.teacherId)) return { pathway: "staff" };
  if (!viewer) return { pathway: "taster", why: `Join the school and enrol in “${course.title}” to open this rung.` };
  const [member, status] = await Promise.all([memberStanding(db, viewer), enrolmentIn(db, viewer.id, course.id)]);
  if (!member.good) return { pathway: "taster", why: member.why };
  if (status === "active") return { pathway: "ladder" };
  if (status === "paused")
    return { pathway: "taster", why: "Your enrolment in this course is paused: ask your teacher to resume it." };
  if (status === "ended") return { pathway: "taster", why: "Your enrolment in this course has ended." };
  return { pathway: "taster", why: `Enrol in “${course.title}” to open this rung.` };
}

export type LadderRungView = RungRow & RungDecision & { stageCount: number; stageNames: Record<number, string> };
export interface Ladder {
  course: CourseRow;
  standing: Standing;
  grades: { id: string; title: string; position: number; rungs: LadderRungView[] }[];
}

/** A course's ladder as the viewer sees it: every rung with its state and, when locked, why. */
export async function buildLadder(db: Db, viewer: Viewer, course: CourseRow): Promise<Ladder> {
  const [rows, gradeRows, standing] = await Promise.all([
    rungsOf(db, [course.id]),
    gradesOf(db, course.id),
    courseStanding(db, viewer, course),
  ]);
  const tuneIds = [...new Set(rows.map((r) => r.tuneId))];
  const [stages, progress] = await Promise.all([
    stageListOf(db, tuneIds),
    viewer ? progressOf(db, viewer.id, tuneIds) : new Map<string, number>(),
  ]);
  const names = new Map<string, Record<number, string>>();
  for (const s of stages) names.set(s.tuneId, { ...names.get(s.tuneId), [s.index]: s.name });
  const withNames = rows.map((r) => ({ ...r, stageNames: names.get(r.tuneId) ?? {} }));
  const decisions = decideLadder(withNames, standing, progress);
  const views = withNames.map((r, i) => ({ ...r, ...decisions[i], stageCount: Object.keys(r.stageNames).length }));
  return {
    course,
    standing,
    grades: gradeRows.map((g) => ({ ...g, rungs: views.filter((v) => v.gradeId === g.id) })),
  };
}

/** The ladder of a course by id or slug; null when it does not exist for this viewer. */
export async function ladderFor(db: Db, viewer: Viewer, idOrSlug: string): Promise<Ladder | null> {
  const course = await findCourse(db, idOrSlug);
  if (!course || !canSeeCourse(viewer, course)) return null;
  return buildLadder(db, viewer, course);
}

/** Whether the viewer may open a rung; null when the rung does not exist for them. */
export async function canOpenRung(
  db: Db,
  viewer: Viewer,
  rungId: string,
): Promise<{ allowed: boolean; reason?: string } | null> {
  const courseId = await courseOfRung(db, rungId);
  const ladder = courseId ? await ladderFor(db, viewer, courseId) : null;
  const rung = ladder?.grades.flatMap((g) => g.rungs).find((r) => r.rungId === rungId);
  return rung ? { allowed: rung.open, reason: rung.reason } : null;
}

export type StageView = StageDecision & { name: string; kinds: string[] };
export interface TuneAccess {
  /** Never the full setting's ABC: that is the last stage, and it may be locked. */
  tune: { id: string; title: string; tuneType: string; key: string; meter: string };
  /** The rung the tune is met on (the most open one), for the page's heading and links. */
  rung: { courseId: string; courseTitle: string; gradeTitle: string; position: number; isTaster: boolean } | null;
  open: boolean;
  /** Why no stage is open, when none is. */
  reason?: string;
  reached: number;
  stages: StageView[];
}

/**
 * Which stages of a tune the viewer may open; null when the tune does not exist for them (not on
 * any course they can see, and not their own). A tune on several ladders takes the most open rung.
 */
export async function tuneAccess(db: Db, viewer: Viewer, tuneId: string): Promise<TuneAccess | null> {
  const tune = await findTune(db, tuneId);
  if (!tune) return null;
  const own = isStaffOf(viewer, tune.teacherId);
  const visible = (await coursesByIds(db, await coursesWithTune(db, tune.id))).filter((c) => canSeeCourse(viewer, c));
  if (!own && visible.length === 0) return null;
  const ladders = await Promise.all(visible.map((c) => buildLadder(db, viewer, c)));
  const here = ladders.flatMap((l) =>
    l.grades.flatMap((g) =>
      g.rungs
        .filter((r) => r.tuneId === tune.id)
        .map((r) => ({ ...r, ladder: l, staff: l.standing.pathway === "staff" })),
    ),
  );
  const best = bestRung(here);
  const staff = own || here.some((r) => r.staff);
  const open = staff || Boolean(best?.open);
  const reached = best?.reached ?? 0;
  const list = await stageListOf(db, [tune.id]);
  const names = Object.fromEntries(list.map((s) => [s.index, s.name]));
  const stages = list.map((s) => {
    const d = open
      ? decideStage(s.index, names, { staff, reached, signedIn: viewer !== null })
      : { index: s.index, allowed: false, reason: best?.reason };
    return { ...d, name: s.name, kinds: s.kinds };
  });
  const rung = best
    ? {
        courseId: best.ladder.course.id,
        courseTitle: best.ladder.course.title,
        gradeTitle: best.gradeTitle,
        position: best.position,
        isTaster: best.isTaster,
      }
    : null;
  const shown = { id: tune.id, title: tune.title, tuneType: tune.tuneType, key: tune.key, meter: tune.meter };
  return {
    tune: shown,
    rung,
    open,
    reached,
    stages,
    ...(open ? {} : { reason: best?.reason ?? "This tune is not open to you." }),
  };
}

/** One stage: allowed or why not; null when the tune or the stage does not exist for the viewer. */
export async function stageAccess(db: Db, viewer: Viewer, tuneId: string, index: number): Promise<StageView | null> {
  const access = await tuneAccess(db, viewer, tuneId);
  return access?.stages.find((s) => s.index === index) ?? null;
}
