// One course's own page in the catalogue: its grades and rungs with what each asks, what a member
// gets, and the one next step for whoever is looking — join, start, carry on, or the taster.
import type { Tx as Db } from "@/db/queries/auth";
import { enrolmentIn, findCourse, rungsOf, stageListOf } from "@/db/queries/catalogue";
import { membershipsOf } from "@/db/queries/membership";
import { memberStanding } from "@/lib/billing/gate";
import { canSeeCourse, type Viewer } from "./access";
import type { CoursePace } from "./api-types";

export type CoursePageRung = {
  tuneId: string;
  tuneTitle: string;
  tuneType: string;
  tuneKey: string;
  isTaster: boolean;
  position: number;
  requiredStage: number;
  requiredStageName: string;
  stageCount: number;
};

/** What the page offers the viewer: the one button that moves them on. */
export type CourseOffer =
  | { kind: "join"; href: string } // a visitor: choose a plan (and sign up) with this course in hand
  | { kind: "plan"; href: string; why: string } // a student without a membership in good standing
  | { kind: "start" } // a member without an enrolment
  | { kind: "open" } // enrolled: the ladder
  | { kind: "held"; why: string } // enrolment paused or ended
  | { kind: "staff" }; // its teacher or an admin

export type CoursePage = {
  id: string;
  slug: string;
  title: string;
  summary: string;
  teacherName: string;
  pace: CoursePace;
  grades: { title: string; rungs: CoursePageRung[] }[];
  taster: { tuneId: string; tuneTitle: string } | null;
  offer: CourseOffer;
};

async function offerFor(db: Db, viewer: Viewer, course: { id: string; slug: string; teacherId: string }) {
  const plans = `/plans?course=${encodeURIComponent(course.slug)}`;
  if (!viewer) return { kind: "join", href: plans } as const;
  if (viewer.role === "admin" || viewer.id === course.teacherId) return { kind: "staff" } as const;
  if (viewer.role !== "student") return { kind: "staff" } as const;
  const status = await enrolmentIn(db, viewer.id, course.id);
  if (status === "active") return { kind: "open" } as const;
  if (status === "paused")
    return { kind: "held", why: "Your enrolment in this course is paused: ask your teacher to resume it." } as const;
  if (status === "ended") return { kind: "held", why: "Your enrolment in this course has ended." } as const;
  const standing = await memberStanding(db, viewer);
  if (standing.good) return { kind: "start" } as const;
  const lapsed = (await membershipsOf(db, viewer.id)).length > 0;
  return { kind: "plan", href: lapsed ? "/learn/billing" : plans, why: standing.why } as const;
}

/** The course by slug (or id) as its page shows it; null when it does not exist for this viewer. */
export async function coursePage(db: Db, viewer: Viewer, idOrSlug: string): Promise<CoursePage | null> {
  const course = await findCourse(db, idOrSlug);
  if (!course || !canSeeCourse(viewer, course)) return null;
  const rows = await rungsOf(db, [course.id]);
  const stages = await stageListOf(db, [...new Set(rows.map((r) => r.tuneId))]);
  const grades: CoursePage["grades"] = [];
  let last: string | null = null;
  for (const r of rows) {
    if (r.gradeId !== last) grades.push({ title: r.gradeTitle, rungs: [] });
    last = r.gradeId;
    const own = stages.filter((s) => s.tuneId === r.tuneId);
    grades[grades.length - 1].rungs.push({
      tuneId: r.tuneId,
      tuneTitle: r.tuneTitle,
      tuneType: r.tuneType,
      tuneKey: r.tuneKey,
      isTaster: r.isTaster,
      position: r.position,
      requiredStage: r.requiredStage,
      requiredStageName: own.find((s) => s.index === r.requiredStage)?.name ?? "",
      stageCount: own.length,
    });
  }
  const taster = rows.find((r) => r.isTaster);
  return {
    id: course.id,
    slug: course.slug,
    title: course.title,
    summary: course.summary,
    teacherName: course.leadTeacherName,
    pace: course.pace,
    grades,
    taster: taster ? { tuneId: taster.tuneId, tuneTitle: taster.tuneTitle } : null,
    offer: await offerFor(db, viewer, course),
  };
}
