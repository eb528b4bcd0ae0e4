// The billing e-mails the webhook handlers queue, written out in the member's own time zone.
import { eq } from "drizzle-orm";
import type { Tx as Db } from "@/db/queries/auth";
import { plans, users } from "@/db/schema";
import { enqueueEmail } from "@/lib/mail/outbox";
import type { BillingMail } from "@/lib/mail/types-billing";
import { formatDay, formatMoney } from "./money";

async function member(db: Db, userId: string) {
  const [u] = await db
    .select({ name: users.name, email: users.email, timeZone: users.timeZone })
    .from(users)
    .where(eq(users.id, userId))
    .limit(1);
  return u ?? null;
}

async function planName(db: Db, planId: string | null): Promise<string> {
  if (!planId) return "membership";
  const [p] = await db.select({ name: plans.name }).from(plans).where(eq(plans.id, planId)).limit(1);
  return p?.name ?? "membership";
}

type Payment = {
  id: string;
  userId: string;
  planId: string | null;
  amount: number;
  currency: string;
  receiptNumber: string | null;
  createdAt: Date;
  periodStart: Date | null;
  periodEnd: Date | null;
  stripeInvoiceId: string;
};

export async function mailReceipt(db: Db, p: Payment): Promise<void> {
  const u = await member(db, p.userId);
  if (!u) return;
  const tz = u.timeZone;
  const data: BillingMail["payment-receipt"] = {
    name: u.name,
    planName: await planName(db, p.planId),
    amount: formatMoney(p.amount, p.currency),
    receiptNumber: p.receiptNumber ?? p.stripeInvoiceId,
    paidOn: formatDay(p.createdAt, tz),
    period: p.periodStart && p.periodEnd ? `${formatDay(p.periodStart, tz)} to ${formatDay(p.periodEnd, tz)}` : "",
    receiptUrl: `/learn/billing/receipts/${p.id}`,
  };
  await enqueueEmail(db, {
    to: u.email,
    template: "payment-receipt",
    data,
    dedupeKey: `payment-receipt:${p.stripeInvoiceId}`,
  });
}

export async function mailFailure(
  db: Db,
  p: Payment & { failureMessage: string | null },
  graceUntil: Date | null,
): Promise<void> {
  const u = await member(db, p.userId);
  if (!u) return;
  const data: BillingMail["payment-failed"] = {
    name: u.name,
    planName: await planName(db, p.planId),
    amount: formatMoney(p.amount, p.currency),
    failureMessage: p.failureMessage ?? "Your card was declined.",
    graceUntil: graceUntil ? formatDay(graceUntil, u.timeZone) : "the end of your current period",
    billingUrl: "/learn/billing",
  };
  await enqueueEmail(db, {
    to: u.email,
    template: "payment-failed",
    data,
    dedupeKey: `payment-failed:${p.stripeInvoiceId}`,
  });
}

export async function mailEnded(
  db: Db,
  s: { userId: string; planId: string; stripeSubscriptionId: string; endedAt: Date | null },
): Promise<void> {
  const u = await member(db, s.userId);
  if (!u) return;
  const data: BillingMail["membership-ended"] = {
    name: u.name,
    planName: await planName(db, s.planId),
    endedOn: formatDay(s.endedAt ?? new Date(), u.timeZone),
    plansUrl: "/plans",
  };
  await enqueueEmail(db, {
    to: u.email,
    template: "membership-ended",
    data,
    dedupeKey: `membership-ended:${s.stripeSubscriptionId}`,
  });
}
