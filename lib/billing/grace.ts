import { desc, eq } from "drizzle-orm";
import type { Tx as Db } from "@/db/queries/auth";
import { payments, subscriptions } from "@/db/schema";

/** Days a member keeps access after a failed renewal (common practice: a week to update the card). */
export const GRACE_DAYS = 7;

/**
 * Grace follows from the payments alone, so events in any order give the same answer: when the
 * subscription's newest invoice failed, access stays open until GRACE_DAYS after that invoice was
 * raised (Stripe's own time, so a replay computes the same date); otherwise there is no grace.
 */
export async function recomputeGrace(db: Db, subscriptionId: string): Promise<void> {
  const [latest] = await db
    .select({ status: payments.status, createdAt: payments.createdAt })
    .from(payments)
    .where(eq(payments.subscriptionId, subscriptionId))
    .orderBy(desc(payments.createdAt), desc(payments.stripeInvoiceId))
    .limit(1);
  const graceUntil =
    latest?.status === "failed" ? new Date(latest.createdAt.getTime() + GRACE_DAYS * 86_400_000) : null;
  await db.update(subscriptions).set({ graceUntil }).where(eq(subscriptions.id, subscriptionId));
}
