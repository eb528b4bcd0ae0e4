// Money never half-done: a refund's input is refused before Stripe is asked, any event Stripe sends
// is stored, a refund Stripe made while the local write failed is recorded later from Stripe (webhook
// or the repair pass), and refunds at the same time are told another is in progress.
import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { payments, refundAttempts, refunds, webhookEvents } from "@/db/schema";
import { billingWorld, type BillingWorld } from "./helpers/billing-world";
import { waitFor } from "./helpers/mail";

let w: BillingWorld;
let adminCookie: string;
let planId: string;

beforeAll(async () => {
  w = await billingWorld();
  adminCookie = await w.cookieFor((await w.person("admin")).id);
  planId = (await w.plan(adminCookie, { name: "Monthly", amount: 2000, currency: "GBP", interval: "month" })).id;
}, 60_000);
afterAll(async () => w?.close());

/** A member who paid once; their payment's id and payment intent. */
async function paidPayment(name: string) {
  const student = await w.person("student", { name });
  await w.subscribe(await w.cookieFor(student.id), planId);
  const [p] = await w.db.select().from(payments).where(eq(payments.userId, student.id));
  return p;
}
const refund = (paymentId: string, body: Record<string, unknown>) =>
  w.call("admin/payments/[id]/refunds", "POST", { cookie: adminCookie, params: { id: paymentId }, body });
const stripeRefunds = async (pi: string) => (await w.stripe().refunds.list({ payment_intent: pi, limit: 100 })).data;
const payment = async (id: string) => (await w.db.select().from(payments).where(eq(payments.id, id)))[0];
const rowsOf = (id: string) => w.db.select().from(refunds).where(eq(refunds.paymentId, id));

describe("a refund's input", () => {
  it("is refused with 422 naming the reason when it holds a control character, before Stripe is asked", async () => {
    const p = await paidPayment("Nul Reasoner");
    for (const reason of ["Missed\u0000lessons", "bell\u0007", "esc\u001b[31m"]) {
      const res = await refund(p.id, { amount: 100, reason });
      expect(res.status, JSON.stringify(reason)).toBe(422);
      expect(((await res.json()) as { fieldErrors: Record<string, string> }).fieldErrors).toHaveProperty("reason");
    }
    expect(await stripeRefunds(p.stripePaymentIntentId ?? "")).toHaveLength(0);
    expect(await rowsOf(p.id)).toHaveLength(0);
    // A corrected request is a new one (its idempotency key comes from its own values) and goes through.
    const ok = await refund(p.id, { amount: 100, reason: "Missed lessons" });
    expect(ok.status).toBe(201);
    expect((await payment(p.id)).refundedAmount).toBe(100);
    // Line breaks and tabs are text, not control characters to refuse.
    expect((await refund(p.id, { amount: 100, reason: "Two lessons:\n\tthe 3rd and the 10th" })).status).toBe(201);
  });

  it("refuses a huge amount and a wrong type with 422, asking Stripe nothing", async () => {
    const p = await paidPayment("Huge Amount");
    for (const amount of [1e300, 2 ** 53, "100", -0.5, Number.MAX_SAFE_INTEGER])
      expect((await refund(p.id, { amount, reason: "x" })).status, String(amount)).toBe(422);
    expect(await stripeRefunds(p.stripePaymentIntentId ?? "")).toHaveLength(0);
  });
});

describe("a refund made in Stripe with a NUL in its metadata (e.g. from Stripe's dashboard)", () => {
  it("is stored and recorded from its webhook, and later refunds of the payment still work", async () => {
    const p = await paidPayment("Dashboard Refund");
    const made = await w.stripe().refunds.create({
      payment_intent: p.stripePaymentIntentId ?? "",
      amount: 300,
      metadata: { reason: "typed\u0000in the dashboard" },
    });
    await waitFor(async () => (await rowsOf(p.id)).length === 1, 10_000, "the refund recorded from its webhook");
    const [row] = await rowsOf(p.id);
    expect(row).toMatchObject({ stripeRefundId: made.id, amount: 300, reason: "typed\ufffdin the dashboard" });
    const events = await w.db.select().from(webhookEvents).where(eq(webhookEvents.type, "charge.refunded"));
    const mine = events.filter((e) => JSON.stringify(e.payload).includes(p.stripePaymentIntentId ?? "-"));
    expect(mine.length).toBeGreaterThan(0);
    expect(mine.every((e) => e.processedAt !== null && e.error === null)).toBe(true);
    expect((await refund(p.id, { amount: 200, reason: "And a little more" })).status).toBe(201);
    expect((await payment(p.id)).refundedAmount).toBe(500);
  });
});

describe("a failure between Stripe's answer and the local write", () => {
  // The write of the refund row fails, as a lost connection or a full disk would make it fail.
  const breakWrites = () =>
    w.db.execute(sql`
      create or replace function refuse_refund_rows() returns trigger language plpgsql as
        $$ begin raise exception 'injected failure: the refunds table cannot be written'; end $$;
      create trigger refuse_refund_rows before insert on refunds for each row execute function refuse_refund_rows();`);
  const mendWrites = () => w.db.execute(sql`drop trigger refuse_refund_rows on refunds`);
  const attempts = (paymentId: string) =>
    w.db.select().from(refundAttempts).where(eq(refundAttempts.paymentId, paymentId));

  it("tells the admin Stripe refunded, refuses a second refund meanwhile, and the repair pass records it", async () => {
    const p = await paidPayment("Repair Pass");
    w.pauseWebhooks(true); // as if Stripe's notification did not come
    await breakWrites();
    try {
      const res = await refund(p.id, { amount: 700, reason: "Course cancelled" });
      expect(res.status).toBe(202);
      const body = (await res.json()) as { pending: boolean; message: string };
      expect(body.pending).toBe(true);
      expect(body.message).toMatch(/Stripe has refunded £7\.00.*do not refund it again/);
    } finally {
      await mendWrites();
    }
    expect(await stripeRefunds(p.stripePaymentIntentId ?? "")).toHaveLength(1);
    expect(await rowsOf(p.id)).toHaveLength(0);
    const [pending] = await attempts(p.id);
    expect(pending).toMatchObject({ status: "pending", amount: 700 });
    // Not a second refund at Stripe while the first is unrecorded.
    const again = await refund(p.id, { amount: 700, reason: "Course cancelled" });
    expect(again.status).toBe(409);
    expect(((await again.json()) as { error: string }).error).toMatch(/another refund of this payment is in progress/i);

    const { repairRefunds } = await import("@/lib/billing/refund-repair");
    const later = new Date(Date.now() + 3 * 60_000);
    expect(await repairRefunds(w.db, w.stripe(), later)).toEqual({ recorded: 1, failed: 0 });
    expect(await rowsOf(p.id)).toMatchObject([{ amount: 700, reason: "Course cancelled" }]);
    expect(await payment(p.id)).toMatchObject({ refundedAmount: 700, status: "partially_refunded" });
    expect((await attempts(p.id))[0].status).toBe("done");
    expect(
      (
        await w.mailsTo(
          (await w.db.execute<{ email: string }>(sql`select email from users where id = ${p.userId}`))[0].email,
        )
      ).filter((m) => m.template === "refund-issued"),
    ).toHaveLength(1);

    // The late webhook finds it recorded; nothing twice.
    w.pauseWebhooks(false);
    await waitFor(
      async () =>
        (
          await w.db
            .select()
            .from(webhookEvents)
            .where(and(eq(webhookEvents.type, "charge.refunded"), sql`${webhookEvents.processedAt} is not null`))
        ).some((e) => JSON.stringify(e.payload).includes(p.stripePaymentIntentId ?? "-")),
      15_000,
      "the late charge.refunded applied",
    );
    expect(await rowsOf(p.id)).toHaveLength(1);
    expect((await payment(p.id)).refundedAmount).toBe(700);
  });

  it("is recorded from the charge.refunded webhook once writes work again, the event kept meanwhile", async () => {
    const p = await paidPayment("Webhook Mends");
    w.pauseWebhooks(true);
    await breakWrites();
    let res: Response;
    try {
      res = await refund(p.id, { reason: "Whole payment back" });
      w.pauseWebhooks(false); // delivered while writes still fail: stored unapplied, answered 500, delivered again
      await waitFor(
        async () =>
          (
            await w.db
              .select()
              .from(webhookEvents)
              .where(sql`${webhookEvents.error} like 'not applied:%'`)
          ).length > 0,
        15_000,
        "the failed delivery stored with its reason",
      );
    } finally {
      await mendWrites();
    }
    expect(res.status).toBe(202);
    await waitFor(async () => (await rowsOf(p.id)).length === 1, 20_000, "the refund recorded from a later delivery");
    expect(await payment(p.id)).toMatchObject({ refundedAmount: 2000, status: "refunded" });
    expect((await attempts(p.id))[0].status).toBe("done");
  });
});

describe("refunds of one payment at the same time", () => {
  it("make one refund at Stripe; the others are told another is in progress (409) or nothing is left (422)", async () => {
    const p = await paidPayment("Parallel Clicks");
    const answers = await Promise.all(
      Array.from({ length: 6 }, (_, i) => refund(p.id, { reason: `Refund click ${i}` }).then((r) => r.status)),
    );
    expect(answers.filter((s) => s === 201)).toHaveLength(1);
    expect(answers.every((s) => s === 201 || s === 409 || s === 422)).toBe(true);
    expect(answers.filter((s) => s === 409).length).toBeGreaterThanOrEqual(1);
    expect(await stripeRefunds(p.stripePaymentIntentId ?? "")).toHaveLength(1);
    expect(await payment(p.id)).toMatchObject({ refundedAmount: 2000, status: "refunded" });
  });
});

describe("the idempotency key", () => {
  it("comes from the request's own values: the same request repeats, a corrected one is new", async () => {
    const { refundKey } = await import("@/lib/billing/refund-payment");
    const id = "6f1c2a9e-3b7d-4c1a-9e2f-0a1b2c3d4e5f";
    expect(refundKey(id, 0, 500, "Missed lessons")).toBe(refundKey(id, 0, 500, "Missed lessons"));
    expect(refundKey(id, 0, 500, "Missed lessons")).not.toBe(refundKey(id, 0, 500, "Missed lesson"));
    expect(refundKey(id, 0, 500, "x")).not.toBe(refundKey(id, 0, 400, "x"));
    expect(refundKey(id, 0, 500, "x")).not.toBe(refundKey(id, 500, 500, "x"));
  });
});
