import { describe, expect, it } from "vitest";
import {
  decide,
  TRANSITIONS,
  type Actor,
  type DecideContext,
  type StageState,
  type Transition,
} from "@/lib/teaching/state-machine";

// Every transition × every state × every kind of person (issue 6 item 6, shared design's state machine).
type Who = "owner" | "otherStudent" | "teacher" | "otherTeacher" | "admin";
const ACTORS: Record<Who, Actor> = {
  owner: {
    id: "s1",
    role: "student",
    isStudentOwner: true,
    isAssignmentTeacher: false,
  },
  otherStudent: {
    id: "s2",
    role: "student",
    isStudentOwner: false,
    isAssignmentTeacher: false,
  },
  teacher: {
    id: "t1",
    role: "teacher",
    isStudentOwner: false,
    isAssignmentTeacher: true,
  },
  otherTeacher: {
    id: "t2",
    role: "teacher",
    isStudentOwner: false,
    isAssignmentTeacher: false,
  },
  admin: {
    id: "a1",
    role: "admin",
    isStudentOwner: false,
    isAssignmentTeacher: false,
  },
};
const STATES: StageState[] = ["locked", "open", "checked_in", "signed_off"];

const ctx = (state: StageState, who: Who, o: Partial<DecideContext> = {}): DecideContext => ({
  state,
  actor: ACTORS[who],
  assignmentStatus: "active",
  unlockRule: "teacher_sign_off",
  unlockMinutes: null,
  isLastStage: false,
  feedback: "Keep the bow straighter in the B part.",
  ...o,
});

/** The allowed cells of the table: transition → state → who → resulting state. Everything else is refused. */
const ALLOWED: Partial<Record<Transition, Partial<Record<StageState, Partial<Record<Who, StageState>>>>>> = {
  checkIn: { open: { owner: "checked_in" } },
  withdraw: { checked_in: { owner: "open" } },
  signOff: { checked_in: { teacher: "signed_off", admin: "signed_off" } },
  needsMoreTime: { checked_in: { teacher: "open", admin: "open" } },
};

describe("decide: the whole table", () => {
  for (const t of TRANSITIONS) {
    for (const s of STATES) {
      for (const who of Object.keys(ACTORS) as Who[]) {
        const next = ALLOWED[t]?.[s]?.[who];
        it(`${t} on ${s} by ${who} → ${next ?? "refused"}`, () => {
          const d = decide(t, ctx(s, who));
          if (next) {
            expect(d).toMatchObject({ ok: true, next });
          } else {
            expect(d.ok).toBe(false);
            // Strangers to the assignment learn nothing (404); the wrong person gets 403; the right person in the wrong state 409.
            const stranger = who === "otherStudent" || who === "otherTeacher";
            const rightPerson =
              t === "checkIn" || t === "withdraw" ? who === "owner" : who === "teacher" || who === "admin";
            // (Undoing a "needs more time" needs one to undo: without it the reviewer is answered 409.)
            if (!d.ok) expect(d.status).toBe(stranger ? 404 : rightPerson ? 409 : 403);
            if (!d.ok) expect(d.message.length).toBeGreaterThan(10);
          }
        });
      }
    }
  }
});

describe("decide: reasons", () => {
  it("refuses a check-in on a locked stage with the state named", () => {
    expect(decide("checkIn", ctx("locked", "owner"))).toEqual({
      ok: false,
      status: 409,
      message: "You can't check in: this stage is still locked.",
    });
  });
  it("refuses a double check-in", () => {
    expect(decide("checkIn", ctx("checked_in", "owner"))).toMatchObject({
      ok: false,
      status: 409,
      message: expect.stringMatching(/already checked in/),
    });
  });
  it("refuses a sign-off of a stage not checked in", () => {
    expect(decide("signOff", ctx("open", "teacher"))).toMatchObject({
      ok: false,
      status: 409,
      message: expect.stringMatching(/no check-in to review/),
    });
  });
  it("refuses a double sign-off", () => {
    expect(decide("signOff", ctx("signed_off", "teacher"))).toMatchObject({
      ok: false,
      status: 409,
      message: "This stage has already been signed off.",
    });
  });
  it("refuses the teacher checking in for the student (403) and the student signing off (403)", () => {
    expect(decide("checkIn", ctx("open", "teacher"))).toMatchObject({
      ok: false,
      status: 403,
    });
    expect(decide("signOff", ctx("checked_in", "owner"))).toMatchObject({
      ok: false,
      status: 403,
      message: expect.stringMatching(/teacher or an admin/),
    });
  });
  it("refuses everyone on a withdrawn assignment", () => {
    for (const t of TRANSITIONS) {
      for (const who of ["owner", "teacher", "admin"] as Who[]) {
        expect(decide(t, ctx("checked_in", who, { assignmentStatus: "withdrawn" }))).toMatchObject({
          ok: false,
          status: 409,
          message: expect.stringMatching(/withdrawn/),
        });
      }
    }
  });
});

describe("decide: what opens", () => {
  it("a sign-off opens the next stage, except on the last stage", () => {
    expect(decide("signOff", ctx("checked_in", "teacher"))).toMatchObject({
      ok: true,
      opensNext: true,
      checkInStatus: "signed_off",
    });
    expect(decide("signOff", ctx("checked_in", "teacher", { isLastStage: true }))).toMatchObject({
      ok: true,
      opensNext: false,
    });
  });
  it("needs more time and withdraw open nothing and reopen the stage", () => {
    expect(decide("needsMoreTime", ctx("checked_in", "admin"))).toEqual({
      ok: true,
      next: "open",
      checkInStatus: "needs_more_time",
      opensNext: false,
    });
    expect(decide("withdraw", ctx("checked_in", "owner"))).toEqual({
      ok: true,
      next: "open",
      checkInStatus: "withdrawn",
      opensNext: false,
    });
  });
  it("self check-in signs off at once when the minutes are reached, waits below them", () => {
    const rule = { unlockRule: "self_check_in" as const, unlockMinutes: 60 };
    expect(decide("checkIn", ctx("open", "owner", { ...rule, minutesSinceOpened: 60 }))).toEqual({
      ok: true,
      next: "signed_off",
      checkInStatus: "signed_off",
      opensNext: true,
    });
    expect(decide("checkIn", ctx("open", "owner", { ...rule, minutesSinceOpened: 59 }))).toEqual({
      ok: true,
      next: "checked_in",
      checkInStatus: "waiting",
      opensNext: false,
    });
  });
  it("teacher sign-off rule: a check-in waits whatever the minutes", () => {
    expect(decide("checkIn", ctx("open", "owner", { unlockMinutes: 10, minutesSinceOpened: 500 }))).toMatchObject({
      ok: true,
      next: "checked_in",
    });
  });
});

describe("decide: a course's pace", () => {
  it("self-paced: a check-in signs the stage off at once and opens the next, whatever the minutes", () => {
    expect(decide("checkIn", ctx("open", "owner", { unlockRule: "self_paced", holder: "course" }))).toEqual({
      ok: true,
      next: "signed_off",
      checkInStatus: "signed_off",
      opensNext: true,
    });
    expect(
      decide("checkIn", ctx("open", "owner", { unlockRule: "self_paced", holder: "course", isLastStage: true })),
    ).toMatchObject({ ok: true, next: "signed_off", opensNext: false });
  });
  it("teacher sign-off on a course: the check-in waits, and the enrolment's teacher signs it off", () => {
    const course = { holder: "course" as const };
    expect(decide("checkIn", ctx("open", "owner", course))).toMatchObject({ ok: true, next: "checked_in" });
    expect(decide("signOff", ctx("checked_in", "teacher", course))).toMatchObject({ ok: true, opensNext: true });
  });
  it("a course stage of an enrolment that is not active changes for nobody, in the course's words", () => {
    expect(
      decide(
        "checkIn",
        ctx("open", "owner", { holder: "course", unlockRule: "self_paced", assignmentStatus: "withdrawn" }),
      ),
    ).toEqual({ ok: false, status: 409, message: "This enrolment is not active; its stages can't change." });
    expect(decide("checkIn", ctx("open", "otherStudent", { holder: "course" }))).toMatchObject({
      ok: false,
      status: 404,
      message: "Stage not found.",
    });
  });
});

describe("decide: needs more time asks for a sentence and can be undone for 10 minutes", () => {
  it("refuses needs more time without a sentence (fewer than three words), naming the field", () => {
    for (const feedback of [undefined, "", "   ", "Slower.", "More practice"]) {
      expect(decide("needsMoreTime", ctx("checked_in", "teacher", { feedback }))).toMatchObject({
        ok: false,
        status: 422,
        field: "feedback",
      });
    }
    expect(decide("needsMoreTime", ctx("checked_in", "teacher", { feedback: "Slower, and steadier." }))).toMatchObject({
      ok: true,
      next: "open",
    });
  });
  it("a sign-off needs no words", () => {
    expect(decide("signOff", ctx("checked_in", "teacher", { feedback: "" }))).toMatchObject({ ok: true });
  });

  const reviewedAt = new Date("2026-12-05T10:00:00Z");
  const last = { status: "needs_more_time" as const, reviewedAt, reviewedBy: "t1" };
  const at = (minutes: number) => new Date(reviewedAt.getTime() + minutes * 60_000);
  it("undoes within 10 minutes, by whoever gave it: the check-in waits again", () => {
    expect(decide("undoNeedsMoreTime", ctx("open", "teacher", { lastReview: last, now: at(9.9) }))).toEqual({
      ok: true,
      next: "checked_in",
      checkInStatus: "waiting",
      opensNext: false,
    });
  });
  it("refuses at 10 minutes and after, to another reviewer, and once the student moved on", () => {
    expect(decide("undoNeedsMoreTime", ctx("open", "teacher", { lastReview: last, now: at(10) }))).toMatchObject({
      ok: false,
      status: 409,
      message: expect.stringMatching(/10 minutes/),
    });
    expect(decide("undoNeedsMoreTime", ctx("open", "admin", { lastReview: last, now: at(1) }))).toMatchObject({
      ok: false,
      status: 403,
    });
    expect(decide("undoNeedsMoreTime", ctx("checked_in", "teacher", { lastReview: last, now: at(1) }))).toMatchObject({
      ok: false,
      status: 409,
      message: expect.stringMatching(/moved on/),
    });
    expect(
      decide(
        "undoNeedsMoreTime",
        ctx("open", "teacher", { lastReview: { ...last, status: "signed_off" }, now: at(1) }),
      ),
    ).toMatchObject({ ok: false, status: 409 });
    expect(decide("undoNeedsMoreTime", ctx("open", "owner", { lastReview: last, now: at(1) }))).toMatchObject({
      ok: false,
      status: 403,
    });
  });
});
