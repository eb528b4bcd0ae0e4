// Refunds (issue 7 item 6): one place that records a refund against a payment, used by the admin's
// refund action (after Stripe accepted it) and by the charge.refunded webhook (lib/billing/webhooks/).
// Both paths may see the same Stripe refund: the refund id is unique, so it is recorded once.
import { and, eq, sql } from "drizzle-orm";
import type Stripe from "stripe";
import type { Tx as Db } from "@/db/queries/auth";
import { payments, refunds } from "@/db/schema";
import { enqueueEmail } from "@/lib/mail/outbox";
import { users } from "@/db/schema";
import { formatMoney } from "./money";
import { stripe as appStripe } from "./stripe";

export type RefundPaymentRef = { paymentId: string } | { stripePaymentIntentId: string } | { stripeInvoiceId: string };

export type RecordRefundInput = RefundPaymentRef & {
  stripeRefundId: string;
  /** Integer minor units of `currency`, > 0. */
  amount: number;
  currency: string;
  reason: string;
  createdBy?: string | null;
  createdAt?: Date;
};

export type RefundedPayment = {
  id: string;
  amount: number;
  refundedAmount: number;
  currency: string;
  status: PaymentStatus;
};
type PaymentStatus = (typeof payments.$inferSelect)["status"];

export type RecordRefundResult = { recorded: boolean; refundId: string; payment: RefundedPayment };

export type RefundErrorCode =
  "payment_not_found" | "not_refundable" | "over_refund" | "currency_mismatch" | "bad_amount";

/** A refund the payment cannot take; `field` names the input at fault for a 422. */
export class RefundError extends Error {
  constructor(
    readonly code: RefundErrorCode,
    message: string,
    readonly field: "amount" | "paymentId" | "currency" = "amount",
  ) {
    super(message);
  }
}

function whereRef(ref: RefundPaymentRef) {
  if ("paymentId" in ref) return eq(payments.id, ref.paymentId);
  if ("stripePaymentIntentId" in ref) return eq(payments.stripePaymentIntentId, ref.stripePaymentIntentId);
  return eq(payments.stripeInvoiceId, ref.stripeInvoiceId);
}

/** Pure: the status a payment has after `refunded` of `amount` went back. */
export function statusAfterRefund(amount: number, refunded: number): PaymentStatus {
  if (refunded <= 0) return "paid";
  return refunded >= amount ? "refunded" : "partially_refunded";
}

/**
 * Records one Stripe refund: a refunds row and the payment's refunded_amount/status, in one
 * transaction with the payment row locked (SELECT … FOR UPDATE) so two refunds at once cannot
 * together exceed the amount. A refund id seen before changes nothing (recorded: false).
 */
export async function recordRefund(db: Db, input: RecordRefundInput): Promise<RecordRefundResult> {
  if (!Number.isInteger(input.amount) || input.amount <= 0) {
    throw new RefundError("bad_amount", "A refund amount must be a whole number of minor units above zero.");
  }
  return db.transaction(async (tx) => {
    const [p] = await tx
      .select({
        id: payments.id,
        amount: payments.amount,
        refundedAmount: payments.refundedAmount,
        currency: payments.currency,
        status: payments.status,
      })
      .from(payments)
      .where(whereRef(input))
      .for("update");
    if (!p) throw new RefundError("payment_not_found", "No payment matches this refund.", "paymentId");
    const [seen] = await tx
      .select({ id: refunds.id, createdBy: refunds.createdBy })
      .from(refunds)
      .where(eq(refunds.stripeRefundId, input.stripeRefundId));
    if (seen) {
      // The webhook may have recorded it first: keep who asked for it when the admin path arrives second.
      if (!seen.createdBy && input.createdBy) {
        await tx
          .update(refunds)
          .set({ createdBy: input.createdBy, reason: input.reason })
          .where(eq(refunds.id, seen.id));
      }
      return { recorded: false, refundId: seen.id, payment: p };
    }
    if (p.status === "failed")
      throw new RefundError(
        "not_refundable",
        "A failed payment took no money, so there is nothing to refund.",
        "paymentId",
      );
    if (input.currency.toUpperCase() !== p.currency.toUpperCase()) {
      throw new RefundError(
        "currency_mismatch",
        `The refund is in ${input.currency.toUpperCase()} but the payment was in ${p.currency}.`,
        "currency",
      );
    }
    const remaining = p.amount - p.refundedAmount;
    if (input.amount > remaining) {
      throw new RefundError(
        "over_refund",
        `At most ${remaining} (minor units of ${p.currency}) of this payment is left to refund; ${input.amount} was asked.`,
      );
    }
    const [row] = await tx
      .insert(refunds)
      .values({
        paymentId: p.id,
        stripeRefundId: input.stripeRefundId,
        amount: input.amount,
        currency: p.currency,
        reason: input.reason,
        createdBy: input.createdBy ?? null,
        createdAt: input.createdAt ?? new Date(),
      })
      .returning({ id: refunds.id });
    const refundedAmount = p.refundedAmount + input.amount;
    const status = statusAfterRefund(p.amount, refundedAmount);
    await tx
      .update(payments)
      .set({ refundedAmount: sql`${payments.refundedAmount} + ${input.amount}`, status })
      .where(and(eq(payments.id, p.id)));
    return { recorded: true, refundId: row.id, payment: { ...p, refundedAmount, status } };
  });
}

export type RefundRequest = { paymentId: string; amount?: number; reason: string };

/** The part of the Stripe SDK a refund needs (the app's client, or a test's). */
export type RefundsApi = { refunds: { create: Stripe["refunds"]["create"] } };

/**
 * The admin's refund: checks what remains, asks Stripe (through the SDK) to refund, then records it.
 * The charge.refunded webhook Stripe sends for the same refund finds it already recorded.
 */
export async function refundPayment(
  db: Db,
  admin: { id: string },
  req: RefundRequest,
  stripe?: RefundsApi,
): Promise<RecordRefundResult> {
  const reason = req.reason.trim();
  if (!reason) throw new RefundError("bad_amount", "Say why the payment is refunded.", "amount");
  const [p] = await db
    .select({
      id: payments.id,
      amount: payments.amount,
      refundedAmount: payments.refundedAmount,
      currency: payments.currency,
      status: payments.status,
      pi: payments.stripePaymentIntentId,
    })
    .from(payments)
    .where(eq(payments.id, req.paymentId));
  if (!p) throw new RefundError("payment_not_found", "We couldn't find that payment.", "paymentId");
  if (p.status === "failed" || !p.pi)
    throw new RefundError(
      "not_refundable",
      "A failed payment took no money, so there is nothing to refund.",
      "paymentId",
    );
  const remaining = p.amount - p.refundedAmount;
  const amount = req.amount ?? remaining;
  if (!Number.isInteger(amount) || amount <= 0) {
    throw new RefundError(
      remaining === 0 ? "over_refund" : "bad_amount",
      remaining === 0
        ? "This payment has been refunded in full already."
        : "A refund amount must be a whole number of minor units above zero.",
    );
  }
  if (amount > remaining)
    throw new RefundError(
      "over_refund",
      `At most ${remaining} (minor units of ${p.currency}) of this payment is left to refund; ${amount} was asked.`,
    );
  // The key ties the request to the payment's refund state, so a double click makes one refund
  // (Stripe docs: "Idempotent requests").
  // The client only now: a refusal above needs no Stripe (nor its settings).
  const refund = await (stripe ?? appStripe()).refunds.create(
    {
      payment_intent: p.pi,
      amount,
      reason: "requested_by_customer",
      metadata: { reason, created_by: admin.id, payment_id: p.id },
    },
    { idempotencyKey: `refund:${p.id}:${p.refundedAmount}:${amount}` },
  );
  const result = await recordRefund(db, {
    paymentId: p.id,
    stripeRefundId: refund.id,
    amount: refund.amount,
    currency: refund.currency,
    reason,
    createdBy: admin.id,
  });
  await mailRefund(db, p.id, refund.id, refund.amount, p.currency, reason);
  return result;
}

/** "refund-issued" to the member; the same key as the charge.refunded webhook's, so one mail whichever path comes first. */
async function mailRefund(
  db: Db,
  paymentId: string,
  stripeRefundId: string,
  amount: number,
  currency: string,
  reason: string,
): Promise<void> {
  const [p] = await db
    .select({
      email: users.email,
      name: users.name,
      receipt: payments.receiptNumber,
      invoice: payments.stripeInvoiceId,
    })
    .from(payments)
    .innerJoin(users, eq(users.id, payments.userId))
    .where(eq(payments.id, paymentId));
  if (!p) return;
  await enqueueEmail(db, {
    to: p.email,
    template: "refund-issued",
    data: {
      name: p.name,
      amount: formatMoney(amount, currency),
      receiptNumber: p.receipt ?? p.invoice,
      reason,
      receiptUrl: `/learn/billing/receipts/${paymentId}`,
    },
    dedupeKey: `refund-issued:${stripeRefundId}`,
  });
}
