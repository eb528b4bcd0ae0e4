import { sql } from "drizzle-orm";
import { paymentByInvoice } from "@/db/queries/billing";
import { payments } from "@/db/schema";
import { recomputeGrace } from "../grace";
import { mailReceipt } from "../notify";
import { baseValues, invoiceContext } from "./payment-row";
import type { Handler } from "./types";

// A paid invoice: a payment (new, renewal or plan change), a receipt by e-mail, and grace cleared
// when it pays what had failed. A failed attempt recorded earlier becomes paid; a payment already
// paid or refunded is never moved back by a late event.
export const invoicePaid: Handler = async (db, event, stripe) => {
  const c = await invoiceContext(db, stripe, event.data.object, event.created);
  if (!c) return;
  const values = { ...baseValues(c), amount: c.invoice.amountPaid, status: "paid" as const, failureMessage: null };
  await db
    .insert(payments)
    .values(values)
    .onConflictDoUpdate({
      target: payments.stripeInvoiceId,
      set: {
        status: "paid",
        amount: values.amount,
        failureMessage: null,
        stripePaymentIntentId: values.stripePaymentIntentId,
        receiptNumber: values.receiptNumber,
        subscriptionId: values.subscriptionId,
      },
      setWhere: sql`${payments.status} = 'failed'`,
    });
  if (c.subscription) await recomputeGrace(db, c.subscription.id);
  const row = await paymentByInvoice(db, c.invoice.id);
  // A zero invoice (e.g. a plan change that leaves credit) is not worth a receipt.
  if (row && row.amount > 0) await mailReceipt(db, row);
};
