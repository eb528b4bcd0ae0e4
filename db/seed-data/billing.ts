// The demo school's plans and billing history (issue 7 item 7) into the database and the local Stripe
// stand-in, with the same ids in both. Idempotent: rows are keyed by their Stripe ids (a second run
// inserts nothing), and the stand-in is written only when it lacks the demo objects (a lost state
// file is repaired). Run after the people and the catalogue.
import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import type { Db } from "../client";
import { payments, plans, refunds, subscriptions, users } from "../schema";
import { ADMIN } from "./people";
import { DEMO_PLANS, demoBillingHistory, type DemoMembership } from "./billing-history";
import { stripeImportOf } from "./billing-stripe";
import { dateDemoEnrolments } from "./enrolment-dates";

export { DEMO_PLANS, demoBillingHistory };

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
const at = (unix: number) => new Date(unix * 1000);

/** Where the stand-in listens and the key it takes; the invented history never goes to the real Stripe. */
export function standIn(source: Record<string, string | undefined> = process.env): { base: string; key: string } {
  const base = source.STRIPE_API_BASE;
  const key = source.STRIPE_SECRET_KEY;
  if (!base || !key) {
    throw new Error(
      "the demo billing history is written to the local Stripe stand-in as well, and STRIPE_API_BASE / STRIPE_SECRET_KEY are not set. " +
        "`npm start` and `npm test` start the stand-in before seeding; to seed by hand, start it (scripts/fakes/stripe/README.md) and set both.",
    );
  }
  if (/(^|\.)stripe\.com$/i.test(new URL(base).hostname))
    throw new Error(
      "STRIPE_API_BASE points at Stripe itself: the invented demo history is only ever written to the local stand-in.",
    );
  return { base: base.replace(/\/$/, ""), key };
}

async function standInFetch(base: string, key: string, path: string, init: RequestInit = {}): Promise<Response> {
  try {
    return await fetch(`${base}${path}`, {
      ...init,
      headers: { authorization: `Bearer ${key}`, "content-type": "application/json", ...init.headers },
    });
  } catch (e) {
    throw new Error(
      `the Stripe stand-in at ${base} is not reachable (${e instanceof Error ? e.message : String(e)}): start it first (npm start and npm test do) — the demo billing history is written to it and the database together.`,
    );
  }
}

/** Whether the stand-in already holds the demo (both plans' prices and every demo subscription). */
async function standInHasDemo(base: string, key: string, history: DemoMembership[]): Promise<boolean> {
  const paths = [
    ...Object.values(DEMO_PLANS).map((p) => `/v1/prices/${p.priceId}`),
    ...history.map((m) => `/v1/subscriptions/${m.subscriptionId}`),
  ];
  for (const p of paths) {
    const res = await standInFetch(base, key, p);
    if (res.status === 404) return false;
    if (!res.ok) throw new Error(`the Stripe stand-in answered ${res.status} to GET ${p}: ${await res.text()}`);
  }
  return true;
}

/** The moment the demo history was first written (its plans' created_at), so re-seeding rebuilds the same. */
async function anchorOf(db: Db): Promise<number> {
  const [row] = await db.select({ createdAt: plans.createdAt }).from(plans).where(eq(plans.id, DEMO_PLANS.monthly.id));
  return Math.floor((row?.createdAt ?? new Date()).getTime() / 1000);
}

async function writeDatabase(tx: Tx, history: DemoMembership[], anchor: number): Promise<void> {
  await tx
    .insert(plans)
    .values(
      Object.values(DEMO_PLANS).map((p) => ({
        id: p.id,
        name: p.name,
        amount: p.amount,
        currency: p.currency,
        interval: p.interval,
        stripeProductId: p.productId,
        stripePriceId: p.priceId,
        createdAt: at(anchor),
      })),
    )
    .onConflictDoNothing();
  const emails = history.map((m) => m.email.toLowerCase());
  const people = await tx
    .select({ id: users.id, email: users.email })
    .from(users)
    .where(inArray(sql`lower(${users.email})`, [...emails, ADMIN.email]));
  const idOf = new Map(people.map((p) => [p.email.toLowerCase(), p.id]));
  const adminId = idOf.get(ADMIN.email) ?? null;
  for (const m of history) {
    const userId = idOf.get(m.email.toLowerCase());
    if (!userId) {
      console.warn(`demo billing: no demo student ${m.email} any more; their history is left out`);
      continue;
    }
    await tx
      .update(users)
      .set({ stripeCustomerId: m.customerId })
      .where(and(eq(users.id, userId), isNull(users.stripeCustomerId)));
    const plan = DEMO_PLANS[m.plan];
    await tx
      .insert(subscriptions)
      .values({
        userId,
        planId: plan.id,
        stripeSubscriptionId: m.subscriptionId,
        status: m.status,
        currentPeriodStart: at(m.periodStart),
        currentPeriodEnd: at(m.periodEnd),
        canceledAt: m.canceledAt ? at(m.canceledAt) : null,
        cancelAtPeriodEnd: m.cancelAtPeriodEnd,
        graceUntil: m.graceUntil ? at(m.graceUntil) : null,
        stripeUpdatedAt: at(m.updatedAt),
        startedAt: at(m.start),
        endedAt: m.endedAt ? at(m.endedAt) : null,
      })
      .onConflictDoNothing();
    const [sub] = await tx
      .select({ id: subscriptions.id })
      .from(subscriptions)
      .where(eq(subscriptions.stripeSubscriptionId, m.subscriptionId));
    for (const inv of m.invoices) {
      const refunded = inv.refunds.reduce((s, r) => s + r.amount, 0);
      const paid = inv.status === "paid";
      const made = await tx
        .insert(payments)
        .values({
          userId,
          subscriptionId: sub.id,
          planId: plan.id,
          stripeInvoiceId: inv.id,
          stripePaymentIntentId: inv.paymentIntentId,
          kind: inv.kind,
          amount: inv.amount,
          refundedAmount: refunded,
          currency: plan.currency,
          status: !paid
            ? "failed"
            : refunded === 0
              ? "paid"
              : refunded >= inv.amount
                ? "refunded"
                : "partially_refunded",
          failureMessage: paid ? null : inv.attempts.length > 0 ? "Your card was declined." : null,
          receiptNumber: inv.number,
          periodStart: at(inv.periodStart),
          periodEnd: at(inv.periodEnd),
          createdAt: at(inv.created),
        })
        .onConflictDoNothing()
        .returning({ id: payments.id });
      // Refunds only with a payment made just now: an existing row already carries its refunds.
      if (made[0] && inv.refunds.length > 0) {
        await tx
          .insert(refunds)
          .values(
            inv.refunds.map((r) => ({
              paymentId: made[0].id,
              stripeRefundId: r.id,
              amount: r.amount,
              currency: plan.currency,
              reason: r.reason,
              createdBy: adminId,
              createdAt: at(r.created),
            })),
          )
          .onConflictDoNothing();
      }
    }
  }
}

/** Plans and twelve months of history, in the database and the stand-in. */
export async function seedBilling(
  db: Db,
  source: Record<string, string | undefined> = process.env,
): Promise<{ memberships: number; imported: boolean }> {
  const { base, key } = standIn(source);
  const health = await standInFetch(base, key, "/_fake/health");
  if (!health.ok)
    throw new Error(`the Stripe stand-in at ${base} is not ready (GET /_fake/health answered ${health.status}).`);
  const anchor = await anchorOf(db);
  const history = demoBillingHistory(anchor);
  await db.transaction(async (tx) => {
    await writeDatabase(tx, history, anchor);
    await dateDemoEnrolments(tx, history, anchor);
  });
  let imported = false;
  if (!(await standInHasDemo(base, key, history))) {
    const res = await standInFetch(base, key, "/_fake/import", {
      method: "POST",
      body: JSON.stringify(stripeImportOf(history, anchor)),
    });
    if (!res.ok) throw new Error(`the Stripe stand-in refused the demo history (${res.status}): ${await res.text()}`);
    imported = true;
  }
  return { memberships: history.length, imported };
}
