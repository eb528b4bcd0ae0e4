import { eq } from "drizzle-orm";
import { payments, users } from "@/db/schema";
import { enqueueEmail } from "@/lib/mail/outbox";
import { formatMoney } from "../money";
import { chargeObject } from "../objects";
import { recordRefund, RefundError } from "../refunds";
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
  for (const r of list) {
    if (r.status && r.status !== "succeeded" && r.status !== "pending") continue;
    const reason = r.metadata?.reason ?? (r.reason ? r.reason.replaceAll("_", " ") : "Refunded");
    try {
      await recordRefund(db, { ...ref, stripeRefundId: r.id, amount: r.amount, currency: r.currency.toUpperCase(), reason, createdAt: new Date(r.created * 1000) });
    } catch (e) {
      // Not one of our payments, or more than it took: nothing to record; the event stays stored for a look.
      if (e instanceof RefundError) {
        console.warn(`[billing] refund ${r.id} not recorded: ${e.message}`);
        continue;
      }
      throw e;
    }
    const [p] = await db
      .select({ email: users.email, name: users.name, id: payments.id, receipt: payments.receiptNumber, invoice: payments.stripeInvoiceId })
      .from(payments)
      .innerJoin(users, eq(users.id, payments.userId))
      .where(which)
      .limit(1);
    if (!p) continue;
    await enqueueEmail(db, {
      to: p.email,
      template: "refund-issued",
      data: { name: p.name, amount: formatMoney(r.amount, r.currency), receiptNumber: p.receipt ?? p.invoice, reason, receiptUrl: `/learn/billing/receipts/${p.id}` },
      dedupeKey: `refund-issued:${r.id}`,
    });
  }
};
