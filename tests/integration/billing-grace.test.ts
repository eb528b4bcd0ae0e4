// A failed renewal: past due with a week's grace (open), then closed when grace ends, then open again
// once a new card pays the invoice — all driven by the stand-in's clock and its webhooks.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { payments, subscriptions } from "@/db/schema";
import { billingWorld, type BillingWorld } from "./helpers/billing-world";

let w: BillingWorld;
let student: { id: string; email: string };
let cookie: string;
const DAY = 86_400;

beforeAll(async () => {
  w = await billingWorld();
  const admin = await w.person("admin");
  const plan = await w.plan(await w.cookieFor(admin.id), {
    name: "Monthly membership",
    amount: 1800,
    currency: "GBP",
    interval: "month",
  });
  student = await w.person("student");
  cookie = await w.cookieFor(student.id);
  await w.subscribe(cookie, plan.id);
}, 60_000);
afterAll(async () => w?.close());

const sub = async () => (await w.db.select().from(subscriptions).where(eq(subscriptions.userId, student.id)))[0];
/** The gate asked at the stand-in's time, since its clock has moved ahead of ours. */
const standing = async () => {
  const { memberStanding } = await import("@/lib/billing/gate");
  return memberStanding(w.db, { id: student.id, role: "student" }, new Date(w.fake.now() * 1000));
};
async function saveCard(card: string) {
  const res = await w.call("billing/update-card", "POST", { cookie });
  expect(res.status).toBe(200);
  const page = await w.pay((await w.json<{ url: string }>(res)).url, card);
  expect(page.status).toBe(303);
  await w.fake.settled();
}

describe("failed renewal → past due → grace → closed → paid → open", () => {
  it("keeps the catalogue open through the grace week after a failed renewal, with an e-mail", async () => {
    expect(await standing()).toMatchObject({ good: true, reason: "active" });
    // Stripe docs (Testing): 4000 0000 0000 0341 attaches to a customer, but charges to it fail.
    await saveCard("4000000000000341");
    const periodEnd = (await sub()).currentPeriodEnd;
    expect(periodEnd).toBeInstanceOf(Date);
    await w.fake.advanceClock(Math.ceil((periodEnd?.getTime() ?? 0) / 1000 - w.fake.now() + 3600));
    await w.fake.settled();
    const s = await sub();
    expect(s.status).toBe("past_due");
    const [failed] = await w.db.select().from(payments).where(eq(payments.status, "failed"));
    expect(failed).toMatchObject({ kind: "renewal", amount: 1800, userId: student.id });
    expect(failed.failureMessage).toMatch(/declined/i);
    // Grace: seven days from the failed invoice (common practice; lib/billing/grace.ts).
    expect(s.graceUntil?.getTime()).toBe(failed.createdAt.getTime() + 7 * DAY * 1000);
    expect(await standing()).toMatchObject({ good: true, reason: "grace" });
    expect((await w.mailsTo(student.email)).map((m) => m.template)).toContain("payment-failed");
  });

  it("closes the catalogue when grace ends, saying what to do", async () => {
    await w.fake.advanceClock(7 * DAY); // past grace, before the stand-in's last retry (day 8)
    await w.fake.settled();
    expect((await sub()).status).toBe("past_due");
    const s = await standing();
    expect(s.good).toBe(false);
    expect(s).toMatchObject({ why: expect.stringMatching(/update your card/) });
    // Only one notice per failed invoice, however many retries fail.
    expect((await w.mailsTo(student.email)).filter((m) => m.template === "payment-failed")).toHaveLength(1);
  });

  it("opens again once a new card pays the open invoice", async () => {
    await saveCard("4242424242424242");
    const s = await sub();
    expect(s).toMatchObject({ status: "active", graceUntil: null });
    const rows = await w.db.select().from(payments).where(eq(payments.userId, student.id));
    expect(rows.map((r) => `${r.kind}:${r.status}`).sort()).toEqual(["new:paid", "renewal:paid"]);
    expect(await standing()).toMatchObject({ good: true, reason: "active" });
  });
});
