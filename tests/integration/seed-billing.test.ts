// The demo billing history (issue 7 item 7): a year of it, money that adds up, refunds within their
// payments, every enrolled demo student in good standing (bar the deliberately lapsed), and the
// Stripe stand-in holding the same subscriptions in the same states.
import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { enrolments, payments, plans, subscriptions, users } from "@/db/schema";
import { STUDENTS } from "@/db/seed-data/people";
import { billingWorld, type BillingWorld } from "./helpers/billing-world";

let w: BillingWorld;
let adminCookie: string;
const DAY_MS = 86_400_000;

beforeAll(async () => {
  w = await billingWorld();
  const { seed } = await import("@/db/seed");
  await seed(w.db);
  const admin = await w.userByEmail("admin@larchmoor.example");
  adminCookie = await w.cookieFor(admin?.id ?? "");
}, 120_000);
afterAll(async () => w?.close());

const anchorOf = async () => {
  const { DEMO_PLANS } = await import("@/db/seed-data/billing");
  const [p] = await w.db.select().from(plans).where(eq(plans.id, DEMO_PLANS.monthly.id));
  return Math.floor(p.createdAt.getTime() / 1000);
};

describe("demo billing history", () => {
  it("covers the last twelve months with money taken in each", async () => {
    const now = Date.now();
    const taken = await w.db
      .select({ at: payments.createdAt })
      .from(payments)
      .where(sql`${payments.status} <> 'failed'`);
    for (let i = 0; i < 12; i++) {
      const [from, to] = [now - (i + 1) * 30 * DAY_MS, now - i * 30 * DAY_MS];
      expect(
        taken.some((p) => p.at.getTime() >= from && p.at.getTime() < to),
        `payments ${i * 30}–${(i + 1) * 30} days ago`,
      ).toBe(true);
    }
    const kinds = await w.db
      .select({ status: payments.status, n: sql<number>`count(*)::int` })
      .from(payments)
      .groupBy(payments.status);
    const n = Object.fromEntries(kinds.map((k) => [k.status, k.n]));
    // Failed renewals (not recovered), full and partial refunds are all in the demo.
    expect(n.failed).toBeGreaterThanOrEqual(2);
    expect(n.refunded).toBeGreaterThanOrEqual(2);
    expect(n.partially_refunded).toBeGreaterThanOrEqual(2);
    const statuses = (await w.db.select({ s: subscriptions.status }).from(subscriptions)).map((r) => r.s);
    expect(new Set(statuses)).toEqual(new Set(["active", "past_due", "canceled"]));
  });

  it("adds up: payments minus refunds in the window equal the revenue route's sums (from the history model)", async () => {
    const { demoBillingHistory } = await import("@/db/seed-data/billing-history");
    const res = await w.call("admin/revenue", "GET", { cookie: adminCookie });
    expect(res.status).toBe(200);
    const report = await w.json<{
      months: string[];
      rows: { currency: string; new: number; renewals: number; refunds: number; net: number }[];
    }>(res);
    const since = Date.parse(`${report.months[0]}-01T00:00:00Z`) / 1000;
    let expectTaken = 0;
    let expectBack = 0;
    for (const m of demoBillingHistory(await anchorOf())) {
      for (const inv of m.invoices) {
        if (inv.status === "paid" && inv.created >= since) expectTaken += inv.amount;
        for (const r of inv.refunds) if (r.created >= since) expectBack += r.amount;
      }
    }
    const gbp = report.rows.filter((r) => r.currency === "GBP");
    expect(gbp).toHaveLength(12);
    expect(gbp.reduce((s, r) => s + r.new + r.renewals, 0)).toBe(expectTaken);
    expect(gbp.reduce((s, r) => s + r.refunds, 0)).toBe(-expectBack);
    expect(gbp.reduce((s, r) => s + r.net, 0)).toBe(expectTaken - expectBack);
    expect(expectBack).toBeGreaterThan(0);
  });

  it("dates the demo enrolments across the year, each from its student's membership", async () => {
    const rows = await w.db
      .select({
        email: users.email,
        status: enrolments.status,
        enrolledAt: enrolments.enrolledAt,
        endedAt: enrolments.endedAt,
        startedAt: subscriptions.startedAt,
        subEnded: subscriptions.endedAt,
      })
      .from(enrolments)
      .innerJoin(users, eq(users.id, enrolments.userId))
      .leftJoin(subscriptions, eq(subscriptions.userId, users.id));
    expect(rows.length).toBeGreaterThanOrEqual(18); // db/seed-data/catalogue.ts: six per course
    const months = new Set(rows.map((r) => r.enrolledAt.toISOString().slice(0, 7)));
    expect(months.size).toBeGreaterThanOrEqual(8);
    const anchor = (await anchorOf()) * 1000;
    for (const r of rows) {
      expect(r.enrolledAt.getTime(), r.email).toBeLessThan(anchor);
      if (r.startedAt) expect(r.enrolledAt.getTime(), r.email).toBeGreaterThan(r.startedAt.getTime());
      if (r.status === "ended") expect(r.endedAt?.getTime(), r.email).toBe(r.subEnded?.getTime());
      else expect(r.endedAt, r.email).toBeNull();
    }
    // Seeding again writes the same dates.
    const { seed } = await import("@/db/seed");
    await seed(w.db);
    const again = await w.db.select({ at: enrolments.enrolledAt }).from(enrolments);
    expect(again.map((r) => r.at.getTime()).sort()).toEqual(rows.map((r) => r.enrolledAt.getTime()).sort());
  }, 120_000);

  it("never refunds more than a payment took, and each payment's refunded amount is its refunds' sum", async () => {
    const rows = await w.db
      .select({
        id: payments.id,
        amount: payments.amount,
        refunded: payments.refundedAmount,
        status: payments.status,
        sum: sql<number>`coalesce((select sum(r.amount) from refunds r where r.payment_id = "payments"."id"), 0)::int`,
      })
      .from(payments);
    for (const p of rows) {
      expect(p.refunded).toBeLessThanOrEqual(p.amount);
      expect(p.refunded).toBe(p.sum);
      if (p.refunded === p.amount) expect(p.status).toBe("refunded");
      else if (p.refunded > 0) expect(p.status).toBe("partially_refunded");
    }
  });

  it("leaves every enrolled student in good standing except the deliberately lapsed", async () => {
    const { memberStanding } = await import("@/lib/billing/gate");
    const { STORIES } = await import("@/db/seed-data/billing-history");
    const enrolled = await w.db
      .selectDistinct({ id: users.id, email: users.email })
      .from(enrolments)
      .innerJoin(users, eq(users.id, enrolments.userId))
      .where(eq(enrolments.status, "active"));
    expect(enrolled.length).toBeGreaterThanOrEqual(10);
    for (const s of enrolled)
      expect(await memberStanding(w.db, { id: s.id, role: "student" }), s.email).toMatchObject({ good: true });
    // The students the browser tests sign in as.
    const first = await w.userByEmail(STUDENTS[0].email);
    expect(await memberStanding(w.db, { id: first?.id ?? "", role: "student" })).toMatchObject({
      good: true,
      reason: "active",
    });
    // The lapsed examples: a renewal that failed for good, and cancellations that have ended.
    for (const i of [10, 12, 14]) {
      expect(STORIES[i]).toBeDefined();
      const u = await w.userByEmail(STUDENTS[i].email);
      expect(await memberStanding(w.db, { id: u?.id ?? "", role: "student" }), STUDENTS[i].email).toMatchObject({
        good: false,
      });
    }
  });

  it("has the same customers, subscription ids and statuses in the Stripe stand-in", async () => {
    const subs = await w.db
      .select({
        sid: subscriptions.stripeSubscriptionId,
        status: subscriptions.status,
        end: subscriptions.currentPeriodEnd,
        cus: users.stripeCustomerId,
      })
      .from(subscriptions)
      .innerJoin(users, eq(users.id, subscriptions.userId));
    expect(subs.length).toBeGreaterThanOrEqual(25);
    for (const s of subs) {
      const remote = await w.stripe().subscriptions.retrieve(s.sid);
      expect(remote.status).toBe(s.status);
      expect(remote.customer).toBe(s.cus);
      expect(remote.items.data[0].current_period_end * 1000).toBe(s.end?.getTime());
    }
    const paid = await w.db
      .select({ inv: payments.stripeInvoiceId, status: payments.status, refunded: payments.refundedAmount })
      .from(payments);
    for (const p of paid.slice(0, 40)) {
      const inv = await w.stripe().invoices.retrieve(p.inv);
      expect(inv.status === "paid", p.inv).toBe(p.status !== "failed");
    }
  });

  it("is idempotent, repairs a stand-in that lost its state, and says so when the stand-in is down", async () => {
    const { seed } = await import("@/db/seed");
    const { seedBilling } = await import("@/db/seed-data/billing");
    const count = async () => (await w.db.select({ n: sql<number>`count(*)::int` }).from(payments))[0].n;
    const before = await count();
    await seed(w.db);
    expect(await count()).toBe(before);
    expect((await seedBilling(w.db)).imported).toBe(false);
    const { startStripeFake } = await import("@/scripts/fakes/stripe/server");
    const fresh = await startStripeFake({ port: 0, webhookSecret: "whsec_fresh", apiKey: "sk_test_fresh", tickMs: 0 });
    try {
      const env = { STRIPE_API_BASE: fresh.url, STRIPE_SECRET_KEY: "sk_test_fresh" };
      expect((await seedBilling(w.db, env)).imported).toBe(true);
      expect((await seedBilling(w.db, env)).imported).toBe(false);
      const res = await fetch(`${fresh.url}/v1/subscriptions/sub_LmDemo00`, {
        headers: { authorization: "Bearer sk_test_fresh" },
      });
      expect(res.status).toBe(200);
    } finally {
      await fresh.close();
    }
    expect(await count()).toBe(before);
    await expect(
      seedBilling(w.db, { STRIPE_API_BASE: "http://127.0.0.1:9", STRIPE_SECRET_KEY: "sk_test_x" }),
    ).rejects.toThrow(/not reachable/);
    await expect(seedBilling(w.db, {})).rejects.toThrow(/STRIPE_API_BASE/);
  });
});
