// Refunds (issue 7 item 6): partial and full through the admin route and Stripe (the stand-in),
// never more than the payment took, one record per Stripe refund however often it is seen, and the
// same figures in the admin table and on the student's billing data.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { payments, refunds } from "@/db/schema";
import { billingWorld, type BillingWorld } from "./helpers/billing-world";

let w: BillingWorld;
let adminCookie: string;
let adminId: string;
let student: { id: string; email: string };
let studentCookie: string;
let paymentId: string;
let planId: string;

beforeAll(async () => {
  w = await billingWorld();
  const admin = await w.person("admin");
  adminId = admin.id;
  adminCookie = await w.cookieFor(admin.id);
  planId = (await w.plan(adminCookie, { name: "Monthly membership", amount: 1800, currency: "GBP", interval: "month" }))
    .id;
  student = await w.person("student", { name: "Perpetua Refundwell" });
  studentCookie = await w.cookieFor(student.id);
  await w.subscribe(studentCookie, planId);
  const [p] = await w.db.select().from(payments).where(eq(payments.userId, student.id));
  paymentId = p.id;
}, 60_000);
afterAll(async () => w?.close());

const payment = async () => (await w.db.select().from(payments).where(eq(payments.id, paymentId)))[0];
const refundRows = async () => w.db.select().from(refunds).where(eq(refunds.paymentId, paymentId));
const refund = (body: Record<string, unknown>, id = paymentId) =>
  w.call("admin/payments/[id]/refunds", "POST", { cookie: adminCookie, params: { id }, body });

describe("refunds", () => {
  it("refunds part of a payment through Stripe and records it with the reason", async () => {
    expect(await payment()).toMatchObject({ amount: 1800, refundedAmount: 0, status: "paid" });
    const res = await refund({ amount: 500, reason: "Missed two lessons" });
    expect(res.status).toBe(201);
    await w.fake.settled(); // the charge.refunded webhook for the same refund arrives too
    expect(await payment()).toMatchObject({ refundedAmount: 500, status: "partially_refunded" });
    const rows = await refundRows();
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ amount: 500, reason: "Missed two lessons", createdBy: adminId, currency: "GBP" });
    // Stripe's side agrees (Stripe API reference: Refund object).
    const remote = await w.stripe().refunds.retrieve(rows[0].stripeRefundId);
    expect(remote.amount).toBe(500);
    expect((await w.mailsTo(student.email)).filter((m) => m.template === "refund-issued")).toHaveLength(1);
  });

  it("refuses more than what remains, naming the amount, and leaves the payment as it was", async () => {
    const before = await payment();
    const res = await refund({ amount: 1301, reason: "Too much" });
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: string; fieldErrors: Record<string, string> };
    expect(body.fieldErrors.amount).toMatch(/1300/);
    expect(await payment()).toEqual(before);
    expect(await refundRows()).toHaveLength(1);
  });

  it("needs a reason and a whole positive amount of minor units", async () => {
    for (const [body, field] of [
      [{ amount: 100 }, "reason"],
      [{ amount: 100, reason: "  " }, "reason"],
      [{ amount: 1.5, reason: "x" }, "amount"],
      [{ amount: -3, reason: "x" }, "amount"],
    ] as const) {
      const res = await refund(body);
      expect(res.status, JSON.stringify(body)).toBe(422);
      expect(Object.keys(((await res.json()) as { fieldErrors: Record<string, string> }).fieldErrors)).toContain(field);
    }
    expect((await refund({ reason: "x" }, "00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await refund({ reason: "x" }, "not-a-payment")).status).toBe(404);
  });

  it("refunds the rest in full when no amount is given, then refuses any more", async () => {
    const res = await refund({ reason: "Leaving the school" });
    expect(res.status).toBe(201);
    await w.fake.settled();
    expect(await payment()).toMatchObject({ refundedAmount: 1800, status: "refunded" });
    expect((await refund({ amount: 1, reason: "Once more" })).status).toBe(422);
    expect((await refundRows()).map((r) => r.amount).sort((a, b) => a - b)).toEqual([500, 1300]);
  });

  it("records the same Stripe refund once, whichever path sees it and however often", async () => {
    const { recordRefund } = await import("@/lib/billing/refunds");
    const [first] = await refundRows();
    const again = await recordRefund(w.db, {
      paymentId,
      stripeRefundId: first.stripeRefundId,
      amount: first.amount,
      currency: "GBP",
      reason: "seen twice",
    });
    expect(again.recorded).toBe(false);
    expect(await refundRows()).toHaveLength(2);
    expect((await payment()).refundedAmount).toBe(1800);
  });

  it("lets only one of two refunds at once through when together they would exceed the payment", async () => {
    const { recordRefund } = await import("@/lib/billing/refunds");
    const [p] = await w.db
      .insert(payments)
      .values({
        userId: student.id,
        planId,
        stripeInvoiceId: "in_race",
        stripePaymentIntentId: "pi_race",
        kind: "renewal",
        amount: 1800,
        currency: "GBP",
        status: "paid",
        createdAt: new Date(),
      })
      .returning();
    const both = await Promise.allSettled([
      recordRefund(w.db, { paymentId: p.id, stripeRefundId: "re_race_a", amount: 1000, currency: "GBP", reason: "a" }),
      recordRefund(w.db, { paymentId: p.id, stripeRefundId: "re_race_b", amount: 1000, currency: "GBP", reason: "b" }),
    ]);
    expect(both.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    const rejected = both.find((r) => r.status === "rejected");
    expect(rejected?.status === "rejected" && String(rejected.reason)).toMatch(/800/);
    const [after] = await w.db.select().from(payments).where(eq(payments.id, p.id));
    expect(after).toMatchObject({ refundedAmount: 1000, status: "partially_refunded" });
  });

  it("shows the refund the same in the admin table and in the student's billing data", async () => {
    const table = await w.call("admin/payments", "GET", {
      cookie: adminCookie,
      query: `?q=${encodeURIComponent("refundwell")}&sort=date&dir=asc`,
    });
    const rows = ((await table.json()) as { rows: { id: string; refundedAmount: number; status: string }[] }).rows;
    const inTable = rows.find((r) => r.id === paymentId);
    expect(inTable).toMatchObject({ refundedAmount: 1800, status: "refunded" });
    const mine = await w.call("billing", "GET", { cookie: studentCookie });
    expect(mine.status).toBe(200);
    const summary = (await mine.json()) as {
      payments: { id: string; refundedAmount: number; status: string; refunds: { amount: number; reason: string }[] }[];
    };
    const onBilling = summary.payments.find((p) => p.id === paymentId);
    expect(onBilling).toMatchObject({ refundedAmount: inTable?.refundedAmount, status: inTable?.status });
    expect(onBilling?.refunds.map((r) => r.amount).sort((a, b) => a - b)).toEqual([500, 1300]);
    expect(onBilling?.refunds.map((r) => r.reason)).toContain("Missed two lessons");
  });
});
