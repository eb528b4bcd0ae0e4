import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emailOutbox } from "@/db/schema";
import { enqueueEmails, type AnyOutgoingMail } from "@/lib/mail/outbox";
import { createTestDatabase } from "./helpers/db";
import { startMailWorld, waitFor } from "./helpers/mail";

let database: Awaited<ReturnType<typeof createTestDatabase>>;
let world: Awaited<ReturnType<typeof startMailWorld>>;

beforeAll(async () => {
  database = await createTestDatabase();
  // Retries without back-off here, one second apart: with doubling delays a message that fails five
  // times in a row (about one run in nine at 30%) would need a minute. Back-off has its own test
  // in mail-queue.test.ts.
  world = await startMailWorld(database.url, { failRate: 0.3, retry: { limit: 30, delaySeconds: 1, backoff: false } });
});
afterAll(async () => {
  await world?.stop();
  await database?.drop();
});

describe("e-mail delivery through the outbox, the job queue and the stand-in", () => {
  it("with the stand-in failing 30% of sends, 50 queued messages are all delivered exactly once", async () => {
    const mails: AnyOutgoingMail[] = Array.from({ length: 50 }, (_, i) => ({
      to: `student${i}@example.com`,
      template: "password-reset",
      data: { name: `Student ${i}`, resetUrl: `/reset-password?token=t${i}`, expiresInMinutes: 60 },
      dedupeKey: `delivery-${i}`,
    }));
    const ids = (await enqueueEmails(database.db, mails)).map((r) => r?.id);
    expect(ids.every((id) => typeof id === "string")).toBe(true);

    const sentCount = async () =>
      (await database.db.select().from(emailOutbox).where(eq(emailOutbox.status, "sent"))).length;
    await waitFor(async () => (await sentCount()) === 50, 50_000, "50 sent rows");

    // Counted in the stand-in by idempotency key, which is the outbox row id.
    const delivered = world.fake.emails();
    const perRow = new Map<string, number>();
    for (const e of delivered)
      perRow.set(e.idempotency_key ?? "none", (perRow.get(e.idempotency_key ?? "none") ?? 0) + 1);
    expect(delivered).toHaveLength(50);
    expect([...perRow.keys()].sort()).toEqual([...ids].sort());
    expect([...perRow.values()].every((n) => n === 1)).toBe(true);

    const rows = await database.db.select().from(emailOutbox);
    expect(rows.every((r) => r.status === "sent" && r.sentAt !== null)).toBe(true);
    for (const row of rows) {
      const email = delivered.find((e) => e.idempotency_key === row.id);
      expect(email?.to).toEqual([row.toAddress]);
      expect(email?.id).toBe(row.providerId);
      expect(email?.text).toContain(`/reset-password?token=t${row.toAddress.match(/\d+/)?.[0]}`);
    }

    // The failures really happened and were retried: every request the stand-in saw is an attempt on a row.
    const requests = world.fake.requests();
    const failures = requests.filter((r) => r.status === 500).length;
    expect(failures).toBeGreaterThan(0);
    expect(requests.filter((r) => r.status === 200)).toHaveLength(50);
    expect(rows.reduce((sum, r) => sum + r.attempts, 0)).toBe(requests.length);
  });
});
