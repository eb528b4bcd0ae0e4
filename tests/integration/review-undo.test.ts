// "Needs more time" asks for a sentence and can be undone for 10 minutes (issue "From paying to
// playing", item 5) against PostgreSQL: the note waits in the outbox that long, the sweeper leaves it
// alone meanwhile, and an undo puts the check-in back in the queue with nothing sent.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emailOutbox } from "@/db/schema";
import { teachingWorld, type TeachingWorld } from "./helpers/teaching-world";

let w: TeachingWorld;
let room: Awaited<ReturnType<TeachingWorld["classroom"]>>;
let cookie: string;
let R: typeof import("@/lib/teaching/review");

beforeAll(async () => {
  w = await teachingWorld();
  room = await w.classroom(1);
  cookie = await w.cookieFor(room.teacher.id);
  R = await import("@/lib/teaching/review");
});
afterAll(async () => w?.close());

async function waitingCheckIn() {
  const made = await w.assign(room.teacher, { tuneId: room.tuneId, studentIds: [room.students[0].id] });
  const id = made.assignmentStudentIds[0];
  return { assignmentStudentId: id, checkInId: await w.checkIn(id) };
}

const review = (checkInId: string, outcome: string, feedback: string) =>
  w.call("teach/review/[checkInId]", "POST", { cookie, params: { checkInId }, body: { outcome, feedback } });
const undo = (checkInId: string, c = cookie) =>
  w.call("teach/review/[checkInId]/undo", "POST", { cookie: c, params: { checkInId } });
const noteOf = async (checkInId: string) =>
  (
    await w.db
      .select()
      .from(emailOutbox)
      .where(eq(emailOutbox.dedupeKey, `checkin-feedback:${checkInId}`))
  )[0];

describe("needs more time", () => {
  it("asks for a sentence for the student, naming the field", async () => {
    const { checkInId, assignmentStudentId } = await waitingCheckIn();
    for (const feedback of ["", "Slower."]) {
      const res = await review(checkInId, "needs_more_time", feedback);
      expect(res.status).toBe(422);
      const body = (await res.json()) as { error: string; fieldErrors: Record<string, string> };
      expect(body.fieldErrors.feedback).toMatch(/in a sentence/);
    }
    expect(await w.states(assignmentStudentId)).toEqual(["checked_in", "locked", "locked", "locked"]);
    expect(await noteOf(checkInId)).toBeUndefined();
  });

  it("holds the note for 10 minutes; the sweeper leaves it; an undo puts the check-in back with nothing sent", async () => {
    const { checkInId, assignmentStudentId } = await waitingCheckIn();
    const before = Date.now();
    expect((await review(checkInId, "needs_more_time", "Keep the long notes their full length.")).status).toBe(200);
    const note = await noteOf(checkInId);
    expect(note.status).toBe("queued");
    const held = (note.sendAfter?.getTime() ?? 0) - before;
    expect(held).toBeGreaterThanOrEqual(10 * 60_000 - 1000);
    expect(held).toBeLessThan(10 * 60_000 + 60_000);
    // A sweep of every queued row, whatever its age, skips a note still held back.
    const { sweepOutbox } = await import("@/lib/jobs/sweeper");
    const sent: string[] = [];
    const boss = { send: async (_q: string, data: { outboxId: string }) => (sent.push(data.outboxId), "job") };
    await sweepOutbox(w.db, boss as never, { minAgeSeconds: 0, slotSeconds: 60 });
    expect(sent).not.toContain(note.id);

    expect((await undo(checkInId, await w.cookieFor(room.students[0].id))).status).toBe(403);
    expect((await undo(checkInId, await w.cookieFor((await w.person("teacher")).id))).status).toBe(404);
    const res = await undo(checkInId);
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ state: "checked_in", checkInStatus: "waiting" });
    expect(await noteOf(checkInId)).toBeUndefined();
    expect(await w.states(assignmentStudentId)).toEqual(["checked_in", "locked", "locked", "locked"]);
    expect((await w.checkInRow(checkInId)).status).toBe("waiting");
    // It is back in the queue, and can be reviewed again — this time its note goes out.
    const queue = (await (await w.call("teach/review", "GET", { cookie })).json()) as {
      checkIns: { checkInId: string }[];
    };
    expect(queue.checkIns.some((c) => c.checkInId === checkInId)).toBe(true);
    expect((await undo(checkInId)).status).toBe(409);
    expect((await review(checkInId, "signed_off", "That's it.")).status).toBe(200);
    expect((await noteOf(checkInId)).payload).toMatchObject({ outcome: "signed_off" });
  });

  it("cannot be undone after 10 minutes, nor once the student has checked in again", async () => {
    const { checkInId, assignmentStudentId } = await waitingCheckIn();
    const at = new Date();
    await R.reviewCheckIn(
      w.db,
      room.teacher,
      { checkInId, outcome: "needs_more_time", feedback: "Mind the bar lines." },
      at,
    );
    await expect(R.undoReview(w.db, room.teacher, checkInId, new Date(at.getTime() + 10 * 60_000))).rejects.toThrow(
      /can be undone for 10 minutes/,
    );
    expect(await w.states(assignmentStudentId)).toEqual(["open", "locked", "locked", "locked"]);
    await w.checkIn(assignmentStudentId);
    await expect(R.undoReview(w.db, room.teacher, checkInId, new Date(at.getTime() + 60_000))).rejects.toThrow(
      /moved on/,
    );
  });
});
