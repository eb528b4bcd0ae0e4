// Stage plans through the teacher's routes (issue 6 item 1): a plan given at creation builds the
// students' stages; a changed plan remakes them until someone checks in, and a plan change racing a
// check-in never loses the check-in.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  assignBody,
  BARE_THEN_ALL,
  createAssignment,
  LIST,
  ONE,
  type Classroom,
  type Refusal,
  openClassroom,
} from "./helpers/assign-calls";
import type { TeachingWorld } from "./helpers/teaching-world";

let w: TeachingWorld;
let room: Classroom;
let cookie: string;

beforeAll(async () => ({ w, room, cookie } = await openClassroom()));
afterAll(async () => w?.close());

const create = (o: Record<string, unknown> = {}) => createAssignment(w, cookie, room, o);

describe("a stage plan at creation", () => {
  it("builds the stages from a changed plan", async () => {
    const res = await w.call(LIST, "POST", {
      cookie,
      body: assignBody(room, { stagePlan: BARE_THEN_ALL }),
    });
    if (res.status !== 201) throw new Error(JSON.stringify(await res.json()));
    const made = (await res.json()) as { assignmentStudentIds: string[] };
    expect(await w.states(made.assignmentStudentIds[0])).toEqual(["open", "locked"]);
  });
});

describe("changing the stage plan", () => {
  it("a new stage plan before any check-in remakes every student's stages: stage 1 open, the rest locked", async () => {
    const made = await create();
    expect(made.assignmentStudentIds).toHaveLength(2);
    const res = await w.call(ONE, "PATCH", { cookie, params: { id: made.id }, body: { stagePlan: BARE_THEN_ALL } });
    expect(res.status).toBe(200);
    for (const asId of made.assignmentStudentIds) expect(await w.states(asId)).toEqual(["open", "locked"]);
  });

  it("refuses a new stage plan once someone has checked in", async () => {
    const made = await create();
    await w.checkIn(made.assignmentStudentIds[0]);
    const res = await w.call(ONE, "PATCH", {
      cookie,
      params: { id: made.id },
      body: { stagePlan: BARE_THEN_ALL },
    });
    expect(res.status).toBe(422);
    expect(((await res.json()) as Refusal).fieldErrors?.stagePlan).toMatch(/checked in already/);
  });

  it("a plan change racing a check-in leaves one consistent result, never a lost check-in", async () => {
    const made = await create({ studentIds: [room.students[0].id] });
    const asId = made.assignmentStudentIds[0];
    const [edit, checkIn] = await Promise.allSettled([
      w.call(ONE, "PATCH", { cookie, params: { id: made.id }, body: { stagePlan: BARE_THEN_ALL } }),
      w.checkIn(asId),
    ]);
    const states = await w.states(asId);
    if (checkIn.status === "fulfilled") {
      // The check-in won: it stays, and the plan change was refused.
      expect(edit.status === "fulfilled" && edit.value.status).toBe(422);
      expect(states).toEqual(["checked_in", "locked", "locked", "locked"]);
      expect((await w.checkInRow(checkIn.value)).status).toBe("waiting");
    } else {
      // The edit won: the old stage row is gone, so the check-in found nothing to check in on.
      expect(edit.status === "fulfilled" && edit.value.status).toBe(200);
      expect(checkIn.reason).toMatchObject({ status: 404 });
      expect(states).toEqual(["open", "locked"]);
    }
  });

  it("an unchanged plan sent back after check-ins is accepted and changes nothing", async () => {
    const made = await create({ stagePlan: BARE_THEN_ALL });
    await w.checkIn(made.assignmentStudentIds[0]);
    // jsonb stores its keys in its own order; the same plan must still read as the same.
    const res = await w.call(ONE, "PATCH", {
      cookie,
      params: { id: made.id },
      body: { stagePlan: BARE_THEN_ALL, note: "Same plan" },
    });
    expect(res.status).toBe(200);
    expect(await w.states(made.assignmentStudentIds[0])).toEqual(["checked_in", "locked"]);
  });
});
