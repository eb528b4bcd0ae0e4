// Abandoned uploads (lib/storage/cleanup.ts) against the S3 stand-in and through the real worker:
// a recording asked for more than a day ago and never completed loses its row and its object; a recent
// one, a stored one and their objects stay.
import { eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { uploads } from "@/db/schema";
import type { RunningWorker } from "@/lib/jobs/worker";
import { headObject, presignPut } from "@/lib/storage/s3";
import type { ResendFake } from "@/scripts/fakes/resend";
import { authWorld, type AuthWorld } from "./helpers/auth-world";
import { FAKE_KEY, testMailer } from "./helpers/mail";
import { ensureS3, putTicket, wavBytes } from "./helpers/recordings-world";

let s3: { close: () => Promise<void> };
let w: AuthWorld;
let fake: ResendFake;
let worker: RunningWorker | undefined;
const now = new Date("2031-05-01T12:00:00Z");
const HOUR = 3_600_000;

beforeAll(async () => {
  s3 = await ensureS3();
  w = await authWorld();
  const { startResendFake } = await import("@/scripts/fakes/resend");
  fake = await startResendFake({ port: 0, apiKey: FAKE_KEY });
});
afterAll(async () => {
  await worker?.stop();
  await fake?.close();
  await w?.close();
  await s3?.close();
});

/** An upload row asked for `hoursAgo` hours before `now`, with its object in storage when `withObject`. */
async function upload(
  ownerId: string,
  label: string,
  hoursAgo: number,
  status: "pending" | "stored",
  withObject: boolean,
) {
  const key = `recordings/cleanup-test/${label}-${Date.now()}.wav`;
  const bytes = wavBytes(400);
  if (withObject) expect((await putTicket(await presignPut(key, "audio/wav", bytes.length), bytes)).status).toBe(200);
  const [row] = await w.db
    .insert(uploads)
    .values({
      ownerId,
      storageKey: key,
      contentType: "audio/wav",
      sizeBytes: bytes.length,
      status,
      createdAt: new Date(now.getTime() - hoursAgo * HOUR),
    })
    .returning({ id: uploads.id });
  return { id: row.id, key };
}

describe("abandoned uploads", () => {
  it("the worker deletes pending uploads older than a day, row and object, and keeps the rest", async () => {
    const student = await w.person("student");
    const abandoned = await upload(student.id, "abandoned", 25, "pending", true);
    const neverArrived = await upload(student.id, "never-arrived", 30, "pending", false);
    const recent = await upload(student.id, "recent", 1, "pending", true);
    const stored = await upload(student.id, "stored", 72, "stored", true);

    const { startWorker } = await import("@/lib/jobs/worker");
    worker = await startWorker({
      databaseUrl: process.env.DATABASE_URL,
      mailer: testMailer(fake.url),
      reminders: { intervalSeconds: 3600 },
      sweep: { intervalSeconds: 3600, minAgeSeconds: 3600 },
      uploads: { intervalSeconds: 3600 },
      clock: () => now,
      log: () => {},
    }); // its start-up pass cleans

    const left = await w.db
      .select({ id: uploads.id })
      .from(uploads)
      .where(inArray(uploads.id, [abandoned.id, neverArrived.id, recent.id, stored.id]));
    expect(new Set(left.map((r) => r.id))).toEqual(new Set([recent.id, stored.id]));
    expect(await headObject(abandoned.key)).toBeNull();
    expect(await headObject(recent.key)).not.toBeNull();
    expect(await headObject(stored.key)).not.toBeNull();
    // Nothing more to do on the next pass.
    expect(await worker.cleanUploadsNow()).toBe(0);
    const [kept] = await w.db.select({ status: uploads.status }).from(uploads).where(eq(uploads.id, stored.id));
    expect(kept.status).toBe("stored");
  });
});
