// The student's check-in through its routes against a real database: one waiting check-in however
// often or concurrently it is sent, withdrawing before review, refusals (locked stage, someone
// else's assignment, an upload not stored or not theirs, the membership gate), the self_check_in
// rule below and above its minutes, and the other student's stage staying locked after a sign-off.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { checkIns, stageStates } from "@/db/schema";
import type { LearnAssignment } from "@/lib/teaching/learn-assignment";
import { giveMembership, makeAssignment, makePractice, makeUpload } from "./helpers/learning-matrix-rows";
import { teachWorld } from "./helpers/teach-world";

type World = Awaited<ReturnType<typeof teachWorld>>;
let w: World;
let teacherId: string;
let ann: { id: string; cookie: string };
let ben: { id: string; cookie: string };

beforeAll(async () => {
  w = await teachWorld();
  teacherId = (await w.person("teacher")).id;
  const a = await w.person("student");
  const b = await w.person("student");
  ann = { id: a.id, cookie: await w.cookieFor(a.id) };
  ben = { id: b.id, cookie: await w.cookieFor(b.id) };
});
afterAll(async () => w?.close());

const post = (who: { cookie: string }, id: string, body: Record<string, unknown>) =>
  w.call("learn/assignments/[id]/check-ins", "POST", { cookie: who.cookie, params: { id }, body });
const view = async (who: { cookie: string }, id: string) => {
  const res = await w.call("learn/assignments/[id]", "GET", { cookie: who.cookie, params: { id } });
  expect(res.status).toBe(200);
  return (await res.json()) as LearnAssignment;
};

async function fresh(o: Parameters<typeof makeAssignment>[1] extends infer P ? Partial<P> : never = {}) {
  const f = await makeAssignment(w.db, { teacherId, studentIds: [ann.id, ben.id], ...o });
  const id = f.students[ann.id];
  return {
    ...f,
    id,
    other: f.students[ben.id],
    upload: await makeUpload(w.db, { ownerId: ann.id, assignmentStudentId: id }),
  };
}

async function waitingCount(assignmentStudentId: string): Promise<number> {
  const rows = await w.db
    .select({ id: checkIns.id })
    .from(checkIns)
    .innerJoin(stageStates, eq(stageStates.id, checkIns.stageStateId))
    .where(and(eq(stageStates.assignmentStudentId, assignmentStudentId), eq(checkIns.status, "waiting")));
  return rows.length;
}

describe("check-in", () => {
  it("checks in a stored recording: the stage waits for review", async () => {
    const f = await fresh();
    const res = await post(ann, f.id, { stageIndex: 1, uploadId: f.upload, selfRating: 4, fromMemory: true });
    expect(res.status).toBe(201);
    const a = await view(ann, f.id);
    expect(a.stages[0].state).toBe("checked_in");
    expect(a.stages[0].checkIn).toMatchObject({ status: "waiting", selfRating: 4, fromMemory: true });
    expect(a.stages[1].state).toBe("locked");
  });

  it("a double check-in leaves one waiting check-in and answers 409", async () => {
    const f = await fresh();
    const body = { stageIndex: 1, uploadId: f.upload, selfRating: 3, fromMemory: false };
    expect((await post(ann, f.id, body)).status).toBe(201);
    const again = await post(ann, f.id, body);
    expect(again.status).toBe(409);
    expect(((await again.json()) as { error: string }).error).toMatch(/already checked in/);
    expect(await waitingCount(f.id)).toBe(1);
  });

  it("two concurrent check-ins leave one waiting check-in and one 409", async () => {
    const f = await fresh();
    const body = { stageIndex: 1, uploadId: f.upload, selfRating: 5, fromMemory: false };
    const statuses = (await Promise.all([post(ann, f.id, body), post(ann, f.id, body)])).map((r) => r.status).sort();
    expect(statuses).toEqual([201, 409]);
    expect(await waitingCount(f.id)).toBe(1);
  });

  it("withdraws a check-in before review: the stage is open again, and a second withdraw is 409", async () => {
    const f = await fresh();
    const made = (await (
      await post(ann, f.id, { stageIndex: 1, uploadId: f.upload, selfRating: 2, fromMemory: false })
    ).json()) as { checkIn: { checkInId: string } };
    const del = () =>
      w.call("learn/check-ins/[checkInId]", "DELETE", {
        cookie: ann.cookie,
        params: { checkInId: made.checkIn.checkInId },
      });
    // Another student can't withdraw it, nor learn that it exists.
    expect(
      (
        await w.call("learn/check-ins/[checkInId]", "DELETE", {
          cookie: ben.cookie,
          params: { checkInId: made.checkIn.checkInId },
        })
      ).status,
    ).toBe(404);
    expect((await del()).status).toBe(200);
    const a = await view(ann, f.id);
    expect(a.stages[0]).toMatchObject({ state: "open", checkIn: { status: "withdrawn" } });
    expect((await del()).status).toBe(409);
    // The stage can be checked in again with the same stored recording.
    expect(
      (await post(ann, f.id, { stageIndex: 1, uploadId: f.upload, selfRating: 3, fromMemory: false })).status,
    ).toBe(201);
  });

  it("refuses a locked stage with 409", async () => {
    const f = await fresh();
    const upload = await makeUpload(w.db, { ownerId: ann.id, assignmentStudentId: f.id, stageIndex: 2 });
    const res = await post(ann, f.id, { stageIndex: 2, uploadId: upload, selfRating: 3, fromMemory: false });
    expect(res.status).toBe(409);
    expect(((await res.json()) as { error: string }).error).toMatch(/locked/);
  });

  it("answers 404 on another student's assignment, for checking in and for reading", async () => {
    const f = await fresh();
    const upload = await makeUpload(w.db, { ownerId: ann.id, assignmentStudentId: f.id });
    expect((await post(ben, f.id, { stageIndex: 1, uploadId: upload, selfRating: 3, fromMemory: false })).status).toBe(
      404,
    );
    expect((await w.call("learn/assignments/[id]", "GET", { cookie: ben.cookie, params: { id: f.id } })).status).toBe(
      404,
    );
    expect(
      (await w.call("learn/assignments/[id]", "GET", { cookie: ben.cookie, params: { id: "not-a-uuid" } })).status,
    ).toBe(404);
  });

  it("refuses an upload that is not stored, or not the student's, or of another assignment (422 on uploadId)", async () => {
    const f = await fresh();
    const pending = await makeUpload(w.db, { ownerId: ann.id, assignmentStudentId: f.id, status: "pending" });
    const rejected = await makeUpload(w.db, { ownerId: ann.id, assignmentStudentId: f.id, status: "rejected" });
    const bens = await makeUpload(w.db, { ownerId: ben.id, assignmentStudentId: f.other });
    const elsewhere = (await fresh()).upload;
    for (const uploadId of [pending, rejected, bens, elsewhere, "5f0c6f1e-9a47-4d5e-8d8a-1c2b3a4d5e6f"]) {
      const res = await post(ann, f.id, { stageIndex: 1, uploadId, selfRating: 3, fromMemory: false });
      expect(res.status).toBe(422);
      expect(((await res.json()) as { fieldErrors: Record<string, string> }).fieldErrors).toHaveProperty("uploadId");
    }
    expect(await waitingCount(f.id)).toBe(0);
  });

  it("names each bad field with 422", async () => {
    const f = await fresh();
    const res = await post(ann, f.id, { stageIndex: 1, uploadId: "nope", selfRating: 6, fromMemory: "maybe" });
    expect(res.status).toBe(422);
    const { fieldErrors } = (await res.json()) as { fieldErrors: Record<string, string> };
    expect(Object.keys(fieldErrors).sort()).toEqual(["fromMemory", "selfRating", "uploadId"]);
  });

  it("keeps the music of a member-only tune closed without a membership, and opens it with one", async () => {
    const f = await fresh({ taster: false });
    const closed = await view(ann, f.id);
    expect(closed.musicOpen).toBe(false);
    expect(closed.closedWhy).toMatch(/membership plan/);
    expect(closed.music).toBeNull();
    expect(
      (await post(ann, f.id, { stageIndex: 1, uploadId: f.upload, selfRating: 3, fromMemory: false })).status,
    ).toBe(403);
    await giveMembership(w.db, ann.id);
    const open = await view(ann, f.id);
    expect(open.musicOpen).toBe(true);
    expect(open.music?.abc).toContain("K:");
    expect(
      (await post(ann, f.id, { stageIndex: 1, uploadId: f.upload, selfRating: 3, fromMemory: false })).status,
    ).toBe(201);
  });
});

describe("self_check_in rule", () => {
  const day = (d: Date) => d.toISOString().slice(0, 10);
  // The students' zone is the default Europe/London; opened yesterday so a practice day today counts either way.
  const openedAt = new Date(Date.now() - 86_400_000);

  it("below the minutes the check-in waits for the teacher", async () => {
    const f = await fresh({ unlockRule: "self_check_in", unlockMinutes: 30, openedAt });
    await makePractice(w.db, ann.id, { practisedOn: day(new Date()), minutes: 29, tuneId: f.tuneId });
    await makePractice(w.db, ann.id, { practisedOn: "2020-01-01", minutes: 500, tuneId: f.tuneId }); // before the stage opened
    expect(
      (await post(ann, f.id, { stageIndex: 1, uploadId: f.upload, selfRating: 4, fromMemory: false })).status,
    ).toBe(201);
    const a = await view(ann, f.id);
    expect(a.stages.slice(0, 2).map((s) => s.state)).toEqual(["checked_in", "locked"]);
  });

  it("at or above the minutes the check-in signs the stage off and opens the next", async () => {
    const f = await fresh({ unlockRule: "self_check_in", unlockMinutes: 30, openedAt });
    await makePractice(w.db, ann.id, { practisedOn: day(new Date()), minutes: 20, tuneId: f.tuneId });
    await makePractice(w.db, ann.id, { practisedOn: day(new Date()), minutes: 15, tuneId: f.tuneId });
    // Practice on no particular tune, or before the stage opened, does not count.
    await makePractice(w.db, ann.id, { practisedOn: "2020-01-01", minutes: 500, tuneId: f.tuneId });
    await makePractice(w.db, ann.id, { practisedOn: day(new Date()), minutes: 500, tuneId: null });
    expect(
      (await post(ann, f.id, { stageIndex: 1, uploadId: f.upload, selfRating: 4, fromMemory: false })).status,
    ).toBe(201);
    const a = await view(ann, f.id);
    expect(a.stages.slice(0, 2).map((s) => s.state)).toEqual(["signed_off", "open"]);
    expect(a.stages[0].checkIn?.status).toBe("signed_off");
    // The other student on the same assignment is untouched.
    expect((await view(ben, f.other)).stages.slice(0, 2).map((s) => s.state)).toEqual(["open", "locked"]);
  });
});

describe("after the teacher signs off", () => {
  it("opens stage 2 for that student only; the other student's stage 2 stays locked in the API", async () => {
    const f = await fresh();
    const made = (await (
      await post(ann, f.id, { stageIndex: 1, uploadId: f.upload, selfRating: 4, fromMemory: false })
    ).json()) as { checkIn: { stageStateId: string; checkInId: string } };
    const { applyTransition } = await import("@/lib/teaching/transitions");
    await applyTransition(w.db, {
      stageStateId: made.checkIn.stageStateId,
      transition: "signOff",
      actor: { id: teacherId, role: "teacher" },
      feedback: "Lovely lift.",
      checkInId: made.checkIn.checkInId,
      now: new Date(),
    });
    const mine = await view(ann, f.id);
    expect(mine.stages.slice(0, 2).map((s) => s.state)).toEqual(["signed_off", "open"]);
    expect(mine.stages[0].checkIn?.feedback).toBe("Lovely lift.");
    expect(mine.current).toBe(2);
    const theirs = await view(ben, f.other);
    expect(theirs.stages.slice(0, 2).map((s) => s.state)).toEqual(["open", "locked"]);
    // Withdrawing a reviewed check-in is refused.
    expect(
      (
        await w.call("learn/check-ins/[checkInId]", "DELETE", {
          cookie: ann.cookie,
          params: { checkInId: made.checkIn.checkInId },
        })
      ).status,
    ).toBe(409);
  });
});
