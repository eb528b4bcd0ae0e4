import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emailOutbox } from "@/db/schema";
import { enqueueEmail } from "@/lib/mail/outbox";
import { sendOutboxEmail } from "@/lib/mail/send";
import { createTestDatabase } from "./helpers/db";
import { startMailWorld, testMailer, waitFor } from "./helpers/mail";

let database: Awaited<ReturnType<typeof createTestDatabase>>;
let world: Awaited<ReturnType<typeof startMailWorld>>;
let earlyId: string | undefined;

const welcome = (to: string, dedupeKey?: string) =>
  ({ to, template: "welcome", data: { name: "Ann", verifyUrl: "/verify-email?token=x" }, dedupeKey }) as const;
const row = async (id: string) => (await database.db.select().from(emailOutbox).where(eq(emailOutbox.id, id)))[0];
const waitSent = (id: string, ms = 15_000) =>
  waitFor(async () => (await row(id))?.status === "sent", ms, `row ${id} sent`);
const deliveredFor = (id: string) => world.fake.emails().filter((e) => e.idempotency_key === id);

beforeAll(async () => {
  database = await createTestDatabase();
  // Written before any worker has run: pg-boss's queue does not exist yet, so only the row is saved.
  earlyId = (await enqueueEmail(database.db, welcome("early@example.com")))?.id;
  world = await startMailWorld(database.url, { failRate: 0, retry: { limit: 10, delaySeconds: 1, backoff: true } });
});
afterAll(async () => {
  await world?.stop();
  await database?.drop();
});

describe("the e-mail outbox and its job queue", () => {
  it("sends a message written before the worker first started (swept up at start)", async () => {
    expect(earlyId).toBeTruthy();
    await waitSent(earlyId ?? "");
    expect(deliveredFor(earlyId ?? "")).toHaveLength(1);
  });

  it("keeps one row, and sends once, when the same dedupeKey is enqueued twice", async () => {
    const first = await enqueueEmail(database.db, welcome("ann@example.com", "welcome:ann"));
    const second = await enqueueEmail(database.db, welcome("ann@example.com", "welcome:ann"));
    expect(first?.id).toBeTruthy();
    expect(second).toBeNull();
    const rows = await database.db.select().from(emailOutbox).where(eq(emailOutbox.dedupeKey, "welcome:ann"));
    expect(rows).toHaveLength(1);
    await waitSent(first?.id ?? "");
    expect(deliveredFor(first?.id ?? "")).toHaveLength(1);
  });

  it("follows the caller's transaction: nothing is sent when it rolls back, the message goes when it commits", async () => {
    let rolledBackId = "";
    await expect(
      database.db.transaction(async (tx) => {
        rolledBackId = (await enqueueEmail(tx, welcome("gone@example.com")))?.id ?? "";
        throw new Error("the caller changed its mind");
      }),
    ).rejects.toThrow("changed its mind");
    expect(rolledBackId).not.toBe("");
    expect(await row(rolledBackId)).toBeUndefined();
    const jobs = await database.db.execute(sql`select 1 from pgboss.job where data->>'outboxId' = ${rolledBackId}`);
    expect(jobs).toHaveLength(0);

    const kept = await database.db.transaction(async (tx) => enqueueEmail(tx, welcome("kept@example.com")));
    await waitSent(kept?.id ?? "");
    expect(world.fake.emails().filter((e) => e.to.includes("gone@example.com"))).toHaveLength(0);
  });

  it("does not deliver twice when a send is retried after its answer was lost", async () => {
    const mail = await enqueueEmail(database.db, welcome("lost@example.com"));
    const id = mail?.id ?? "";
    await waitSent(id);
    const before = await row(id);
    // As if the worker died after Resend accepted the message but before the row was marked.
    await database.db.update(emailOutbox).set({ status: "queued" }).where(eq(emailOutbox.id, id));
    expect(await sendOutboxEmail(database.db, id, testMailer(world.fake.url))).toBe("sent");
    expect(deliveredFor(id)).toHaveLength(1);
    expect((await row(id))?.providerId).toBe(before?.providerId);

    // The same after a settings change altered the message: Resend refuses the key with 409
    // (API reference, "Errors": invalid_idempotent_request), which means it has the first version.
    await database.db.update(emailOutbox).set({ status: "queued" }).where(eq(emailOutbox.id, id));
    expect(await sendOutboxEmail(database.db, id, testMailer(world.fake.url, "hello@rosinwood.test"))).toBe("sent");
    expect(deliveredFor(id)).toHaveLength(1);
    expect((await row(id))?.lastError).toMatch(/invalid_idempotent_request/);
  });

  it("retries a failing send with growing waits (back-off), then delivers it once", async () => {
    world.fake.setFailRate(1);
    const id = (await enqueueEmail(database.db, welcome("patient@example.com")))?.id ?? "";
    const attemptsOf = () => world.fake.requests().filter((r) => r.idempotencyKey === id);
    await waitFor(() => attemptsOf().length >= 3, 20_000, "three attempts");
    world.fake.setFailRate(0);
    await waitSent(id, 20_000);
    const [a, b, c] = attemptsOf().map((r) => r.at);
    // pg-boss 10 waits between delay·2^n and delay·2^(n+1) s before retry n+1 (plans.js, failJobs):
    // with a 1 s delay the second retry comes at least 2 s after the first; without back-off it would be about 1 s.
    expect((c ?? 0) - (b ?? 0)).toBeGreaterThanOrEqual(1900);
    expect((b ?? 0) - (a ?? 0)).toBeGreaterThanOrEqual(900);
    const saved = await row(id);
    expect(saved?.attempts).toBe(attemptsOf().length);
    expect(saved?.lastError).toBeNull();
    expect(deliveredFor(id)).toHaveLength(1);
  });

  it("marks a message Resend refuses for good as failed, without retrying it", async () => {
    const id = (await enqueueEmail(database.db, welcome("not an address")))?.id ?? "";
    await waitFor(async () => (await row(id))?.status === "failed", 10_000, "failed row");
    const saved = await row(id);
    expect(saved?.lastError).toMatch(/validation_error \(422\)/);
    await new Promise((resolve) => setTimeout(resolve, 1500));
    expect(world.fake.requests().filter((r) => r.idempotencyKey === id)).toHaveLength(1);
  });

  it("queues again a row whose job was lost, when swept", async () => {
    const [lost] = await database.db
      .insert(emailOutbox)
      .values({
        toAddress: "swept@example.com",
        template: "password-changed",
        subject: "Your Rosinwood password was changed",
        payload: { name: "Sam" },
      })
      .returning({ id: emailOutbox.id });
    const id = lost?.id ?? "";
    expect(await world.worker.sweepNow()).toBeGreaterThanOrEqual(1);
    await waitSent(id);
    expect(deliveredFor(id)).toHaveLength(1);
    expect(deliveredFor(id)[0]?.html).toContain("http://127.0.0.1:3000/forgot-password");
  });
});
