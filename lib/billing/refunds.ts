// Refunds: one place that records a refund against a payment, used by the admin's refund
// (./refund-payment.ts, after Stripe accepted it), by the charge.refunded webhook (./webhooks/) and by
// the worker's repair pass (./refund-repair.ts). All may see the same Stripe refund: the refund id is
// unique, so it is recorded once, and the refund attempt it answers is marked done with it.
import { and, eq, sql } from "drizzle-orm";
import type { Tx as Db } from "@/db/queries/auth";
import { payments, refundAttempts, refunds } from "@/db/schema";

export type RefundPaymentRef = { paymentId: string } | { stripePaymentIntentId: string } | { stripeInvoiceId: string };

export type RecordRefundInput = RefundPaymentRef & {
  stripeRefundId: string;
  /** Integer minor units of `currency`, > 0. */
  amount: number;
  currency: string;
  reason: string;
  createdBy?: string | null;
  createdAt?: Date;
  /** The refund attempt (refund_attempts) this Stripe refund answers, when known (its metadata says). */
  attemptId?: string | null;
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
  | "payment_not_found"
  | "not_refundable"
  | "over_refund"
  | "currency_mismatch"
  | "bad_amount"
  | "bad_reason"
  | "in_progress";

/** A refund the payment cannot take; `field` names the input at fault for a 422. */
export class RefundError extends Error {
  constructor(
    readonly code: RefundErrorCode,
    message: string,
    readonly field: "amount" | "paymentId" | "currency" | "reason" = "amount",
  ) {
    super(message);
  }
}

function whereRef(ref: RefundPaymentRef) {
  if ("paymentId" in ref) return eq(payments.id, ref.paymentId);
  if ("stripePaymentIntentId" in ref) return eq(payments.stripePaymentIntentId, ref.stripePaymentIntentId);
  return eq(payments.stripeInvoiceId, ref.stripeInvoiceId);
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** An id from Stripe's metadata, only when it has the shape of one of ours (metadata is free text). */
export const uuidOrNull = (v: string | null | undefined) => (v && UUID.test(v) ? v : null);

/**
 * Text from outside (Stripe's metadata, a refund's reason) as PostgreSQL text can store it: NUL, which
 * text cannot hold, and other C0 controls but tab and line breaks become U+FFFD, visibly replaced.
 */
export function storableText(s: string): string {
  return s.replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/g, "\ufffd");
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
    const reason = storableText(input.reason);
    const createdBy = input.createdBy ?? (await attemptBy(tx, input.attemptId));
    if (seen) {
      // The webhook may have recorded it first: keep who asked for it when the admin path arrives second.
      if (!seen.createdBy && createdBy) {
        await tx.update(refunds).set({ createdBy, reason }).where(eq(refunds.id, seen.id));
      }
      await attemptDone(tx, input);
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
        reason,
        createdBy,
        createdAt: input.createdAt ?? new Date(),
      })
      .returning({ id: refunds.id });
    const refundedAmount = p.refundedAmount + input.amount;
    const status = statusAfterRefund(p.amount, refundedAmount);
    await tx
      .update(payments)
      .set({ refundedAmount: sql`${payments.refundedAmount} + ${input.amount}`, status })
      .where(and(eq(payments.id, p.id)));
    await attemptDone(tx, input);
    return { recorded: true, refundId: row.id, payment: { ...p, refundedAmount, status } };
  });
}

/** Who asked for the attempt (the webhook and the repair pass know only its id). */
async function attemptBy(tx: Db, attemptId: string | null | undefined): Promise<string | null> {
  const id = uuidOrNull(attemptId);
  if (!id) return null;
  const [a] = await tx.select({ by: refundAttempts.createdBy }).from(refundAttempts).where(eq(refundAttempts.id, id));
  return a?.by ?? null;
}

/** The attempt this refund answers is over (found by its id, or by the Stripe refund id saved on it). */
async function attemptDone(tx: Db, input: RecordRefundInput): Promise<void> {
  const which = uuidOrNull(input.attemptId)
    ? eq(refundAttempts.id, input.attemptId as string)
    : eq(refundAttempts.stripeRefundId, input.stripeRefundId);
  await tx
    .update(refundAttempts)
    .set({ status: "done", stripeRefundId: input.stripeRefundId, finishedAt: new Date() })
    .where(and(which, eq(refundAttempts.status, "pending")));
}
