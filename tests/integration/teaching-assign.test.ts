// Assign, edit and withdraw through the teacher's routes (issue 6 item 1): each refusal names its
// field, each student gets one "assignment-new" e-mail, stage 1 opens and the rest stay locked.
// Stage plans, at creation and changed later: teaching-assign-plan.test.ts.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { assignmentStudents, checkIns, emailOutbox } from "@/db/schema";
import type { AssignmentView } from "@/lib/teaching/teach-api-types";
import {
  assignBody,
  createAssignment,
  LIST,
  ONE,
  type Classroom,
  type Refusal,
  openClassroom,
} from "./helpers/assign-calls";
import { dueIn, type TeachingWorld } from "./helpers/teaching-world";

let w: TeachingWorld;
let room: Classroom;
let cookie: string;

beforeAll(async () => ({ w, room, cookie } = await openClassroom()));
afterAll(async () => w?.close());

const body = (o: Record<string, unknown> = {}) => assignBody(room, o);
const create = (o: Record<string, unknown> = {}) => createAssignment(w, cookie, room, o);

describe("creating an assignment", () => {
  it("opens stage 1 for each student, locks the rest, and e-mails each student once", async () => {
    const made = await create();
    expect(made.assignmentStudentIds).toHaveLength(2);
    for (const asId of made.assignmentStudentIds)
      expect(await w.states(asId)).toEqual(["open", "locked", "locked", "locked"]);
    for (const s of room.students) {
      const mails = (await w.mailsTo(s.email)).filter((m) => m.template === "assignment-new");
      const forThis = mails.filter((m) =>
        made.assignmentStudentIds.some((id) => m.dedupeKey === `assignment-new:${id}`),
      );
      expect(forThis).toHaveLength(1);
      // The e-mail names this student's own assignment row (the rows are inserted together).
      const asId = forThis[0].dedupeKey?.slice("assignment-new:".length) ?? "";
      expect(
        (
          await w.db
            .select({ s: assignmentStudents.studentId })
            .from(assignmentStudents)
            .where(eq(assignmentStudents.id, asId))
        )[0]?.s,
      ).toBe(s.id);
      expect(forThis[0].payload).toMatchObject({
        studentName: s.name,
        note: "Mind the rolls.",
      });
    }
    const keys = await w.db
      .select({ k: emailOutbox.dedupeKey })
      .from(emailOutbox)
      .where(eq(emailOutbox.template, "assignment-new"));
    expect(keys.filter((k) => made.assignmentStudentIds.some((id) => k.k === `assignment-new:${id}`))).toHaveLength(2);
  });

  it("takes the due date on the student's own wall clock when there is one student", async () => {
    await w.setUser(room.students[0].id, { timeZone: "America/New_York" });
    const made = await create({
      studentIds: [room.students[0].id],
      dueLocal: "2099-12-11T18:00",
    });
    const view = (await (await w.call(ONE, "GET", { cookie, params: { id: made.id } })).json()) as AssignmentView;
    // New York is UTC−5 in December (IANA time zone database).
    expect(view.dueAt).toBe("2099-12-11T23:00:00.000Z");
    expect([view.dueLocal, view.dueZone]).toEqual(["2099-12-11T18:00", "America/New_York"]);
    const mail = (await w.mailsTo(room.students[0].email)).find(
      (m) => m.dedupeKey === `assignment-new:${made.assignmentStudentIds[0]}`,
    );
    expect(mail?.payload).toMatchObject({
      dueLocal: "Friday 11 December, 18:00",
    });
    await w.setUser(room.students[0].id, { timeZone: "UTC" });
  });

  it("refuses a past due date, naming the field", async () => {
    const res = await w.call(LIST, "POST", {
      cookie,
      body: body({ dueLocal: "2020-01-01T10:00" }),
    });
    expect(res.status).toBe(422);
    expect(((await res.json()) as Refusal).fieldErrors?.dueLocal).toMatch(/in the past/);
  });

  it("refuses a student not on the roster", async () => {
    const stranger = await w.person("student");
    const res = await w.call(LIST, "POST", {
      cookie,
      body: body({ studentIds: [room.students[0].id, stranger.id] }),
    });
    expect(res.status).toBe(422);
    expect(((await res.json()) as Refusal).fieldErrors?.studentIds).toBe(
      "One of the chosen students is not on your roster.",
    );
  });

  it("refuses another teacher's tune like a missing one", async () => {
    const other = await w.person("teacher");
    const theirs = await w.tuneOf(other.id, "Not yours");
    for (const tuneId of [theirs, "00000000-0000-4000-8000-000000000000"]) {
      const res = await w.call(LIST, "POST", {
        cookie,
        body: body({ tuneId }),
      });
      expect(res.status).toBe(422);
      expect(((await res.json()) as Refusal).fieldErrors?.tuneId).toBe("Choose one of your own tunes.");
    }
  });

  it("refuses self check-in without minutes, and a stage plan the tune can't take", async () => {
    const res = await w.call(LIST, "POST", {
      cookie,
      body: body({ unlockRule: "self_check_in" }),
    });
    expect(res.status).toBe(422);
    expect(((await res.json()) as Refusal).fieldErrors?.unlockMinutes).toMatch(/practice minutes/);
    const bad = await w.call(LIST, "POST", {
      cookie,
      body: body({ stagePlan: { stages: [] } }),
    });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as Refusal).fieldErrors?.stagePlan).toBeTruthy();
    // The engine's own plan rule (lib/abc/stages.ts): every kind comes back by the last stage.
    const short = {
      stages: [
        { name: "Bare", adds: [] },
        { name: "Bowing", adds: ["bowing"] },
      ],
    };
    const res2 = await w.call(LIST, "POST", {
      cookie,
      body: body({ stagePlan: short }),
    });
    expect(res2.status).toBe(422);
    expect(((await res2.json()) as Refusal).fieldErrors?.stagePlan).toMatch(/never added back/);
  });
});

describe("editing and withdrawing", () => {
  it("changes due date, note and rule; refuses a past date; withdraws once", async () => {
    const made = await create();
    const patch = (b: Record<string, unknown>) => w.call(ONE, "PATCH", { cookie, params: { id: made.id }, body: b });
    const ok = await patch({
      dueLocal: "2099-01-02T09:00",
      note: "New note",
      unlockRule: "self_check_in",
      unlockMinutes: 45,
    });
    expect(ok.status).toBe(200);
    expect(await ok.json()).toMatchObject({
      dueAt: "2099-01-02T09:00:00.000Z",
      note: "New note",
      unlockRule: "self_check_in",
      unlockMinutes: 45,
    });
    const past = await patch({ dueLocal: "2001-01-01T09:00" });
    expect(past.status).toBe(422);
    expect(((await past.json()) as Refusal).fieldErrors?.dueLocal).toMatch(/in the past/);

    const gone = await w.call(ONE, "DELETE", {
      cookie,
      params: { id: made.id },
    });
    expect(gone.status).toBe(200);
    expect(((await gone.json()) as AssignmentView).status).toBe("withdrawn");
    expect((await w.call(ONE, "DELETE", { cookie, params: { id: made.id } })).status).toBe(409);
    expect((await patch({ note: "too late" })).status).toBe(409);
  });

  it("withdrawing an assignment withdraws the check-ins still waiting for review, and only those", async () => {
    const made = await create({ studentIds: [room.students[0].id] });
    const other = await create({ studentIds: [room.students[0].id] });
    const waiting = await w.checkIn(made.assignmentStudentIds[0]);
    const elsewhere = await w.checkIn(other.assignmentStudentIds[0]);
    const gone = await w.call(ONE, "DELETE", { cookie, params: { id: made.id } });
    expect(gone.status).toBe(200);
    const statusOf = async (id: string) =>
      (await w.db.select({ status: checkIns.status }).from(checkIns).where(eq(checkIns.id, id)))[0]?.status;
    expect(await statusOf(waiting)).toBe("withdrawn");
    expect(await statusOf(elsewhere)).toBe("waiting"); // another assignment's check-in is untouched
  });

  it("pages the list: 20 to a page, open before withdrawn, the latest due first, and the total", async () => {
    const teacher = await w.person("teacher");
    const student = await w.person("student");
    const { addToRoster } = await import("@/db/queries/auth");
    await addToRoster(w.db, teacher.id, student.id);
    const tune = await w.tuneOf(teacher.id);
    const mine = await w.cookieFor(teacher.id);
    const made: string[] = [];
    for (let i = 1; i <= 23; i++) {
      const res = await w.call(LIST, "POST", {
        cookie: mine,
        body: { tuneId: tune, studentIds: [student.id], dueLocal: dueIn(i) },
      });
      expect(res.status).toBe(201);
      made.push(((await res.json()) as { id: string }).id);
    }
    // The one due last is withdrawn: it goes to the end, after every open one.
    expect((await w.call(ONE, "DELETE", { cookie: mine, params: { id: made[22] } })).status).toBe(200);
    type Page = { assignments: AssignmentView[]; total: number; page: number; pageSize: number };
    const first = (await (await w.call(LIST, "GET", { cookie: mine })).json()) as Page;
    expect(first).toMatchObject({ total: 23, page: 1, pageSize: 20 });
    expect(first.assignments.map((a) => a.id)).toEqual(made.slice(2, 22).reverse());
    const second = (await (await w.call(LIST, "GET", { cookie: mine, query: "?page=2" })).json()) as Page;
    expect(second.assignments.map((a) => a.id)).toEqual([made[1], made[0], made[22]]);
    const past = (await (await w.call(LIST, "GET", { cookie: mine, query: "?page=3" })).json()) as Page;
    expect(past).toMatchObject({ assignments: [], total: 23 });
    const bad = await w.call(LIST, "GET", { cookie: mine, query: "?page=0" });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as Refusal).fieldErrors?.page).toBe("Pages start at 1.");
  });

  it("lists only the teacher's own; another teacher gets 404 on one of them", async () => {
    const made = await create();
    const list = (await (await w.call(LIST, "GET", { cookie })).json()) as {
      assignments: AssignmentView[];
    };
    expect(list.assignments.some((a) => a.id === made.id)).toBe(true);
    const other = await w.cookieFor((await w.person("teacher")).id);
    const theirs = (await (await w.call(LIST, "GET", { cookie: other })).json()) as { assignments: AssignmentView[] };
    expect(theirs.assignments).toEqual([]);
    expect((await w.call(ONE, "GET", { cookie: other, params: { id: made.id } })).status).toBe(404);
  });
});
