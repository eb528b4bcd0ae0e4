// The subscriptions the membership gate reads (lib/billing/gate.ts). Written only by the Stripe
// webhook handlers (lib/billing/), never from a checkout's success redirect.
import { desc, eq } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { plans, subscriptions } from "../schema";

export type MembershipRow = {
  subscriptionId: string;
  planName: string;
  status: (typeof subscriptions.$inferSelect)["status"];
  currentPeriodEnd: Date | null;
  cancelAtPeriodEnd: boolean;
  graceUntil: Date | null;
};

/** A person's subscriptions, newest first. */
export async function membershipsOf(db: Db, userId: string): Promise<MembershipRow[]> {
  return db
    .select({
      subscriptionId: subscriptions.id,
      planName: plans.name,
      status: subscriptions.status,
      currentPeriodEnd: subscriptions.currentPeriodEnd,
      cancelAtPeriodEnd: subscriptions.cancelAtPeriodEnd,
      graceUntil: subscriptions.graceUntil,
    })
    .from(subscriptions)
    .innerJoin(plans, eq(plans.id, subscriptions.planId))
    .where(eq(subscriptions.userId, userId))
    .orderBy(desc(subscriptions.startedAt));
}
