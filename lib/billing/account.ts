// The student's own membership (issue 7 item 5): what the billing page shows, and the changes a
// member asks Stripe for. Every change goes to Stripe; the row here follows when Stripe's webhook
// arrives (membership state is written from webhooks only).
import type { Tx as Db } from "@/db/queries/auth";
import { currentSubscriptionOf, customerOf, findPlan, listPlans, paymentsOf } from "@/db/queries/billing";
import { conflict, notFound, unprocessable } from "@/lib/auth/errors";
import { env } from "@/lib/env";
import { standingOf } from "./gate";
import { formatDay } from "./money";
import type { Stripe } from "./stripe";

type Sub = NonNullable<Awaited<ReturnType<typeof currentSubscriptionOf>>>;

/** The status in a member's words. */
export function statusWords(
  s: Pick<Sub, "status" | "cancelAtPeriodEnd" | "currentPeriodEnd" | "graceUntil">,
  now = new Date(),
  tz = "Europe/London",
): string {
  const day = (d: Date | null) => (d ? formatDay(d, tz) : "the end of this period");
  switch (s.status) {
    case "active":
    case "trialing":
      if (s.currentPeriodEnd && s.currentPeriodEnd <= now) return "Ended";
      return s.cancelAtPeriodEnd ? `Active until ${day(s.currentPeriodEnd)}, then it ends (you cancelled)` : "Active";
    case "past_due":
      return s.graceUntil && s.graceUntil > now
        ? `Payment failed: lessons stay open until ${day(s.graceUntil)}; update your card to keep them`
        : "Payment failed: lessons are closed until the payment goes through";
    case "unpaid":
      return "Unpaid: lessons are closed until the open invoice is paid";
    case "canceled":
    case "incomplete_expired":
      return "Ended";
    case "incomplete":
      return "Waiting for the first payment";
    case "paused":
      return "Paused";
  }
}

export async function billingSummary(db: Db, userId: string, now = new Date()) {
  const [sub, payments, plans] = await Promise.all([
    currentSubscriptionOf(db, userId),
    paymentsOf(db, userId),
    listPlans(db, { activeOnly: true }),
  ]);
  const live = sub && sub.status !== "canceled" && sub.status !== "incomplete_expired";
  const good = sub ? standingOf({ ...sub, subscriptionId: sub.id, planName: sub.plan.name }, now).good : false;
  const nextCharge =
    live &&
    !sub.cancelAtPeriodEnd &&
    sub.currentPeriodEnd &&
    (sub.status === "active" || sub.status === "trialing" || sub.status === "past_due")
      ? { date: sub.currentPeriodEnd.toISOString(), amount: sub.plan.amount, currency: sub.plan.currency }
      : null;
  return {
    membership: sub
      ? {
          id: sub.id,
          planId: sub.planId,
          planName: sub.plan.name,
          interval: sub.plan.interval,
          amount: sub.plan.amount,
          currency: sub.plan.currency,
          status: sub.status,
          statusWords: statusWords(sub, now),
          good,
          cancelAtPeriodEnd: sub.cancelAtPeriodEnd,
          currentPeriodEnd: sub.currentPeriodEnd?.toISOString() ?? null,
          graceUntil: sub.graceUntil?.toISOString() ?? null,
          nextCharge,
        }
      : null,
    payments: payments.map((p) => ({
      id: p.id,
      kind: p.kind,
      status: p.status,
      amount: p.amount,
      refundedAmount: p.refundedAmount,
      currency: p.currency,
      planName: p.planName,
      receiptNumber: p.receiptNumber,
      failureMessage: p.failureMessage,
      createdAt: p.createdAt.toISOString(),
      refunds: p.refunds.map((r) => ({
        id: r.id,
        amount: r.amount,
        currency: r.currency,
        reason: r.reason,
        createdAt: r.createdAt.toISOString(),
      })),
    })),
    plans: plans.map((p) => ({ id: p.id, name: p.name, amount: p.amount, currency: p.currency, interval: p.interval })),
  };
}
export type BillingSummary = Awaited<ReturnType<typeof billingSummary>>;

/** The member's live subscription, or 409 with what to do instead. */
async function liveSubscription(db: Db, userId: string): Promise<Sub> {
  const sub = await currentSubscriptionOf(db, userId);
  if (!sub || sub.status === "canceled" || sub.status === "incomplete_expired")
    throw conflict("You have no membership to change: choose a plan first.");
  return sub;
}

export async function setCancelAtPeriodEnd(
  db: Db,
  stripe: Stripe,
  userId: string,
  cancel: boolean,
): Promise<{ cancelAtPeriodEnd: boolean }> {
  const sub = await liveSubscription(db, userId);
  // Always ask Stripe, never skip on our row: the row follows webhooks and may not have heard of a change made a
  // moment ago (cancel then resume at once would otherwise leave the cancellation standing). The update is idempotent.
  const s = await stripe.subscriptions.update(sub.stripeSubscriptionId, { cancel_at_period_end: cancel });
  return { cancelAtPeriodEnd: s.cancel_at_period_end };
}

async function changeTarget(db: Db, stripe: Stripe, userId: string, planId: string) {
  const sub = await liveSubscription(db, userId);
  const plan = await findPlan(db, planId);
  if (!plan || plan.retiredAt || !plan.stripePriceId)
    throw unprocessable("That plan is not on offer.", { planId: "Choose one of the plans on offer." });
  if (plan.id === sub.planId)
    throw unprocessable("You are on that plan already.", { planId: "Choose a different plan." });
  if (plan.currency !== sub.plan.currency)
    throw unprocessable(`That plan is in ${plan.currency}; yours is in ${sub.plan.currency}.`, {
      planId: "Choose a plan in your currency.",
    });
  const remote = await stripe.subscriptions.retrieve(sub.stripeSubscriptionId);
  const item = remote.items.data[0];
  if (!item) throw new Error(`subscription ${remote.id} has no items`);
  return { sub, plan, itemId: item.id, priceId: plan.stripePriceId };
}

/** What Stripe would charge or credit now for the change (Stripe docs: "Preview proration"). */
export async function previewPlanChange(db: Db, stripe: Stripe, userId: string, planId: string) {
  const t = await changeTarget(db, stripe, userId, planId);
  const customer = await customerOf(db, userId);
  if (!customer) throw notFound("No billing account found.");
  // No proration_date of our own: Stripe's clock decides "now" and says which instant it priced in the preview
  // (Stripe docs: "Preview proration" — subscription_proration_date), which changePlan then passes back.
  const preview = await stripe.invoices.createPreview({
    customer,
    subscription: t.sub.stripeSubscriptionId,
    subscription_details: { items: [{ id: t.itemId, price: t.priceId }], proration_behavior: "always_invoice" },
  });
  const prorationDate =
    preview.parent?.subscription_details?.subscription_proration_date ?? Math.floor(Date.now() / 1000);
  return {
    planId: t.plan.id,
    planName: t.plan.name,
    prorationDate,
    amountDue: preview.amount_due,
    total: preview.total,
    currency: preview.currency.toUpperCase(),
    lines: preview.lines.data.map((l) => ({ description: l.description ?? "", amount: l.amount })),
  };
}

/** Makes the change with the previewed proration date, so the charge is the one the member saw. */
export async function changePlan(db: Db, stripe: Stripe, userId: string, planId: string, prorationDate: number) {
  const t = await changeTarget(db, stripe, userId, planId);
  const s = await stripe.subscriptions.update(t.sub.stripeSubscriptionId, {
    items: [{ id: t.itemId, price: t.priceId }],
    proration_behavior: "always_invoice",
    proration_date: prorationDate,
    cancel_at_period_end: false,
  });
  return { subscription: s.id, planId: t.plan.id };
}

/** A hosted page to save a new card; for a past-due membership Stripe then pays the open invoice. */
export async function updateCardSession(db: Db, stripe: Stripe, userId: string): Promise<{ url: string }> {
  const sub = await liveSubscription(db, userId);
  const customer = await customerOf(db, userId);
  if (!customer) throw notFound("No billing account found.");
  const app = env().APP_URL.replace(/\/$/, "");
  const session = await stripe.checkout.sessions.create({
    mode: "setup",
    customer,
    currency: sub.plan.currency.toLowerCase(),
    setup_intent_data: { metadata: { subscription_id: sub.stripeSubscriptionId } },
    metadata: { userId, subscriptionId: sub.stripeSubscriptionId },
    success_url: `${app}/learn/billing?card=updated`,
    cancel_url: `${app}/learn/billing`,
  });
  if (!session.url) throw new Error(`Stripe returned setup session ${session.id} without a url`);
  return { url: session.url };
}
