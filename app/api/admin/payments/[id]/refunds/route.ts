import { z } from "zod";
import Stripe from "stripe";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { HttpError, notFound, unprocessable } from "@/lib/auth/errors";
import { parseQuery, rawBody } from "@/lib/billing/admin/params";
import { refundPayment, RefundError } from "@/lib/billing/refunds";

export const dynamic = "force-dynamic";

const refundInput = z.strictObject({
  id: z.string(),
  amount: z
    .number({ error: "must be a whole number of minor units (pence, cents)" })
    .int("must be a whole number of minor units (pence, cents)")
    .positive("must be above zero")
    .optional(),
  reason: z
    .string({ error: "is required: say why the payment is refunded" })
    .trim()
    .min(1, "is required: say why the payment is refunded")
    .max(500, "must be at most 500 characters"),
});

/** A full (no amount) or partial refund of one payment, through Stripe, with the admin's reason. */
export const POST = guardRoute({ action: "payments:refund", input: rawBody }, async (ctx, raw) => {
  const input = parseQuery(refundInput, raw);
  if (!z.uuid().safeParse(input.id).success) throw notFound("We couldn't find that payment.");
  try {
    const result = await refundPayment(
      db(),
      { id: ctx.user?.id ?? "" },
      { paymentId: input.id, amount: input.amount, reason: input.reason },
    );
    return Response.json(result, { status: 201, headers: { "cache-control": "no-store" } });
  } catch (e) {
    if (e instanceof RefundError) {
      if (e.code === "payment_not_found") throw notFound(e.message);
      throw unprocessable(e.message, { [e.field]: e.message });
    }
    // Stripe refused (e.g. already refunded there): its own words, nothing recorded (Stripe docs: "Error handling").
    if (e instanceof Stripe.errors.StripeInvalidRequestError || e instanceof Stripe.errors.StripeCardError) {
      throw unprocessable(`Stripe refused the refund: ${e.message}`, { amount: e.message });
    }
    if (e instanceof Stripe.errors.StripeError)
      throw new HttpError(502, "Stripe could not be reached; nothing was refunded. Please try again.");
    throw e;
  }
});
