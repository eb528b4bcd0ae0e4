// Out-of-order and redelivered webhooks: a year of billing made on the stand-in (sign-ups, renewals,
// a cancellation, a plan change with proration, a failed card, a refund), then every event Stripe sent
// applied to two fresh databases — once in order, once shuffled with duplicates. Both must end alike.
import { asc } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Db } from "@/db/client";
import { payments, plans, refunds, subscriptions, users } from "@/db/schema";
import { createTestDatabase } from "./helpers/db";
import { billingWorld, type BillingWorld } from "./helpers/billing-world";

let w: BillingWorld;
const DAY = 86_400;
type Person = { id: string; email: string; cookie: string };

/** A seeded shuffle, so a failure can be reproduced (mulberry32, a well-known small PRNG). */
function shuffled<T>(items: T[], seed: number): T[] {
  let a = seed >>> 0;
  const rand = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const out = [...items];
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1));
    [out[i], out[j]] = [out[j], out[i]];
  }
  return out;
}

let people: Person[] = [];
let changePreview = 0;

beforeAll(async () => {
  w = await billingWorld();
  const adminCookie = await w.cookieFor((await w.person("admin")).id);
  const monthly = await w.plan(adminCookie, {
    name: "Monthly membership",
    amount: 1800,
    currency: "GBP",
    interval: "month",
  });
  const yearly = await w.plan(adminCookie, {
    name: "Yearly membership",
    amount: 18000,
    currency: "GBP",
    interval: "year",
  });
  for (let i = 0; i < 14; i++) {
    const p = await w.person("student");
    people.push({ id: p.id, email: p.email, cookie: await w.cookieFor(p.id) });
  }
  for (const [i, p] of people.entries()) await w.subscribe(p.cookie, i < 12 ? monthly.id : yearly.id);
  const [, leaver, failing, switcher, refunded, undecided] = people;
  for (let month = 1; month <= 12; month++) {
    if (month === 2) expect((await w.call("billing/cancel", "POST", { cookie: leaver.cookie })).status).toBe(200);
    if (month === 3) {
      const res = await w.call("billing/update-card", "POST", { cookie: failing.cookie });
      await w.pay((await w.json<{ url: string }>(res)).url, "4000000000000341"); // Stripe docs (Testing): fails when charged
    }
    if (month === 4) {
      const preview = await w.call("billing/change-plan/preview", "POST", {
        cookie: switcher.cookie,
        body: { planId: yearly.id },
      });
      expect(preview.status).toBe(200);
      const p = await w.json<{ amountDue: number; prorationDate: number }>(preview);
      changePreview = p.amountDue;
      expect(
        (
          await w.call("billing/change-plan", "POST", {
            cookie: switcher.cookie,
            body: { planId: yearly.id, prorationDate: p.prorationDate },
          })
        ).status,
      ).toBe(200);
    }
    if (month === 5) {
      const first = (
        await w.stripe().invoices.list({ customer: (await customerOf(w.db, refunded.id)) ?? "", limit: 100 })
      ).data.at(-1);
      const pi = first?.payments?.data[0]?.payment.payment_intent;
      await w.stripe().refunds.create({
        payment_intent: typeof pi === "string" ? pi : "",
        amount: 500,
        metadata: { reason: "Missed two lessons" },
      });
    }
    if (month === 6) {
      expect((await w.call("billing/cancel", "POST", { cookie: undecided.cookie })).status).toBe(200);
      expect((await w.call("billing/resume", "POST", { cookie: undecided.cookie })).status).toBe(200);
    }
    await w.fake.settled();
    await w.fake.advanceClock(31 * DAY);
    await w.fake.settled();
  }
}, 400_000);
afterAll(async () => w?.close());

async function customerOf(db: Db, userId: string) {
  const { customerOf: q } = await import("@/db/queries/billing");
  return q(db, userId);
}

/** The tables as comparable rows: Stripe ids instead of this database's uuids. */
async function snapshot(db: Db) {
  const subs = await db.select().from(subscriptions).orderBy(asc(subscriptions.stripeSubscriptionId));
  const subId = new Map(subs.map((s) => [s.id, s.stripeSubscriptionId]));
  const pays = await db.select().from(payments).orderBy(asc(payments.stripeInvoiceId));
  const payId = new Map(pays.map((p) => [p.id, p.stripeInvoiceId]));
  const refs = await db.select().from(refunds).orderBy(asc(refunds.stripeRefundId));
  return {
    subscriptions: subs.map(({ id: _id, ...s }) => s),
    payments: pays.map(({ id: _id, subscriptionId, ...p }) => ({
      ...p,
      subscription: subscriptionId ? subId.get(subscriptionId) : null,
    })),
    refunds: refs.map(({ id: _id, paymentId, ...r }) => ({ ...r, payment: payId.get(paymentId) })),
  };
}

/** A fresh database holding the same people (with their Stripe customers) and plans. */
async function twin() {
  const t = await createTestDatabase();
  await t.db.insert(users).values(await w.db.select().from(users));
  await t.db.insert(plans).values(await w.db.select().from(plans));
  return t;
}

describe("webhook replay", () => {
  it("ends in the ordered run's state when 200+ events arrive shuffled and with duplicates", async () => {
    const { applyEvent } = await import("@/lib/billing/webhooks");
    const events = w.fake.events().map(({ delivery: _d, ...e }) => e);
    expect(events.length).toBeGreaterThanOrEqual(200);
    const types = new Set(events.map((e) => e.type));
    for (const t of [
      "checkout.session.completed",
      "customer.subscription.updated",
      "customer.subscription.deleted",
      "invoice.paid",
      "invoice.payment_failed",
      "charge.refunded",
    ]) {
      expect(types).toContain(t);
    }
    const ordered = await twin();
    const mixed = await twin();
    try {
      for (const e of events) await applyEvent(ordered.db, w.stripe(), e);
      const withDuplicates = shuffled([...events, ...shuffled(events, 7).slice(0, 60)], 2026);
      const answers = [];
      for (const e of withDuplicates) answers.push((await applyEvent(mixed.db, w.stripe(), e)).body.duplicate === true);
      expect(answers.filter(Boolean)).toHaveLength(60);
      const a = await snapshot(ordered.db);
      const b = await snapshot(mixed.db);
      expect(b).toEqual(a);
      // And the ordered run says what happened.
      expect(a.subscriptions.map((s) => s.status).sort()).toEqual([
        ...Array<string>(12).fill("active"),
        "canceled",
        "canceled",
      ]);
      expect(a.payments.filter((p) => p.kind === "plan_change").map((p) => p.amount)).toEqual([changePreview]);
      expect(a.refunds.map((r) => [r.amount, r.reason])).toEqual([[500, "Missed two lessons"]]);
      expect(a.payments.find((p) => p.status === "partially_refunded")?.refundedAmount).toBe(500);
      // The live run (delivered in order as they happened) agrees with the replay.
      expect((await snapshot(w.db)).payments).toEqual(a.payments);
    } finally {
      await ordered.drop();
      await mixed.drop();
    }
  }, 300_000);
});
