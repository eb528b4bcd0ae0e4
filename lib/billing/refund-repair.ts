// The worker's repair pass for refunds left pending (lib/billing/refund-payment.ts): Stripe is asked
// what it did with each attempt, found by the attempt id in the refund's metadata. A refund Stripe made
// is recorded (as the charge.refunded webhook would, should it not have come); an attempt Stripe has no
// refund for after a while was never made there, and is closed so the payment can be refunded again.
import { and, eq, lt } from "drizzle-orm";
import type { Tx as Db } from "@/db/queries/auth";
import { payments, refundAttempts } from "@/db/schema";
import { mailRefund } from "./refund-payment";
import { recordRefund, RefundError } from "./refunds";
import type { Stripe } from "./stripe";

/** An attempt this old is left to the webhook first; one older than GIVE_UP_MS without a refund at Stripe failed. */
export const REPAIR_AFTER_MS = 2 * 60_000;
const GIVE_UP_MS = 15 * 60_000;

export type RefundRepair = { recorded: number; failed: number };

export async function repairRefunds(db: Db, stripe: Stripe, now: Date = new Date()): Promise<RefundRepair> {
  const pending = await db
    .select({
      id: refundAttempts.id,
      paymentId: refundAttempts.paymentId,
      reason: refundAttempts.reason,
      createdBy: refundAttempts.createdBy,
      createdAt: refundAttempts.createdAt,
      pi: payments.stripePaymentIntentId,
      currency: payments.currency,
    })
    .from(refundAttempts)
    .innerJoin(payments, eq(payments.id, refundAttempts.paymentId))
    .where(
      and(
        eq(refundAttempts.status, "pending"),
        lt(refundAttempts.createdAt, new Date(now.getTime() - REPAIR_AFTER_MS)),
      ),
    )
    .limit(100);
  const out: RefundRepair = { recorded: 0, failed: 0 };
  for (const a of pending) {
    const made = a.pi
      ? (await stripe.refunds.list({ payment_intent: a.pi, limit: 100 })).data.find(
          (r) => r.metadata?.attempt_id === a.id,
        )
      : undefined;
    if (made && made.status !== "failed" && made.status !== "canceled") {
      try {
        await recordRefund(db, {
          paymentId: a.paymentId,
          stripeRefundId: made.id,
          amount: made.amount,
          currency: made.currency,
          reason: a.reason,
          createdBy: a.createdBy,
          createdAt: new Date(made.created * 1000),
          attemptId: a.id,
        });
      } catch (e) {
        if (!(e instanceof RefundError)) throw e;
        await close(db, a.id, `Stripe refunded ${made.id}, which does not fit the payment here: ${e.message}`);
        out.failed += 1;
        continue;
      }
      await mailRefund(db, a.paymentId, made.id, made.amount, a.currency, a.reason);
      out.recorded += 1;
    } else if (a.createdAt.getTime() < now.getTime() - GIVE_UP_MS) {
      await close(db, a.id, made ? `Stripe's refund ${made.id} ${made.status}` : "Stripe has no refund for it");
      out.failed += 1;
    }
  }
  return out;
}

async function close(db: Db, id: string, error: string): Promise<void> {
  await db
    .update(refundAttempts)
    .set({ status: "failed", error, finishedAt: new Date() })
    .where(and(eq(refundAttempts.id, id), eq(refundAttempts.status, "pending")));
}
