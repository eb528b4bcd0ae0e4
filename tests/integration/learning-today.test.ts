// Today's data against a real database at fixed instants: the streak and the minutes per day are
// counted in the student's own time zone; open assignments come by due date with overdue marked;
// the next rung of a course; the teacher's latest words.
import { insertEnrolment } from "@/db/queries/enrolments";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { courses, grades, rungs, stageStates } from "@/db/schema";
import { streakOf } from "@/lib/teaching/learn-dates";
import { ASSIGNMENTS_PAGE_SIZE } from "@/lib/teaching/teach-schemas";
import { CHART_DAYS, assignmentPage, todayFor } from "@/lib/teaching/today";
import { makeAssignment, makePractice, makeTune, makeUpload } from "./helpers/learning-matrix-rows";
import { teachWorld } from "./helpers/teach-world";

type World = Awaited<ReturnType<typeof teachWorld>>;
let w: World;
let teacherId: string;

beforeAll(async () => {
  w = await teachWorld();
  teacherId = (await w.person("teacher")).id;
});
afterAll(async () => w?.close());

async function student(timeZone: string) {
  const p = await w.person("student");
  await w.setUser(p.id, { timeZone });
  return { id: p.id, role: "student" as const };
}

// 20:00 UTC on 10 March 2026 is already 09:00 on 11 March in Auckland (NZDT, UTC+13 until 5 April;
// IANA tz database) and still 10 March in London (GMT).
const NOW = new Date("2026-03-10T20:00:00Z");

describe("streak", () => {
  it("counts days in the student's zone: the same log is a 3-day streak in Auckland and 2 in London", async () => {
    const auck = await student("Pacific/Auckland");
    const lond = await student("Europe/London");
    for (const p of [auck, lond])
      for (const day of ["2026-03-11", "2026-03-10", "2026-03-09", "2026-03-07"])
        await makePractice(w.db, p.id, { practisedOn: day, minutes: 20 });
    const a = await todayFor(w.db, auck, NOW);
    expect(a.today).toBe("2026-03-11");
    expect([a.streak, a.practisedToday]).toEqual([3, true]);
    // In London 11 March has not come yet: that entry is not counted, the streak is 10 and 9 March.
    const l = await todayFor(w.db, lond, NOW);
    expect(l.today).toBe("2026-03-10");
    expect([l.streak, l.practisedToday]).toEqual([2, true]);
  });

  it("is not broken by a day with no practice yet today, and broken after a whole day without", async () => {
    const p = await student("Pacific/Auckland");
    for (const day of ["2026-03-10", "2026-03-09"]) await makePractice(w.db, p.id, { practisedOn: day, minutes: 15 });
    const sameDay = await todayFor(w.db, p, NOW); // 11 March in Auckland, nothing yet today
    expect([sameDay.streak, sameDay.practisedToday]).toEqual([2, false]);
    const dayAfter = await todayFor(w.db, p, new Date("2026-03-11T20:00:00Z")); // 12 March: 11 March passed empty
    expect(dayAfter.streak).toBe(0);
  });

  it("streakOf: duplicates and order do not matter", () => {
    expect(streakOf(["2026-01-03", "2026-01-01", "2026-01-02", "2026-01-03"], "2026-01-03")).toBe(3);
    expect(streakOf([], "2026-01-03")).toBe(0);
    expect(streakOf(["2025-12-31", "2026-01-01"], "2026-01-02")).toBe(2); // across a year's end
  });
});

describe("minutes per day", () => {
  it("gives the last four weeks up to today in the student's zone, zero-filled, summing a day's entries", async () => {
    const p = await student("Pacific/Auckland");
    await makePractice(w.db, p.id, { practisedOn: "2026-03-11", minutes: 30 });
    await makePractice(w.db, p.id, { practisedOn: "2026-03-11", minutes: 12 });
    await makePractice(w.db, p.id, { practisedOn: "2026-02-12", minutes: 25 }); // the first day shown
    await makePractice(w.db, p.id, { practisedOn: "2026-02-11", minutes: 99 }); // a day too early
    const t = await todayFor(w.db, p, NOW);
    expect(t.minutes).toHaveLength(CHART_DAYS);
    expect(t.minutes[0]).toEqual({ day: "2026-02-12", minutes: 25 });
    expect(t.minutes[CHART_DAYS - 1]).toEqual({ day: "2026-03-11", minutes: 42 });
    expect(t.minutes.reduce((n, d) => n + d.minutes, 0)).toBe(67);
  });
});

describe("assignments, next rung and feedback", () => {
  it("lists open assignments soonest due first, marks the overdue one and leaves out a finished one", async () => {
    const p = await student("America/Halifax");
    const later = await makeAssignment(w.db, {
      teacherId,
      studentIds: [p.id],
      dueAt: new Date("2026-03-20T21:00:00Z"),
    });
    const overdue = await makeAssignment(w.db, {
      teacherId,
      studentIds: [p.id],
      dueAt: new Date("2026-03-09T21:00:00Z"),
    });
    const t = await todayFor(w.db, p, NOW);
    expect(t.assignments.map((a) => a.assignmentStudentId)).toEqual([overdue.students[p.id], later.students[p.id]]);
    expect(t.assignments.map((a) => a.overdue)).toEqual([true, false]);
    // 21:00 UTC on 20 March is 18:00 in Halifax (ADT, UTC−3 from 8 March 2026; IANA tz database).
    expect(t.assignments[1].dueLocal).toBe("Friday 20 March, 18:00");
    expect(t.assignments[1].current).toEqual({ index: 1, waiting: false });
  });

  it("GET /api/learn/assignments lists only the caller's own, soonest due first", async () => {
    const me = await student("Europe/London");
    const someoneElse = await student("Europe/London");
    const late = await makeAssignment(w.db, {
      teacherId,
      studentIds: [me.id, someoneElse.id],
      dueAt: new Date("2030-05-02T17:00:00Z"),
    });
    const soon = await makeAssignment(w.db, {
      teacherId,
      studentIds: [me.id],
      dueAt: new Date("2030-05-01T17:00:00Z"),
    });
    const res = await w.call("learn/assignments", "GET", { cookie: await w.cookieFor(me.id) });
    expect(res.status).toBe(200);
    const { assignments } = (await res.json()) as { assignments: { assignmentStudentId: string; dueLocal: string }[] };
    expect(assignments.map((a) => a.assignmentStudentId)).toEqual([soon.students[me.id], late.students[me.id]]);
    expect(assignments[0].dueLocal).toBe("Wednesday 1 May, 18:00"); // BST (UTC+1) in May; IANA tz database
  });

  it("shows the next rung of an enrolled course and the teacher's latest words", async () => {
    const p = await student("Europe/London");
    const tune = await makeTune(w.db, teacherId, { title: "Today Taster" });
    const [rung] = await w.db.select().from(rungs).where(eq(rungs.tuneId, tune.tuneId));
    const [grade] = await w.db.select().from(grades).where(eq(grades.id, rung.gradeId));
    const [course] = await w.db.select().from(courses).where(eq(courses.id, grade.courseId));
    await insertEnrolment(w.db, { userId: p.id, courseId: course.id });
    const f = await makeAssignment(w.db, { teacherId, studentIds: [p.id], tuneId: tune.tuneId });
    const id = f.students[p.id];
    const { checkIn } = await import("@/lib/teaching/check-in");
    const { applyTransition } = await import("@/lib/teaching/transitions");
    const made = await checkIn(w.db, p, {
      assignmentStudentId: id,
      stageIndex: 1,
      uploadId: await makeUpload(w.db, { ownerId: p.id, assignmentStudentId: id }),
      selfRating: 3,
      fromMemory: false,
    });
    await applyTransition(w.db, {
      stageStateId: made.stageStateId,
      transition: "needsMoreTime",
      actor: { id: teacherId, role: "teacher" },
      feedback: "Keep the bow straighter.",
      checkInId: made.checkInId,
      now: new Date(),
    });
    const t = await todayFor(w.db, p, new Date());
    expect(t.nextRungs).toEqual([
      expect.objectContaining({ courseId: course.id, tuneId: tune.tuneId, tuneTitle: "Today Taster", position: 1 }),
    ]);
    expect(t.feedback).toEqual([
      expect.objectContaining({
        checkInId: made.checkInId,
        feedback: "Keep the bow straighter.",
        outcome: "needs_more_time",
        tuneTitle: "Today Taster",
      }),
    ]);
  });

  it("the Assignments page: still-to-do ones first by due date, finished ones after (latest first), 20 a page", async () => {
    const me = await student("Europe/London");
    const tune = await makeTune(w.db, teacherId, { title: "Paging Reel" });
    const day = (n: number) => new Date(Date.UTC(2030, 0, 1 + n, 17));
    // 24 assignments due on days 0..23; those due on days 1, 5 and 9 have every stage signed off.
    const ids: string[] = [];
    for (let n = 0; n < 24; n++) {
      const f = await makeAssignment(w.db, { teacherId, studentIds: [me.id], tuneId: tune.tuneId, dueAt: day(n) });
      ids.push(f.students[me.id]);
    }
    const finished = [1, 5, 9];
    for (const n of finished)
      await w.db.update(stageStates).set({ state: "signed_off" }).where(eq(stageStates.assignmentStudentId, ids[n]));
    const open = ids.filter((_, n) => !finished.includes(n));
    const expected = [...open, ids[9], ids[5], ids[1]];

    const first = await assignmentPage(w.db, me, "Europe/London", NOW, 1);
    expect(ASSIGNMENTS_PAGE_SIZE).toBe(20);
    expect([first.total, first.page, first.pages]).toEqual([24, 1, 2]);
    expect(first.items.map((a) => a.assignmentStudentId)).toEqual(expected.slice(0, 20));
    expect(first.items.every((a) => a.signedOff < a.stageCount)).toBe(true);
    const second = await assignmentPage(w.db, me, "Europe/London", NOW, 2);
    expect(second.items.map((a) => a.assignmentStudentId)).toEqual(expected.slice(20)); // the last open one, then 9, 5, 1
    expect(second.items.slice(1).every((a) => a.signedOff === a.stageCount)).toBe(true);
    // A page past the last shows the last; page 0 or below shows the first.
    expect((await assignmentPage(w.db, me, "Europe/London", NOW, 7)).page).toBe(2);
    expect((await assignmentPage(w.db, me, "Europe/London", NOW, 0)).items[0].assignmentStudentId).toBe(ids[0]);
    // Today still lists only the open ones, soonest due first.
    const today = await todayFor(w.db, me, NOW);
    expect(today.assignments.map((a) => a.assignmentStudentId)).toEqual(open);
  });
});
