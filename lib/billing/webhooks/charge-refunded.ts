import { eq } from "drizzle-orm";
import { payments, users } from "@/db/schema";
import { enqueueEmail } from "@/lib/mail/outbox";
import { formatMoney } from "../money";
import { chargeObject } from "../objects";
import type { Stripe } from "../stripe";
import { invoicePaid } from "./invoice-paid";
import { recordRefund, RefundError, storableText, uuidOrNull } from "../refunds";
import type { Handler } from "./types";

// A refund made in Stripe (the admin's refund action, or Stripe's dashboard): recorded once by its
// refund id through recordRefund (lib/billing/refunds.ts), whichever path sees it first, and the
// member told by e-mail once per refund.
export const chargeRefunded: Handler = async (db, event, stripe) => {
  const charge = chargeObject.parse(event.data.object);
  // Newer API versions leave charge.refunds out unless expanded (Stripe API reference: the Charge object).
  const list = charge.refunds?.data ?? (await stripe.refunds.list({ charge: charge.id, limit: 100 })).data;
  const pi = charge.payment_intent;
  const inv = charge.invoice;
  const ref = pi ? { stripePaymentIntentId: pi } : inv ? { stripeInvoiceId: inv } : null;
  if (!ref) return;
  const which = pi ? eq(payments.stripePaymentIntentId, pi) : eq(payments.stripeInvoiceId, inv ?? "");
  const [known] = await db.select({ id: payments.id }).from(payments).where(which).limit(1);
  if (!known && pi && charge.customer) await recordPaidInvoice(db, stripe, event.created, charge.customer, pi);
  for (const r of list) {
    if (r.status && r.status !== "succeeded" && r.status !== "pending") continue;
    const reason = storableText(r.metadata?.reason ?? (r.reason ? r.reason.replaceAll("_", " ") : "Refunded"));
    try {
      await recordRefund(db, {
        ...ref,
        stripeRefundId: r.id,
        amount: r.amount,
        currency: r.currency.toUpperCase(),
        reason,
        createdAt: new Date(r.created * 1000),
        // The admin's refund wrote an attempt before asking Stripe; this closes it (lib/billing/refund-payment.ts).
        attemptId: uuidOrNull(r.metadata?.attempt_id),
      });
    } catch (e) {
      // Not one of our payments, or more than it took: nothing to record; the event stays stored for a look.
      if (e instanceof RefundError) {
        console.warn(`[billing] refund ${r.id} not recorded: ${e.message}`);
        continue;
      }
      throw e;
    }
    const [p] = await db
      .select({
        email: users.email,
        name: users.name,
        id: payments.id,
        receipt: payments.receiptNumber,
        invoice: payments.stripeInvoiceId,
      })
      .from(payments)
      .innerJoin(users, eq(users.id, payments.userId))
      .where(which)
      .limit(1);
    if (!p) continue;
    await enqueueEmail(db, {
      to: p.email,
      template: "refund-issued",
      data: {
        name: p.name,
        amount: formatMoney(r.amount, r.currency),
        receiptNumber: p.receipt ?? p.invoice,
        reason,
        receiptUrl: `/learn/billing/receipts/${p.id}`,
      },
      dedupeKey: `refund-issued:${r.id}`,
    });
  }
};

/**
 * The refund overtook its invoice.paid event (webhooks arrive in any order): the invoice this payment
 * intent paid is read from Stripe and recorded first, exactly as invoice.paid would record it.
 */
async function recordPaidInvoice(
  db: Parameters<Handler>[0],
  stripe: Stripe,
  created: number,
  customer: string,
  paymentIntent: string,
): Promise<void> {
  for await (const inv of stripe.invoices.list({ customer, limit: 100 })) {
    const pis = (inv.payments?.data ?? []).map((p) => p.payment.payment_intent);
    if (inv.status === "paid" && pis.some((x) => (typeof x === "string" ? x : x?.id) === paymentIntent)) {
      await invoicePaid(db, { id: `replay:${inv.id}`, type: "invoice.paid", created, data: { object: inv } }, stripe);
      return;
    }
  }
}
