// Writes a Stripe subscription into the subscriptions table. Used only by the webhook handlers.
// Out-of-order delivery: each row remembers the `created` time of the event it was last written
// from; an older event changes nothing, and on a tie (events of the same second) the subscription is
// read back from Stripe, so whichever order they arrive in, the row ends as Stripe has it.
import { sql } from "drizzle-orm";
import type { Tx as Db } from "@/db/queries/auth";
import { planByPrice, subscriptionByStripeId, userByCustomer, type SubscriptionRow } from "@/db/queries/billing";
import { subscriptions } from "@/db/schema";
import { recomputeGrace } from "./grace";
import { subscriptionObject, toDate, type SubscriptionFacts } from "./objects";
import type { Stripe } from "./stripe";

export async function fetchSubscription(stripe: Stripe, id: string): Promise<SubscriptionFacts> {
  return subscriptionObject.parse(await stripe.subscriptions.retrieve(id));
}

/** Applies the subscription as of `eventCreated` (unix seconds); returns the row, or null when it is not ours. */
export async function syncSubscription(
  db: Db,
  stripe: Stripe,
  facts: SubscriptionFacts,
  eventCreated: number,
): Promise<SubscriptionRow | null> {
  const at = new Date(eventCreated * 1000);
  const existing = await subscriptionByStripeId(db, facts.id);
  const seen = existing?.stripeUpdatedAt?.getTime();
  if (seen !== undefined && seen > at.getTime()) return existing;
  const s = seen === at.getTime() ? await fetchSubscription(stripe, facts.id) : facts;
  const user = existing ? { id: existing.userId } : await userByCustomer(db, s.customer);
  const userId = user?.id ?? s.metadata.userId;
  const plan = s.priceId ? await planByPrice(db, s.priceId, s.productId) : null;
  const planId = plan?.id ?? existing?.planId ?? s.metadata.planId;
  if (!userId || !planId) {
    console.warn(
      `[billing] subscription ${s.id}: no member or plan of ours (customer ${s.customer}, price ${s.priceId}); ignored`,
    );
    return null;
  }
  const values = {
    userId,
    planId,
    stripeSubscriptionId: s.id,
    status: s.status,
    currentPeriodStart: toDate(s.periodStart),
    currentPeriodEnd: toDate(s.periodEnd),
    canceledAt: toDate(s.canceledAt),
    cancelAtPeriodEnd: s.cancelAtPeriodEnd,
    stripeUpdatedAt: at,
    startedAt: toDate(s.startedAt) ?? at,
    endedAt: toDate(s.endedAt),
  };
  const { userId: _u, stripeSubscriptionId: _s, startedAt: _st, ...changes } = values;
  const [row] = await db
    .insert(subscriptions)
    .values(values)
    .onConflictDoUpdate({
      target: subscriptions.stripeSubscriptionId,
      set: changes,
      // A concurrent delivery of a newer event may have landed since the read above.
      setWhere: sql`${subscriptions.stripeUpdatedAt} is null or ${subscriptions.stripeUpdatedAt} <= ${at.toISOString()}`,
    })
    .returning();
  const result = row ?? (await subscriptionByStripeId(db, s.id));
  if (result) await recomputeGrace(db, result.id);
  return result;
}

/** The row of a Stripe subscription, read from Stripe and written when an invoice or checkout event comes first. */
export async function ensureSubscription(
  db: Db,
  stripe: Stripe,
  stripeId: string,
  eventCreated: number,
): Promise<SubscriptionRow | null> {
  const existing = await subscriptionByStripeId(db, stripeId);
  if (existing) return existing;
  return syncSubscription(db, stripe, await fetchSubscription(stripe, stripeId), eventCreated);
}
