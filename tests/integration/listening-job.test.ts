// The listening aid as a job against a real database, the S3 stand-in and the real worker: a check-in
// with a rendered recording is heard and the result kept with the check-in, shown in the teacher's
// review queue and the student's self-check; a check-in is saved even when no queue exists yet, and a
// recording that cannot be heard is kept as a failure while the check-in waits for review as before.
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { checkInListenings, checkIns, stageStates, tuneStages, uploads } from "@/db/schema";
import type { RunningWorker } from "@/lib/jobs/worker";
import { hearCheckIn } from "@/lib/jobs/listen";
import { renderRecording } from "@/lib/listen/recording";
import { presignPut } from "@/lib/storage/s3";
import type { LearnAssignment } from "@/lib/teaching/learn-assignment";
import type { ReviewItem } from "@/lib/teaching/teach-api-types";
import type { ResendFake } from "@/scripts/fakes/resend";
import { makeAssignment } from "./helpers/learning-matrix-rows";
import { FAKE_KEY, testMailer } from "./helpers/mail";
import { ensureS3, putTicket } from "./helpers/recordings-world";
import { teachWorld } from "./helpers/teach-world";

type World = Awaited<ReturnType<typeof teachWorld>>;
let s3: { close: () => Promise<void> };
let w: World;
let fake: ResendFake;
let worker: RunningWorker | undefined;
let teacher: { id: string; cookie: string };
let student: { id: string; cookie: string };

beforeAll(async () => {
  s3 = await ensureS3();
  w = await teachWorld();
  const { startResendFake } = await import("@/scripts/fakes/resend");
  fake = await startResendFake({ port: 0, apiKey: FAKE_KEY });
  const t = await w.person("teacher");
  const s = await w.person("student");
  teacher = { id: t.id, cookie: await w.cookieFor(t.id) };
  student = { id: s.id, cookie: await w.cookieFor(s.id) };
});
afterAll(async () => {
  await worker?.stop();
  await fake?.close();
  await w?.close();
  await s3?.close();
});

/** An assignment of a fresh tune to the student, and its stage 1's ABC. */
async function assignment() {
  const f = await makeAssignment(w.db, { teacherId: teacher.id, studentIds: [student.id] });
  const [stage] = await w.db
    .select({ abc: tuneStages.abc })
    .from(tuneStages)
    .where(and(eq(tuneStages.tuneId, f.tuneId), eq(tuneStages.index, 1)));
  return { id: f.students[student.id], abc: stage.abc };
}

/** Stores bytes as the student's recording for stage 1, as the upload routes would. */
async function storedRecording(assignmentStudentId: string, bytes: Uint8Array<ArrayBuffer>, contentType: string) {
  const key = `recordings/${student.id}/${randomUUID()}`;
  expect((await putTicket(await presignPut(key, contentType, bytes.length), bytes)).status).toBe(200);
  const [row] = await w.db
    .insert(uploads)
    .values({
      ownerId: student.id,
      storageKey: key,
      contentType,
      sizeBytes: bytes.length,
      assignmentStudentId,
      stageIndex: 1,
      status: "stored",
    })
    .returning({ id: uploads.id });
  return row.id;
}

async function checkIn(assignmentStudentId: string, uploadId: string): Promise<string> {
  const res = await w.call("learn/assignments/[id]/check-ins", "POST", {
    cookie: student.cookie,
    params: { id: assignmentStudentId },
    body: { stageIndex: 1, uploadId, selfRating: 4, fromMemory: false },
  });
  expect(res.status).toBe(201);
  return ((await res.json()) as { checkIn: { checkInId: string } }).checkIn.checkInId;
}

async function heard(checkInId: string, seconds = 90) {
  const deadline = Date.now() + seconds * 1000;
  for (;;) {
    const [row] = await w.db.select().from(checkInListenings).where(eq(checkInListenings.checkInId, checkInId));
    if (row) return row;
    if (Date.now() > deadline) throw new Error(`check-in ${checkInId} was not heard within ${seconds} s`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

async function reviewItem(checkInId: string): Promise<ReviewItem | undefined> {
  const res = await w.call("teach/review", "GET", { cookie: teacher.cookie });
  expect(res.status).toBe(200);
  return ((await res.json()) as { checkIns: ReviewItem[] }).checkIns.find((c) => c.checkInId === checkInId);
}

describe("the listening aid's job", () => {
  let good: { checkInId: string; missedBars: number[] };
  let bad: { checkInId: string; assignmentStudentId: string };

  it("saves check-ins before any worker has made the queue: nothing waits on the aid", async () => {
    const a = await assignment();
    const rendered = await renderRecording(a.abc, {
      bpm: 96,
      voice: "tone",
      seed: 21,
      faults: { missed: 0.12 },
      format: "mp3",
    });
    const missedBars = [...new Set(rendered.performance.truth.filter((t) => t.played === "missed").map((t) => t.bar))];
    expect(missedBars.length).toBeGreaterThan(0);
    const checkInId = await checkIn(a.id, await storedRecording(a.id, new Uint8Array(rendered.bytes), "audio/mpeg"));
    good = { checkInId, missedBars };

    const b = await assignment();
    const notAudio = new Uint8Array(Buffer.from("RIFF but not really a recording at all"));
    bad = {
      checkInId: await checkIn(b.id, await storedRecording(b.id, notAudio, "audio/wav")),
      assignmentStudentId: b.id,
    };

    const [row] = await w.db.select({ status: checkIns.status }).from(checkIns).where(eq(checkIns.id, checkInId));
    expect(row.status).toBe("waiting");
    // No worker yet: the review queue shows both check-ins, their recordings still to be heard.
    expect((await reviewItem(checkInId))?.listening).toEqual({ state: "listening" });
    expect((await reviewItem(bad.checkInId))?.listening).toEqual({ state: "listening" });
  });

  it("the worker hears them: the result with the check-in, in the review queue and the student's self-check", async () => {
    const { startWorker } = await import("@/lib/jobs/worker");
    worker = await startWorker({
      databaseUrl: process.env.DATABASE_URL,
      mailer: testMailer(fake.url),
      reminders: { intervalSeconds: 3600 },
      sweep: { intervalSeconds: 3600, minAgeSeconds: 3600 },
      uploads: { intervalSeconds: 3600 },
      listening: { intervalSeconds: 3600, minAgeSeconds: 3600 },
      log: () => {},
    }); // its start-up sweep queues the check-ins no job was made for

    const row = await heard(good.checkInId);
    expect(row.status).toBe("done");
    const item = await reviewItem(good.checkInId);
    expect(item?.listening?.state).toBe("done");
    if (item?.listening?.state !== "done") throw new Error("not heard");
    const result = item.listening.result;
    const checked = result.bars.filter((b) => b.verdict === "check").map((b) => b.bar);
    for (const bar of good.missedBars) expect(checked).toContain(bar);
    expect(result.summary).toMatch(/bars? to listen to/);
    expect(result.tempo.start).toBeGreaterThan(96 * 0.97);
    expect(result.tempo.start).toBeLessThan(96 * 1.03);

    const assignmentStudentId = (
      await w.db
        .select({ id: stageStates.assignmentStudentId })
        .from(checkIns)
        .innerJoin(stageStates, eq(stageStates.id, checkIns.stageStateId))
        .where(eq(checkIns.id, good.checkInId))
    )[0].id;
    if (!assignmentStudentId) throw new Error("this check-in belongs to an assignment");
    const res = await w.call("learn/assignments/[id]", "GET", {
      cookie: student.cookie,
      params: { id: assignmentStudentId },
    });
    const mine = (await res.json()) as LearnAssignment;
    expect(mine.selfCheck?.checkInId).toBe(good.checkInId);
    expect(mine.selfCheck?.listening?.state).toBe("done");
    expect(mine.selfCheck?.abc).toContain("K:");
  });

  it("keeps a recording it cannot hear as a failure with its reason; the check-in still waits for the teacher", async () => {
    const row = await heard(bad.checkInId);
    expect(row.status).toBe("failed");
    expect(row.error).toMatch(/could not be read as audio/);
    const item = await reviewItem(bad.checkInId);
    expect(item?.listening).toMatchObject({ state: "failed" });
    const [c] = await w.db.select({ status: checkIns.status }).from(checkIns).where(eq(checkIns.id, bad.checkInId));
    expect(c.status).toBe("waiting");
    // The teacher signs it off as ever.
    const signed = await w.call("teach/review/[checkInId]", "POST", {
      cookie: teacher.cookie,
      params: { checkInId: bad.checkInId },
      body: { outcome: "signed_off", feedback: "Lovely, though the file would not play here." },
    });
    expect(signed.status).toBe(200);
  });

  it("a check-in made while the worker runs is queued at once and heard; hearing it again replaces the result", async () => {
    const a = await assignment();
    const rendered = await renderRecording(a.abc, { bpm: 90, voice: "tone", seed: 5, format: "wav" });
    const checkInId = await checkIn(a.id, await storedRecording(a.id, new Uint8Array(rendered.bytes), "audio/wav"));
    const row = await heard(checkInId);
    expect(row.status).toBe("done");
    const first = row.createdAt;
    expect(await hearCheckIn(w.db, checkInId)).toBe("done");
    const rows = await w.db.select().from(checkInListenings).where(eq(checkInListenings.checkInId, checkInId));
    expect(rows).toHaveLength(1);
    expect(rows[0].createdAt.getTime()).toBeGreaterThanOrEqual(first.getTime());
    const item = await reviewItem(checkInId);
    if (item?.listening?.state !== "done") throw new Error("not heard");
    expect(item.listening.result.bars.filter((b) => b.verdict !== "clean")).toEqual([]);
  });
});
