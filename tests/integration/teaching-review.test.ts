// The review queue and the state machine against PostgreSQL (issue 6 items 4 and 6): sign-off opens
// the next stage for that student only, a double or concurrent sign-off leaves one result and one
// 409, "needs more time" reopens the stage, tune_progress rises, the self check-in rule.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { practiceLogs, tuneProgress } from "@/db/schema";
import { REVIEW_BATCH } from "@/lib/teaching/review";
import type { ReviewItem, RosterRow } from "@/lib/teaching/teach-api-types";
import { teachingWorld, type TeachingWorld } from "./helpers/teaching-world";

let w: TeachingWorld;
let room: Awaited<ReturnType<TeachingWorld["classroom"]>>;
let cookie: string;
const QUEUE = "teach/review";
const REVIEW = "teach/review/[checkInId]";

beforeAll(async () => {
  w = await teachingWorld();
  room = await w.classroom(2);
  cookie = await w.cookieFor(room.teacher.id);
});
afterAll(async () => w?.close());

const review = (checkInId: string, outcome: string, feedback = "Lovely lift in the B part.", c = cookie) =>
  w.call(REVIEW, "POST", {
    cookie: c,
    params: { checkInId },
    body: { outcome, feedback },
  });

async function twoStudents() {
  const made = await w.assign(room.teacher, {
    tuneId: room.tuneId,
    studentIds: room.students.map((s) => s.id),
  });
  return made.assignmentStudentIds;
}

describe("the review queue", () => {
  it("lists waiting check-ins oldest first with the stage's name and notation", async () => {
    const [a, b] = await twoStudents();
    const first = await w.checkIn(b);
    const second = await w.checkIn(a);
    const res = await w.call(QUEUE, "GET", { cookie });
    expect(res.status).toBe(200);
    const items = ((await res.json()) as { checkIns: ReviewItem[] }).checkIns.filter((i) =>
      [first, second].includes(i.checkInId),
    );
    expect(items.map((i) => i.checkInId)).toEqual([first, second]);
    expect(items[0].stage).toMatchObject({
      index: 1,
      name: "Skeleton",
      count: 4,
    });
    expect(items[0].stage.abc).toMatch(/^X:/m);
    expect(items[0].uploadId).toBeTruthy();
    const other = await w.cookieFor((await w.person("teacher")).id);
    expect(
      (
        (await (await w.call(QUEUE, "GET", { cookie: other })).json()) as {
          checkIns: ReviewItem[];
        }
      ).checkIns,
    ).toEqual([]);
  });
});

describe("a long review queue", () => {
  it("shows the oldest REVIEW_BATCH and says how many wait in all", async () => {
    const big = await w.classroom(REVIEW_BATCH + 3);
    const teacherCookie = await w.cookieFor(big.teacher.id);
    const made = await w.assign(big.teacher, { tuneId: big.tuneId, studentIds: big.students.map((s) => s.id) });
    const order: string[] = [];
    for (const id of made.assignmentStudentIds) order.push(await w.checkIn(id));
    const body = (await (await w.call(QUEUE, "GET", { cookie: teacherCookie })).json()) as {
      checkIns: ReviewItem[];
      waiting: number;
    };
    expect(body.waiting).toBe(REVIEW_BATCH + 3);
    expect(body.checkIns.map((i) => i.checkInId)).toEqual(order.slice(0, REVIEW_BATCH));
    // Reviewing the oldest brings the next one into the batch.
    expect((await review(order[0], "signed_off", "Good.", teacherCookie)).status).toBe(200);
    const after = (await (await w.call(QUEUE, "GET", { cookie: teacherCookie })).json()) as {
      checkIns: ReviewItem[];
      waiting: number;
    };
    expect(after.waiting).toBe(REVIEW_BATCH + 2);
    expect(after.checkIns.map((i) => i.checkInId)).toEqual(order.slice(1, REVIEW_BATCH + 1));
  }, 60_000);
});

describe("signing off", () => {
  it("opens the next stage for that student only, raises tune_progress and e-mails feedback once", async () => {
    const [a, b] = await twoStudents();
    const checkInId = await w.checkIn(a);
    const res = await review(checkInId, "signed_off");
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({
      state: "signed_off",
      openedStage: 2,
      checkInStatus: "signed_off",
    });
    expect(await w.states(a)).toEqual(["signed_off", "open", "locked", "locked"]);
    expect(await w.states(b)).toEqual(["open", "locked", "locked", "locked"]);
    const row = await w.checkInRow(checkInId);
    expect(row).toMatchObject({
      status: "signed_off",
      feedback: "Lovely lift in the B part.",
      reviewedBy: room.teacher.id,
    });
    const [progress] = await w.db
      .select()
      .from(tuneProgress)
      .where(and(eq(tuneProgress.userId, room.students[0].id), eq(tuneProgress.tuneId, room.tuneId)));
    expect(progress.reachedStage).toBeGreaterThanOrEqual(1);
    const mails = (await w.mailsTo(room.students[0].email)).filter(
      (m) => m.dedupeKey === `checkin-feedback:${checkInId}`,
    );
    expect(mails).toHaveLength(1);
    expect(mails[0].payload).toMatchObject({
      outcome: "signed_off",
      stageName: "Skeleton",
      nextStageName: "Bowing",
    });
  });

  it("a second sign-off of the same check-in answers 409 and changes nothing", async () => {
    const [a] = await twoStudents();
    const checkInId = await w.checkIn(a);
    expect((await review(checkInId, "signed_off")).status).toBe(200);
    const again = await review(checkInId, "signed_off");
    expect(again.status).toBe(409);
    expect(((await again.json()) as { error: string }).error).toMatch(/already/);
    expect(await w.states(a)).toEqual(["signed_off", "open", "locked", "locked"]);
  });

  it("two concurrent sign-offs leave one result and one 409", async () => {
    const [a] = await twoStudents();
    const checkInId = await w.checkIn(a);
    const both = await Promise.all([review(checkInId, "signed_off"), review(checkInId, "needs_more_time")]);
    expect(both.map((r) => r.status).sort()).toEqual([200, 409]);
    const winner = (await both.find((r) => r.status === 200)?.json()) as {
      checkInStatus: string;
    };
    expect((await w.checkInRow(checkInId)).status).toBe(winner.checkInStatus);
    const mails = (await w.mailsTo(room.students[0].email)).filter(
      (m) => m.dedupeKey === `checkin-feedback:${checkInId}`,
    );
    expect(mails).toHaveLength(1);
  });

  it("signing off the last stage opens nothing more", async () => {
    const [a] = await twoStudents();
    for (let stage = 1; stage <= 4; stage++) {
      const res = await review(await w.checkIn(a, stage), "signed_off");
      expect(await res.json()).toMatchObject({
        openedStage: stage < 4 ? stage + 1 : null,
      });
    }
    expect(await w.states(a)).toEqual(["signed_off", "signed_off", "signed_off", "signed_off"]);
    const [progress] = await w.db
      .select()
      .from(tuneProgress)
      .where(and(eq(tuneProgress.userId, room.students[0].id), eq(tuneProgress.tuneId, room.tuneId)));
    expect(progress.reachedStage).toBe(4);
  });
});

describe("needs more time, refusals and the self check-in rule", () => {
  it("needs more time reopens the stage, keeps the next one locked and lets the student check in again", async () => {
    const [a] = await twoStudents();
    const checkInId = await w.checkIn(a);
    const res = await review(checkInId, "needs_more_time", "Steadier tempo, please.");
    expect(await res.json()).toMatchObject({
      state: "open",
      openedStage: null,
      checkInStatus: "needs_more_time",
    });
    expect(await w.states(a)).toEqual(["open", "locked", "locked", "locked"]);
    const mail = (await w.mailsTo(room.students[0].email)).find((m) => m.dedupeKey === `checkin-feedback:${checkInId}`);
    expect(mail?.payload).toMatchObject({
      outcome: "needs_more_time",
      nextStageName: null,
      feedback: "Steadier tempo, please.",
    });
    expect(await w.checkIn(a)).not.toBe(checkInId);
  });

  it("another teacher gets 404; the student gets 403; a withdrawn assignment 409", async () => {
    const made = await w.assign(room.teacher, {
      tuneId: room.tuneId,
      studentIds: [room.students[0].id],
    });
    const checkInId = await w.checkIn(made.assignmentStudentIds[0]);
    const other = await w.cookieFor((await w.person("teacher")).id);
    expect((await review(checkInId, "signed_off", "", other)).status).toBe(404);
    expect((await review(checkInId, "signed_off", "", await w.cookieFor(room.students[0].id))).status).toBe(403);
    expect(
      (
        await w.call("teach/assignments/[id]", "DELETE", {
          cookie,
          params: { id: made.id },
        })
      ).status,
    ).toBe(200);
    const late = await review(checkInId, "signed_off");
    expect(late.status).toBe(409);
    expect(((await late.json()) as { error: string }).error).toMatch(/withdrawn/);
  });

  it("a double check-in answers 409", async () => {
    const [a] = await twoStudents();
    await w.checkIn(a);
    await expect(w.checkIn(a)).rejects.toMatchObject({ status: 409 });
  });

  it("self check-in signs off at once when the minutes are logged, waits below them", async () => {
    const made = await w.assign(room.teacher, {
      tuneId: room.tuneId,
      studentIds: room.students.map((s) => s.id),
      unlockRule: "self_check_in",
      unlockMinutes: 30,
    });
    const [a, b] = made.assignmentStudentIds;
    const today = new Date().toISOString().slice(0, 10);
    await w.db.insert(practiceLogs).values({
      userId: room.students[0].id,
      tuneId: room.tuneId,
      practisedOn: today,
      minutes: 30,
    });
    await w.db.insert(practiceLogs).values({
      userId: room.students[1].id,
      tuneId: room.tuneId,
      practisedOn: today,
      minutes: 29,
    });
    const mine = await w.checkIn(a);
    expect((await w.checkInRow(mine)).status).toBe("signed_off");
    expect(await w.states(a)).toEqual(["signed_off", "open", "locked", "locked"]);
    const theirs = await w.checkIn(b);
    expect((await w.checkInRow(theirs)).status).toBe("waiting");
    expect(await w.states(b)).toEqual(["checked_in", "locked", "locked", "locked"]);
  });
});

describe("the roster table", () => {
  it("counts open and overdue assignments and the last practice day", async () => {
    const lone = await w.classroom(1);
    const s = lone.students[0];
    await w.assign(lone.teacher, { tuneId: lone.tuneId, studentIds: [s.id] });
    const late = await w.assign(lone.teacher, {
      tuneId: lone.tuneId,
      studentIds: [s.id],
    });
    const { assignments } = await import("@/db/schema");
    await w.db
      .update(assignments)
      .set({ dueAt: new Date(Date.now() - 86_400_000) })
      .where(eq(assignments.id, late.id));
    await w.db.insert(practiceLogs).values({
      userId: s.id,
      tuneId: lone.tuneId,
      practisedOn: "2026-11-20",
      minutes: 15,
    });
    const res = await w.call("teach/roster", "GET", {
      cookie: await w.cookieFor(lone.teacher.id),
    });
    const rows = ((await res.json()) as { students: RosterRow[] }).students;
    expect(rows).toEqual([
      {
        studentId: s.id,
        name: s.name,
        email: s.email,
        lastPractice: "2026-11-20",
        openAssignments: 2,
        overdueAssignments: 1,
      },
    ]);
    // An admin sees every student, with the same figures; another teacher sees none of them.
    const admin = await w.cookieFor((await w.person("admin")).id);
    const all = ((await (await w.call("teach/roster", "GET", { cookie: admin })).json()) as { students: RosterRow[] })
      .students;
    expect(all.find((r) => r.studentId === s.id)).toMatchObject({ openAssignments: 2, overdueAssignments: 1 });
    expect(all.length).toBeGreaterThan(1);
    const other = await w.cookieFor((await w.person("teacher")).id);
    expect(
      ((await (await w.call("teach/roster", "GET", { cookie: other })).json()) as { students: RosterRow[] }).students,
    ).toEqual([]);
  });
});
