// The stand-in's clock: renewals at the period end, failed renewals with the (simplified, documented)
// retry schedule and cancellation after the last failure, recovery through a new card, cancellation at
// the period end; and its state kept across restarts.
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Stripe from "stripe";
import { afterEach, describe, expect, it } from "vitest";
import { periodEnd } from "@/scripts/fakes/stripe/clock";
import {
  CARDS,
  DAY,
  monthlyPlan,
  startStripeWorld,
  subscribe,
  updateCard,
  type StripeWorld,
} from "./helpers/stripe-fake-world";

const START = new Date("2026-04-01T00:00:00Z");
const worlds: StripeWorld[] = [];
afterEach(async () => {
  for (const w of worlds.splice(0)) await w.close();
});
async function world(stateFile?: string) {
  const w = await startStripeWorld({ startAt: START, stateFile });
  worlds.push(w);
  return w;
}

const eventsOf = (w: StripeWorld, subId: string, after = 0) =>
  w.fake
    .events()
    .slice(after)
    .filter((e) => JSON.stringify(e.data.object).includes(subId));

describe("billing periods", () => {
  it("keep to the anchor's day of the month (Stripe docs: set the subscription billing renewal date)", () => {
    const jan31 = Date.UTC(2027, 0, 31, 10) / 1000;
    const feb = periodEnd(jan31, jan31, "month", 1);
    expect(new Date(feb * 1000).toISOString()).toBe("2027-02-28T10:00:00.000Z");
    const mar = periodEnd(jan31, feb, "month", 1);
    expect(new Date(mar * 1000).toISOString()).toBe("2027-03-31T10:00:00.000Z");
    expect(new Date(periodEnd(jan31, jan31, "year", 1) * 1000).toISOString()).toBe("2028-01-31T10:00:00.000Z");
  });
});

describe("advancing the clock", () => {
  it("renews at the period end: a paid invoice for the new period and subscription.updated", async () => {
    const w = await world();
    const price = await monthlyPlan(w.stripe);
    const { sub } = await subscribe(w, price.id);
    const first = sub?.items.data[0];
    // April 2026 has 30 days: a monthly period started on 1 April ends on 1 May at the same time of day.
    expect((first?.current_period_end ?? 0) - (first?.current_period_start ?? 0)).toBe(30 * DAY);
    const mark = w.fake.events().length;
    await w.fake.advanceClock(30 * DAY + 60);
    const types = eventsOf(w, sub?.id ?? "", mark).map((e) => e.type);
    expect(types).toEqual(["customer.subscription.updated", "invoice.paid"]);
    const renewed = await w.stripe.subscriptions.retrieve(sub?.id ?? "");
    expect(renewed.status).toBe("active");
    expect(renewed.items.data[0]?.current_period_start).toBe(first?.current_period_end);
    const invoices = await w.stripe.invoices.list({ subscription: sub?.id });
    expect(invoices.data.map((i) => [i.billing_reason, i.status, i.amount_paid])).toEqual([
      ["subscription_cycle", "paid", 1800],
      ["subscription_create", "paid", 1800],
    ]);
    expect(invoices.data[0]?.created).toBe(first?.current_period_end);
    // Stripe's invoice period is the usage period just ended; the new service period is on the line.
    expect([invoices.data[0]?.period_start, invoices.data[0]?.period_end]).toEqual([
      first?.current_period_start,
      first?.current_period_end,
    ]);
    expect(invoices.data[0]?.lines.data[0]?.period).toEqual({
      start: renewed.items.data[0]?.current_period_start,
      end: renewed.items.data[0]?.current_period_end,
    });
    // A whole year more: eleven further renewals, each at its own period's end.
    await w.fake.advanceClock(335 * DAY);
    expect((await w.stripe.invoices.list({ subscription: sub?.id, limit: 100 })).data).toHaveLength(13);
  });

  it("with 4000 0000 0000 0341 the renewal fails: past_due, retries after 3 and 5 days, then canceled", async () => {
    const w = await world();
    const price = await monthlyPlan(w.stripe);
    const { customer, sub } = await subscribe(w, price.id);
    const saved = await updateCard(w, customer.id, sub?.id ?? "", CARDS.chargeFails);
    expect(saved.status).toBe(303); // Stripe docs: Testing — 0341 attaches to a customer.
    const id = sub?.id ?? "";
    const end = sub?.items.data[0]?.current_period_end ?? 0;
    let mark = w.fake.events().length;
    await w.fake.advanceClock(end - w.fake.now() + 1);
    expect(eventsOf(w, id, mark).map((e) => e.type)).toEqual([
      "customer.subscription.updated",
      "invoice.payment_failed",
    ]);
    const failed = eventsOf(w, id, mark)[1]?.data.object as unknown as Stripe.Invoice;
    expect(failed).toMatchObject({
      status: "open",
      attempt_count: 1,
      amount_due: 1800,
      next_payment_attempt: end + 3 * DAY,
    });
    expect((await w.stripe.subscriptions.retrieve(id)).status).toBe("past_due");

    mark = w.fake.events().length;
    await w.fake.advanceClock(3 * DAY);
    const second = eventsOf(w, id, mark).map((e) => [
      e.type,
      (e.data.object as { attempt_count?: number }).attempt_count,
    ]);
    expect(second).toEqual([["invoice.payment_failed", 2]]);
    expect((await w.stripe.invoices.retrieve(failed.id ?? "")).next_payment_attempt).toBe(end + 8 * DAY);

    mark = w.fake.events().length;
    await w.fake.advanceClock(5 * DAY);
    expect(eventsOf(w, id, mark).map((e) => e.type)).toEqual([
      "invoice.payment_failed",
      "customer.subscription.deleted",
    ]);
    const ended = await w.stripe.subscriptions.retrieve(id);
    expect(ended).toMatchObject({ status: "canceled", ended_at: end + 8 * DAY });
    expect(ended.cancellation_details?.reason).toBe("payment_failed");
    const charges = await w.stripe.charges.list({ customer: customer.id });
    expect(charges.data.filter((c) => c.status === "failed")).toHaveLength(3);
  });

  it("a new good card on a past_due subscription pays its open invoice at once", async () => {
    const w = await world();
    const price = await monthlyPlan(w.stripe);
    const { customer, sub } = await subscribe(w, price.id);
    await updateCard(w, customer.id, sub?.id ?? "", CARDS.chargeFails);
    await w.fake.advanceClock(31 * DAY);
    expect((await w.stripe.subscriptions.retrieve(sub?.id ?? "")).status).toBe("past_due");
    // Paying the open invoice again with the same card: Stripe's 402 card_error, as the SDK surfaces it.
    const [open] = (await w.stripe.invoices.list({ subscription: sub?.id, status: "open" })).data;
    const declined = await w.stripe.invoices.pay(open?.id ?? "").catch((e: unknown) => e);
    expect(declined).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(declined).toMatchObject({
      statusCode: 402,
      code: "card_declined",
      decline_code: "generic_decline",
      message: "Your card was declined.",
    });
    const mark = w.fake.events().length;
    const saved = await updateCard(w, customer.id, sub?.id ?? "", CARDS.visa);
    expect(saved.status).toBe(303);
    const types = eventsOf(w, sub?.id ?? "", mark).map((e) => e.type);
    expect(types).toContain("invoice.paid");
    const active = await w.stripe.subscriptions.retrieve(sub?.id ?? "");
    expect(active.status).toBe("active");
    expect((await w.stripe.invoices.list({ subscription: sub?.id, status: "open" })).data).toHaveLength(0);
  });

  it("cancel_at_period_end ends the subscription at the period end; resuming keeps it renewing", async () => {
    const w = await world();
    const price = await monthlyPlan(w.stripe);
    const { sub: leaving } = await subscribe(w, price.id, CARDS.visa, "leaving@example.test");
    const { sub: staying } = await subscribe(w, price.id, CARDS.visa, "staying@example.test");
    await w.stripe.subscriptions.update(leaving?.id ?? "", { cancel_at_period_end: true });
    await w.stripe.subscriptions.update(staying?.id ?? "", { cancel_at_period_end: true });
    const resumed = await w.stripe.subscriptions.update(staying?.id ?? "", { cancel_at_period_end: false });
    expect(resumed).toMatchObject({ cancel_at_period_end: false, cancel_at: null, canceled_at: null });
    await w.fake.advanceClock(31 * DAY);
    const gone = await w.stripe.subscriptions.retrieve(leaving?.id ?? "");
    expect(gone).toMatchObject({ status: "canceled", ended_at: leaving?.items.data[0]?.current_period_end });
    expect(eventsOf(w, leaving?.id ?? "").map((e) => e.type)).toContain("customer.subscription.deleted");
    expect((await w.stripe.invoices.list({ subscription: leaving?.id })).data).toHaveLength(1);
    expect((await w.stripe.subscriptions.retrieve(staying?.id ?? "")).status).toBe("active");
    expect((await w.stripe.invoices.list({ subscription: staying?.id })).data).toHaveLength(2);
  });
});

describe("deleting a customer", () => {
  it("cancels their subscriptions at once, as Stripe does", async () => {
    const w = await world();
    const price = await monthlyPlan(w.stripe);
    const { customer, sub } = await subscribe(w, price.id);
    const gone = await w.stripe.customers.del(customer.id);
    expect(gone).toMatchObject({ id: customer.id, deleted: true });
    expect((await w.stripe.subscriptions.retrieve(sub?.id ?? "")).status).toBe("canceled");
    expect((await w.fake.advanceClock(40 * DAY)).ran).toBe(0);
  });
});

describe("state", () => {
  it("survives a restart through the state file, clock included", async () => {
    const file = join(mkdtempSync(join(tmpdir(), "stripe-fake-")), "state.json");
    const first = await world(file);
    const price = await monthlyPlan(first.stripe);
    const { sub } = await subscribe(first, price.id);
    await first.fake.advanceClock(40 * DAY);
    const before = first.fake.now();
    await first.close();
    worlds.splice(0);
    const again = await world(file);
    expect(again.fake.now()).toBeGreaterThanOrEqual(before);
    const kept = await again.stripe.subscriptions.retrieve(sub?.id ?? "");
    expect(kept.status).toBe("active");
    expect((await again.stripe.invoices.list({ subscription: sub?.id })).data).toHaveLength(2);
  });

  it("imports demo objects in Stripe's shapes, idempotently by id, and renews them like its own", async () => {
    const w = await world();
    const t0 = w.fake.now() - 20 * DAY;
    const t1 = periodEnd(t0, t0, "month", 1);
    const demo = {
      customers: [
        {
          id: "cus_demoA",
          object: "customer",
          created: t0,
          email: "demo@example.test",
          name: "Demo",
          invoice_settings: { default_payment_method: "pm_demoA" },
        },
      ],
      payment_methods: [
        {
          id: "pm_demoA",
          object: "payment_method",
          customer: "cus_demoA",
          card: { brand: "visa", last4: "0341", exp_month: 12, exp_year: 2034 },
        },
      ],
      products: [{ id: "prod_demoM", object: "product", created: t0, name: "Monthly membership" }],
      prices: [
        {
          id: "price_demoM",
          object: "price",
          created: t0,
          currency: "gbp",
          unit_amount: 1800,
          product: "prod_demoM",
          recurring: { interval: "month", interval_count: 1 },
        },
      ],
      subscriptions: [
        {
          id: "sub_demoA",
          object: "subscription",
          created: t0,
          customer: "cus_demoA",
          status: "active",
          currency: "gbp",
          billing_cycle_anchor: t0,
          items: {
            object: "list",
            data: [
              {
                id: "si_demoA",
                price: { id: "price_demoM" },
                quantity: 1,
                current_period_start: t0,
                current_period_end: t1,
              },
            ],
          },
        },
      ],
      invoices: [
        {
          id: "in_demoA1",
          object: "invoice",
          created: t0,
          customer: "cus_demoA",
          status: "paid",
          billing_reason: "subscription_create",
          total: 1800,
          amount_paid: 1800,
          parent: { type: "subscription_details", subscription_details: { subscription: "sub_demoA" } },
          lines: {
            data: [
              {
                id: "il_demoA1",
                amount: 1800,
                period: { start: t0, end: t1 },
                pricing: { price_details: { price: "price_demoM" } },
              },
            ],
          },
        },
      ],
    };
    const post = async () =>
      (await fetch(`${w.fake.url}/_fake/import`, { method: "POST", body: JSON.stringify(demo) })).json();
    expect(await post()).toEqual({
      imported: { customers: 1, products: 1, prices: 1, payment_methods: 1, subscriptions: 1, invoices: 1 },
    });
    await post();
    expect((await w.stripe.customers.list({ email: "demo@example.test" })).data).toHaveLength(1);
    expect((await w.stripe.invoices.list({ subscription: "sub_demoA" })).data.map((i) => i.id)).toEqual(["in_demoA1"]);
    // The imported card ends in 0341, so the imported subscription's renewal fails like a real one.
    await w.fake.advanceClock(11 * DAY);
    const renewed = await w.stripe.subscriptions.retrieve("sub_demoA");
    expect(renewed.status).toBe("past_due");
    expect(renewed.items.data[0]?.current_period_start).toBe(t1);
  });
});
