// The student's Today page (issue 6 item 2): open assignments by due date with overdue ones marked,
// the next rung on each course they follow, recent feedback, the practice streak and minutes per
// day over the last four weeks — every day and due date in the student's own time zone.
import type { Tx as Db } from "@/db/queries/auth";
import { coursesByIds, enrolmentsOf } from "@/db/queries/catalogue";
import {
  assignmentsOfStudent,
  minutesByDay,
  practiceDaysUpTo,
  recentFeedback,
  stageStatesOf,
  userZone,
} from "@/db/queries/learning";
import { buildLadder } from "@/lib/catalogue/access";
import { addDays, dayIn, daysBetween, dueWords, streakOf } from "./learn-dates";
import type { Person } from "./learn-assignment";
import { ASSIGNMENTS_PAGE_SIZE } from "./teach-schemas";

export const CHART_DAYS = 28;
const FEEDBACK_COUNT = 5;

export type TodayAssignment = {
  assignmentStudentId: string;
  tuneTitle: string;
  teacherName: string;
  dueAt: string;
  dueLocal: string;
  overdue: boolean;
  stageCount: number;
  signedOff: number;
  /** The stage being worked on and whether it waits for the teacher. */
  current: { index: number; waiting: boolean } | null;
};

export type TodayData = {
  timeZone: string;
  today: string;
  assignments: TodayAssignment[];
  nextRungs: {
    courseId: string;
    courseTitle: string;
    tuneId: string;
    tuneTitle: string;
    gradeTitle: string;
    position: number;
  }[];
  feedback: {
    checkInId: string;
    assignmentStudentId: string;
    tuneTitle: string;
    stageIndex: number;
    outcome: string;
    feedback: string;
    reviewerName: string;
    reviewedAt: string;
  }[];
  streak: number;
  practisedToday: boolean;
  minutes: { day: string; minutes: number }[];
};

/** Active assignments, soonest due first; `open` leaves out those whose stages are all signed off. */
export async function assignmentList(
  db: Db,
  person: Person,
  zone: string,
  now: Date,
  o: { open: boolean },
): Promise<TodayAssignment[]> {
  const rows = await assignmentsOfStudent(db, person.id);
  const statesOf = new Map<string, Awaited<ReturnType<typeof stageStatesOf>>>();
  for (const s of await stageStatesOf(
    db,
    rows.map((r) => r.assignmentStudentId),
  )) {
    const list = statesOf.get(s.assignmentStudentId);
    if (list) list.push(s);
    else statesOf.set(s.assignmentStudentId, [s]);
  }
  const out: TodayAssignment[] = [];
  for (const r of rows) {
    const mine = statesOf.get(r.assignmentStudentId) ?? [];
    const signedOff = mine.filter((s) => s.state === "signed_off").length;
    const done = mine.length > 0 && signedOff === mine.length;
    if (done && o.open) continue;
    const cur = mine.find((s) => s.state === "open" || s.state === "checked_in");
    out.push({
      assignmentStudentId: r.assignmentStudentId,
      tuneTitle: r.tuneTitle,
      teacherName: r.teacherName,
      dueAt: r.dueAt.toISOString(),
      dueLocal: dueWords(r.dueAt, zone),
      overdue: !done && r.dueAt < now,
      stageCount: mine.length,
      signedOff,
      current: cur ? { index: cur.index, waiting: cur.state === "checked_in" } : null,
    });
  }
  return out;
}

export type AssignmentPage = { items: TodayAssignment[]; total: number; page: number; pages: number; pageSize: number };

/**
 * The Assignments page, a page at a time: the ones still to do first, soonest due first, then the
 * finished ones, latest due first — so a year of finished tunes never pushes this week's work down.
 * A page past the last shows the last. Read whole and paged here, not in SQL: "finished" comes from
 * each assignment's stage states, and one student's active assignments number in the dozens.
 */
export async function assignmentPage(
  db: Db,
  person: Person,
  zone: string,
  now: Date,
  page: number,
  pageSize = ASSIGNMENTS_PAGE_SIZE,
): Promise<AssignmentPage> {
  const all = await assignmentList(db, person, zone, now, { open: false });
  const finished = (a: TodayAssignment) => a.stageCount > 0 && a.signedOff === a.stageCount;
  const ordered = [...all.filter((a) => !finished(a)), ...all.filter(finished).reverse()];
  const pages = Math.max(1, Math.ceil(ordered.length / pageSize));
  const at = Math.min(Math.max(1, page), pages);
  return { items: ordered.slice((at - 1) * pageSize, at * pageSize), total: ordered.length, page: at, pages, pageSize };
}

/** On each course the student is actively enrolled in: the first rung that is open but not done. */
async function nextRungs(db: Db, person: Person): Promise<TodayData["nextRungs"]> {
  const active = (await enrolmentsOf(db, person.id)).filter((e) => e.status === "active").map((e) => e.courseId);
  const ladders = await Promise.all((await coursesByIds(db, active)).map((c) => buildLadder(db, person, c)));
  return ladders.flatMap((l) => {
    for (const g of l.grades) {
      const rung = g.rungs.find((r) => r.open && r.state !== "done");
      if (rung)
        return [
          {
            courseId: l.course.id,
            courseTitle: l.course.title,
            tuneId: rung.tuneId,
            tuneTitle: rung.tuneTitle,
            gradeTitle: g.title,
            position: rung.position,
          },
        ];
    }
    return [];
  });
}

/** Minutes per day for the last CHART_DAYS days up to today, zero-filled. */
export async function minutesChart(db: Db, userId: string, today: string): Promise<{ day: string; minutes: number }[]> {
  const from = addDays(today, -(CHART_DAYS - 1));
  const byDay = await minutesByDay(db, userId, from, today);
  return daysBetween(from, today).map((day) => ({ day, minutes: byDay.get(day) ?? 0 }));
}

export async function todayFor(db: Db, person: Person, now = new Date()): Promise<TodayData> {
  const zone = await userZone(db, person.id);
  const today = dayIn(zone, now);
  const [assignments, rungs, feedbackRows, days, minutes] = await Promise.all([
    assignmentList(db, person, zone, now, { open: true }),
    nextRungs(db, person),
    recentFeedback(db, person.id, FEEDBACK_COUNT),
    practiceDaysUpTo(db, person.id, today),
    minutesChart(db, person.id, today),
  ]);
  return {
    timeZone: zone,
    today,
    assignments,
    nextRungs: rungs,
    feedback: feedbackRows.map((f) => ({
      checkInId: f.checkInId,
      assignmentStudentId: f.assignmentStudentId,
      tuneTitle: f.tuneTitle,
      stageIndex: f.stageIndex,
      outcome: f.status,
      feedback: f.feedback ?? "",
      reviewerName: f.reviewerName,
      reviewedAt: f.reviewedAt?.toISOString() ?? "",
    })),
    streak: streakOf(days, today),
    practisedToday: days[0] === today,
    minutes,
  };
}
