// Plan changes priced as Stripe prices them, checked against amounts worked out by hand here, and
// refunds that can never exceed what was paid.
// Stripe docs: "Prorations" — "-5 USD for unused time on the initial price, and 10 USD for the remaining
// time on the new price" for a 10 → 20 USD monthly upgrade halfway; each proration is the price times
// the share of the period left, to the second. Stripe support, "How does Stripe handle subscription plan
// changes in the middle of a billing period?" — a change to a different interval (monthly → yearly)
// starts the new plan's first full period at once and charges it less the unused-time credit.
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DAY, monthlyPlan, startStripeWorld, subscribe, type StripeWorld } from "./helpers/stripe-fake-world";

let w: StripeWorld;
let monthly: Stripe.Price;
let yearly: Stripe.Price;
let monthlyPlus: Stripe.Price;
beforeAll(async () => {
  // 1 April 2026: the first monthly period runs to 1 May, 30 days.
  w = await startStripeWorld({ startAt: new Date("2026-04-01T00:00:00Z") });
  monthly = await monthlyPlan(w.stripe, 1800, "month", "Monthly membership");
  yearly = await monthlyPlan(w.stripe, 18000, "year", "Yearly membership");
  monthlyPlus = await monthlyPlan(w.stripe, 2500, "month", "Monthly membership plus");
});
afterAll(async () => w.close());

describe("plan change previews and invoices", () => {
  it("monthly £18.00 → yearly £180.00 halfway through a 30-day month", async () => {
    const { sub } = await subscribe(w, monthly.id, undefined, "yearly@example.test");
    const item = sub?.items.data[0];
    const start = item?.current_period_start ?? 0;
    expect((item?.current_period_end ?? 0) - start).toBe(30 * DAY);
    const t = start + 15 * DAY;
    // By hand: unused time = 15 of 30 days → credit −1800 × 15/30 = −900; the yearly period restarts at t
    // and is charged in full, 18000; total 18000 − 900 = 17100.
    const preview = await w.stripe.invoices.createPreview({
      customer: String(sub?.customer),
      subscription: sub?.id,
      subscription_details: {
        items: [{ id: item?.id, price: yearly.id }],
        proration_behavior: "always_invoice",
        proration_date: t,
      },
    });
    expect(preview.lines.data.map((l) => [l.amount, l.parent?.subscription_item_details?.proration])).toEqual([
      [-900, true],
      [18000, false],
    ]);
    expect(preview.lines.data[0]?.description).toBe("Unused time on Monthly membership after 16 Apr 2026");
    expect(preview.lines.data[1]?.period).toEqual({ start: t, end: t + 365 * DAY });
    expect(preview).toMatchObject({ total: 17100, amount_due: 17100, status: "draft" });
    expect(preview.id).toMatch(/^upcoming_in_/);
    expect(preview.parent?.subscription_details?.subscription_proration_date).toBe(t);

    const changed = await w.stripe.subscriptions.update(sub?.id ?? "", {
      items: [{ id: item?.id, price: yearly.id }],
      proration_behavior: "always_invoice",
      proration_date: t,
    });
    expect(changed.items.data[0]?.price.id).toBe(yearly.id);
    expect(changed.items.data[0]?.current_period_start).toBe(t);
    expect(changed.billing_cycle_anchor).toBe(t);
    const invoice = await w.stripe.invoices.retrieve(String(changed.latest_invoice));
    expect(invoice).toMatchObject({ billing_reason: "subscription_update", status: "paid", amount_paid: 17100 });
  });

  it("same interval, to the second: credit and charge for the time left, on the next renewal", async () => {
    const { sub } = await subscribe(w, monthly.id, undefined, "plus@example.test");
    const item = sub?.items.data[0];
    const start = item?.current_period_start ?? 0;
    const end = item?.current_period_end ?? 0;
    const t = start + 10 * DAY + 12_345;
    // By hand: period 2,592,000 s; left after t = 2,592,000 − 864,000 − 12,345 = 1,715,655 s.
    // credit = −round(1800 × 1,715,655 / 2,592,000) = −round(1191.43) = −1191
    // charge = round(2500 × 1,715,655 / 2,592,000) = round(1654.76) = 1655
    // next renewal (create_prorations) = −1191 + 1655 + 2500 = 2964.
    const change = {
      items: [{ id: item?.id, price: monthlyPlus.id }],
      proration_behavior: "create_prorations" as const,
      proration_date: t,
    };
    const preview = await w.stripe.invoices.createPreview({ subscription: sub?.id, subscription_details: change });
    expect(preview.lines.data.map((l) => l.amount)).toEqual([-1191, 1655, 2500]);
    expect(preview.total).toBe(2964);
    expect(preview.next_payment_attempt).toBe(end);
    const now = await w.stripe.invoices.createPreview({
      subscription: sub?.id,
      subscription_details: { ...change, proration_behavior: "always_invoice" },
    });
    expect(now.total).toBe(1655 - 1191);

    await w.stripe.subscriptions.update(sub?.id ?? "", change);
    expect((await w.stripe.invoices.list({ subscription: sub?.id })).data).toHaveLength(1);
    await w.fake.advanceClock(end - w.fake.now() + 1);
    const renewal = (await w.stripe.invoices.list({ subscription: sub?.id })).data[0];
    expect(renewal).toMatchObject({ billing_reason: "subscription_cycle", status: "paid", amount_paid: 2964 });
  });
});

describe("refunds", () => {
  it("refund partly, then the rest by default, and refuse anything beyond", async () => {
    const { customer } = await subscribe(w, monthly.id, undefined, "refund@example.test");
    const [invoice] = (await w.stripe.invoices.list({ customer: customer.id })).data;
    const intent = String(invoice?.payments?.data[0]?.payment.payment_intent);
    const part = await w.stripe.refunds.create({
      payment_intent: intent,
      amount: 500,
      reason: "requested_by_customer",
    });
    expect(part).toMatchObject({
      object: "refund",
      amount: 500,
      status: "succeeded",
      reason: "requested_by_customer",
      payment_intent: intent,
    });
    expect(part.id).toMatch(/^re_/);
    const tooMuch = await w.stripe.refunds
      .create({ charge: String(part.charge), amount: 1301 })
      .catch((e: unknown) => e);
    // Stripe docs: "Error codes" — amount_too_large.
    expect(tooMuch).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(tooMuch).toMatchObject({ statusCode: 400, code: "amount_too_large", param: "amount" });
    const rest = await w.stripe.refunds.create({ charge: String(part.charge) });
    expect(rest.amount).toBe(1300);
    const charge = await w.stripe.charges.retrieve(String(part.charge), { expand: ["refunds"] });
    expect(charge).toMatchObject({ amount: 1800, amount_refunded: 1800, refunded: true });
    expect(charge.refunds?.data.map((r) => r.amount).sort()).toEqual([1300, 500]);
    const again = await w.stripe.refunds.create({ payment_intent: intent, amount: 1 }).catch((e: unknown) => e);
    expect(again).toMatchObject({ statusCode: 400, code: "charge_already_refunded" });
    const refunded = w.fake.events().filter((e) => e.type === "charge.refunded" && e.data.object.id === charge.id);
    expect(refunded.map((e) => e.data.object.amount_refunded)).toEqual([500, 1800]);
  });
});
