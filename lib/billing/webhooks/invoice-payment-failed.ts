import { sql } from "drizzle-orm";
import { paymentByInvoice, subscriptionByStripeId } from "@/db/queries/billing";
import { payments } from "@/db/schema";
import { recomputeGrace } from "../grace";
import { mailFailure } from "../notify";
import type { Stripe } from "../stripe";
import { baseValues, invoiceContext } from "./payment-row";
import type { Handler } from "./types";

/** The decline in the card network's words, as Stripe keeps it on the payment intent. */
async function declineMessage(stripe: Stripe, paymentIntent: string | null): Promise<string | null> {
  if (!paymentIntent) return null;
  try {
    const pi = await stripe.paymentIntents.retrieve(paymentIntent);
    return pi.last_payment_error?.message ?? null;
  } catch {
    return null;
  }
}

// A failed charge of an invoice (a renewal, usually): the failed payment, grace (lib/billing/grace.ts)
// and a notice by e-mail. Stripe retries the charge; a later invoice.paid turns the row to paid.
export const invoicePaymentFailed: Handler = async (db, event, stripe) => {
  const c = await invoiceContext(db, stripe, event.data.object, event.created);
  if (!c) return;
  const failureMessage =
    c.invoice.failureMessage ?? (await declineMessage(stripe, c.invoice.paymentIntent)) ?? "Your card was declined.";
  await db
    .insert(payments)
    .values({ ...baseValues(c), amount: c.invoice.amountDue, status: "failed", failureMessage })
    .onConflictDoUpdate({
      target: payments.stripeInvoiceId,
      set: { failureMessage },
      setWhere: sql`${payments.status} = 'failed'`,
    });
  const row = await paymentByInvoice(db, c.invoice.id);
  if (!row || row.status !== "failed" || !c.subscription) return;
  await recomputeGrace(db, c.subscription.id);
  const sub = await subscriptionByStripeId(db, c.subscription.stripeSubscriptionId);
  await mailFailure(db, row, sub?.graceUntil ?? null);
};
