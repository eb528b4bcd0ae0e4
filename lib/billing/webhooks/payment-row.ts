// The payments row of an invoice, shared by invoice.paid and invoice.payment_failed.
import type { Tx as Db } from "@/db/queries/auth";
import { planByPrice, userByCustomer } from "@/db/queries/billing";
import type { SubscriptionRow } from "@/db/queries/billing";
import { invoiceObject, toDate, type InvoiceFacts } from "../objects";
import type { Stripe } from "../stripe";
import { ensureSubscription } from "../sync";

// Stripe's billing_reason (Stripe API reference: the Invoice object) → the school's words.
export function kindOf(reason: string | null): "new" | "renewal" | "plan_change" {
  if (reason === "subscription_create") return "new";
  if (reason === "subscription_update") return "plan_change";
  return "renewal";
}

export interface InvoiceContext {
  invoice: InvoiceFacts;
  userId: string;
  subscription: SubscriptionRow | null;
  planId: string | null;
}

/** Who and what an invoice is for; null when the customer is not one of ours. */
export async function invoiceContext(
  db: Db,
  stripe: Stripe,
  object: unknown,
  eventCreated: number,
): Promise<InvoiceContext | null> {
  const invoice = invoiceObject.parse(object);
  const user = await userByCustomer(db, invoice.customer);
  if (!user) {
    console.warn(`[billing] invoice ${invoice.id}: customer ${invoice.customer} is not one of ours; ignored`);
    return null;
  }
  const subscription = invoice.subscription
    ? await ensureSubscription(db, stripe, invoice.subscription, eventCreated)
    : null;
  const plan = invoice.priceId ? await planByPrice(db, invoice.priceId) : null;
  return { invoice, userId: user.id, subscription, planId: plan?.id ?? subscription?.planId ?? null };
}

/** The columns every version of the row shares; createdAt is the invoice's own time, so a replay writes the same. */
export function baseValues(c: InvoiceContext) {
  const i = c.invoice;
  return {
    userId: c.userId,
    subscriptionId: c.subscription?.id ?? null,
    planId: c.planId,
    stripeInvoiceId: i.id,
    stripePaymentIntentId: i.paymentIntent,
    kind: kindOf(i.billingReason),
    currency: i.currency,
    receiptNumber: i.number,
    periodStart: toDate(i.periodStart),
    periodEnd: toDate(i.periodEnd),
    createdAt: new Date(i.created * 1000),
  };
}
