// The admin's refund, never half-done: the input is checked and an attempt written (one pending per
// payment) before Stripe is asked; Stripe's refund is then recorded with it. When that last write fails
// after Stripe said yes, the attempt stays pending and the charge.refunded webhook or the worker's
// repair pass (./refund-repair.ts) records it from Stripe; the admin is told the refund was made.
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import Stripe from "stripe";
import type { Tx as Db } from "@/db/queries/auth";
import { payments, refundAttempts, users } from "@/db/schema";
import { sqlState } from "@/lib/auth/errors";
import { enqueueEmail } from "@/lib/mail/outbox";
import { formatMoney } from "./money";
import { recordRefund, RefundError, type RecordRefundResult } from "./refunds";
import { stripe as appStripe } from "./stripe";

export type RefundRequest = { paymentId: string; amount?: number; reason: string };

/** The part of the Stripe SDK a refund needs (the app's client, or a test's). */
export type RefundsApi = { refunds: { create: Stripe["refunds"]["create"] } };

export const REFUND_IN_PROGRESS =
  "Another refund of this payment is in progress. Wait a moment, reload the page and look again before refunding more.";
export const REASON_MAX = 500;

/** Stripe made the refund but it is not recorded here yet; the webhook or the repair pass will record it. */
export class RefundPendingError extends Error {
  constructor(
    readonly stripeRefundId: string,
    readonly amount: number,
    readonly currency: string,
  ) {
    super(
      `Stripe has refunded ${formatMoney(amount, currency)}, but recording it here failed for now. ` +
        "It will appear on this payment within a few minutes; do not refund it again.",
    );
  }
}

/** Stripe could not be asked, or gave no answer: whether it refunded is checked by the repair pass. */
export class RefundUnknownError extends Error {}

/** The reason as stored and sent to Stripe: trimmed, NFC, no control characters but tab and line breaks. */
export function normaliseReason(reason: string): string {
  const r = reason.normalize("NFC").trim();
  if (!r) throw new RefundError("bad_reason", "Say why the payment is refunded.", "reason");
  if (r.length > REASON_MAX)
    throw new RefundError("bad_reason", `Keep the reason under ${REASON_MAX} characters.`, "reason");
  if (/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/.test(r)) {
    throw new RefundError("bad_reason", "The reason must not contain control characters.", "reason");
  }
  return r;
}

/** Made from the request's own values: a repeat of the same request is the same refund at Stripe,
 * and a corrected one (another amount or reason) is a new request (Stripe docs: "Idempotent requests"). */
export function refundKey(paymentId: string, refundedBefore: number, amount: number, reason: string): string {
  const digest = createHash("sha256").update(reason).digest("hex").slice(0, 24);
  return `refund:${paymentId}:${refundedBefore}:${amount}:${digest}`;
}

type Begun = { attemptId: string; key: string; pi: string; amount: number; currency: string };

/** Checks what remains with the payment locked, and writes the pending attempt; one at a time per payment. */
async function begin(db: Db, adminId: string, req: RefundRequest, reason: string): Promise<Begun> {
  try {
    return await db.transaction(async (tx) => {
      const [p] = await tx
        .select({
          id: payments.id,
          amount: payments.amount,
          refundedAmount: payments.refundedAmount,
          currency: payments.currency,
          status: payments.status,
          pi: payments.stripePaymentIntentId,
        })
        .from(payments)
        .where(eq(payments.id, req.paymentId))
        .for("update");
      if (!p) throw new RefundError("payment_not_found", "We couldn't find that payment.", "paymentId");
      if (p.status === "failed" || !p.pi)
        throw new RefundError(
          "not_refundable",
          "A failed payment took no money, so there is nothing to refund.",
          "paymentId",
        );
      const [pending] = await tx
        .select({ id: refundAttempts.id })
        .from(refundAttempts)
        .where(and(eq(refundAttempts.paymentId, p.id), eq(refundAttempts.status, "pending")));
      if (pending) throw new RefundError("in_progress", REFUND_IN_PROGRESS, "paymentId");
      const remaining = p.amount - p.refundedAmount;
      const amount = req.amount ?? remaining;
      if (remaining === 0) throw new RefundError("over_refund", "This payment has been refunded in full already.");
      if (!Number.isInteger(amount) || amount <= 0)
        throw new RefundError("bad_amount", "A refund amount must be a whole number of minor units above zero.");
      if (amount > remaining)
        throw new RefundError(
          "over_refund",
          `At most ${remaining} (minor units of ${p.currency}) of this payment is left to refund; ${amount} was asked.`,
        );
      const key = refundKey(p.id, p.refundedAmount, amount, reason);
      const [attempt] = await tx
        .insert(refundAttempts)
        .values({ paymentId: p.id, amount, reason, createdBy: adminId, idempotencyKey: key })
        .returning({ id: refundAttempts.id });
      return { attemptId: attempt.id, key, pi: p.pi, amount, currency: p.currency };
    });
  } catch (e) {
    // The payment's one pending attempt, written by a refund that got there first.
    if (sqlState(e) === "23505") throw new RefundError("in_progress", REFUND_IN_PROGRESS, "paymentId");
    throw e;
  }
}

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
  const reason = normaliseReason(req.reason);
  // The client only now: a refusal above needs no Stripe (nor its settings).
  const client = stripe ?? appStripe();
  const b = await begin(db, admin.id, req, reason);
  let refund: Stripe.Refund;
  try {
    refund = await client.refunds.create(
      {
        payment_intent: b.pi,
        amount: b.amount,
        reason: "requested_by_customer",
        metadata: { reason, created_by: admin.id, payment_id: req.paymentId, attempt_id: b.attemptId },
      },
      { idempotencyKey: b.key },
    );
  } catch (e) {
    // No answer, or Stripe's own failure: it may or may not have refunded; the repair pass asks it later.
    if (e instanceof Stripe.errors.StripeConnectionError || e instanceof Stripe.errors.StripeAPIError) {
      throw new RefundUnknownError(e.message);
    }
    // Refused (Stripe docs: "Error handling"): nothing was refunded, and the attempt is over.
    await db
      .update(refundAttempts)
      .set({ status: "failed", error: e instanceof Error ? e.message : String(e), finishedAt: new Date() })
      .where(eq(refundAttempts.id, b.attemptId));
    throw e;
  }
  let result: RecordRefundResult;
  try {
    result = await recordRefund(db, {
      paymentId: req.paymentId,
      stripeRefundId: refund.id,
      amount: refund.amount,
      currency: refund.currency,
      reason,
      createdBy: admin.id,
      attemptId: b.attemptId,
    });
  } catch (e) {
    console.error(`[billing] refund ${refund.id} made at Stripe; recording it failed, the webhook or repair will`, e);
    await db
      .update(refundAttempts)
      .set({ stripeRefundId: refund.id })
      .where(eq(refundAttempts.id, b.attemptId))
      .catch(() => {});
    throw new RefundPendingError(refund.id, refund.amount, b.currency);
  }
  // The webhook queues the same message under the same key should this fail.
  await mailRefund(db, req.paymentId, refund.id, refund.amount, b.currency, reason).catch((e: unknown) =>
    console.error(`[billing] refund ${refund.id}: the member's e-mail is left to the webhook`, e),
  );
  return result;
}

/** "refund-issued" to the member; the same key as the charge.refunded webhook's, so one mail whichever path comes first. */
export async function mailRefund(
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
