// Plans, subscriptions and payments as the app and the webhook handlers read and write them.
// Subscriptions and payments are written only by lib/billing/webhooks/* (never from a redirect).
import { and, asc, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { payments, plans, refunds, subscriptions, users } from "../schema";

export type PlanRow = typeof plans.$inferSelect;
export type SubscriptionRow = typeof subscriptions.$inferSelect;
export type PaymentRow = typeof payments.$inferSelect;

export async function listPlans(db: Db, o: { activeOnly?: boolean } = {}): Promise<PlanRow[]> {
  return db
    .select()
    .from(plans)
    .where(o.activeOnly ? isNull(plans.retiredAt) : undefined)
    .orderBy(asc(plans.retiredAt), asc(plans.amount), asc(plans.name));
}

export async function findPlan(db: Db, id: string): Promise<PlanRow | null> {
  if (!/^[0-9a-f-]{36}$/i.test(id)) return null;
  const [row] = await db.select().from(plans).where(eq(plans.id, id)).limit(1);
  return row ?? null;
}

/** The plan a Stripe price belongs to: the current price, or one it was replaced by (see plans.ts). */
export async function planByPrice(db: Db, priceId: string, productId?: string | null): Promise<PlanRow | null> {
  const [row] = await db.select().from(plans).where(eq(plans.stripePriceId, priceId)).limit(1);
  if (row || !productId) return row ?? null;
  const [byProduct] = await db.select().from(plans).where(eq(plans.stripeProductId, productId)).limit(1);
  return byProduct ?? null;
}

export async function planInUse(db: Db, planId: string): Promise<boolean> {
  const [s] = await db
    .select({ id: subscriptions.id })
    .from(subscriptions)
    .where(eq(subscriptions.planId, planId))
    .limit(1);
  const [p] = await db.select({ id: payments.id }).from(payments).where(eq(payments.planId, planId)).limit(1);
  return Boolean(s || p);
}

export async function userByCustomer(
  db: Db,
  customerId: string,
): Promise<{ id: string; email: string; name: string } | null> {
  const [row] = await db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(eq(users.stripeCustomerId, customerId))
    .limit(1);
  return row ?? null;
}

export async function customerOf(db: Db, userId: string): Promise<string | null> {
  const [row] = await db.select({ c: users.stripeCustomerId }).from(users).where(eq(users.id, userId)).limit(1);
  return row?.c ?? null;
}

export async function setCustomer(db: Db, userId: string, customerId: string): Promise<void> {
  await db.update(users).set({ stripeCustomerId: customerId }).where(eq(users.id, userId));
}

export async function subscriptionByStripeId(db: Db, stripeId: string): Promise<SubscriptionRow | null> {
  const [row] = await db.select().from(subscriptions).where(eq(subscriptions.stripeSubscriptionId, stripeId)).limit(1);
  return row ?? null;
}

/** The subscription the billing page shows: one in good standing if any, else the newest. */
export async function currentSubscriptionOf(
  db: Db,
  userId: string,
): Promise<(SubscriptionRow & { plan: PlanRow }) | null> {
  const rows = await db
    .select({ s: subscriptions, p: plans })
    .from(subscriptions)
    .innerJoin(plans, eq(plans.id, subscriptions.planId))
    .where(eq(subscriptions.userId, userId))
    .orderBy(
      sql`case when ${subscriptions.status} in ('active','trialing','past_due','unpaid') then 0 else 1 end`,
      desc(subscriptions.startedAt),
    )
    .limit(1);
  return rows[0] ? { ...rows[0].s, plan: rows[0].p } : null;
}

export type PaymentWithRefunds = PaymentRow & {
  planName: string | null;
  refunds: { id: string; amount: number; currency: string; reason: string; createdAt: Date }[];
};

/** A person's payments, newest first, each with its refunds. */
export async function paymentsOf(db: Db, userId: string, paymentId?: string): Promise<PaymentWithRefunds[]> {
  const rows = await db
    .select({ p: payments, planName: plans.name })
    .from(payments)
    .leftJoin(plans, eq(plans.id, payments.planId))
    .where(and(eq(payments.userId, userId), paymentId ? eq(payments.id, paymentId) : undefined))
    .orderBy(desc(payments.createdAt));
  const ids = rows.map((r) => r.p.id);
  const refundRows = ids.length
    ? await db
        .select({
          id: refunds.id,
          paymentId: refunds.paymentId,
          amount: refunds.amount,
          currency: refunds.currency,
          reason: refunds.reason,
          createdAt: refunds.createdAt,
        })
        .from(refunds)
        .where(inArray(refunds.paymentId, ids))
        .orderBy(asc(refunds.createdAt))
    : [];
  return rows.map((r) => ({ ...r.p, planName: r.planName, refunds: refundRows.filter((x) => x.paymentId === r.p.id) }));
}

export async function paymentByInvoice(db: Db, invoiceId: string): Promise<PaymentRow | null> {
  const [row] = await db.select().from(payments).where(eq(payments.stripeInvoiceId, invoiceId)).limit(1);
  return row ?? null;
}

export async function paymentByIntent(db: Db, paymentIntentId: string): Promise<PaymentRow | null> {
  const [row] = await db.select().from(payments).where(eq(payments.stripePaymentIntentId, paymentIntentId)).limit(1);
  return row ?? null;
}
