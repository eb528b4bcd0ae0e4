import { z } from "zod";
import Stripe from "stripe";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { conflict, HttpError, notFound, unprocessable } from "@/lib/auth/errors";
import { parseQuery, rawBody } from "@/lib/billing/admin/params";
import { RefundError } from "@/lib/billing/refunds";
import {
  REASON_MAX,
  refundPayment,
  RefundPendingError,
  RefundUnknownError,
  REFUND_IN_PROGRESS,
} from "@/lib/billing/refund-payment";

export const dynamic = "force-dynamic";
const NO_STORE = { "cache-control": "no-store" };

const refundInput = z.strictObject({
  id: z.string(),
  amount: z
    .number({ error: "must be a whole number of minor units (pence, cents)" })
    .int("must be a whole number of minor units (pence, cents)")
    .positive("must be above zero")
    .max(99_999_999, "must be at most 99999999 (Stripe's largest amount)")
    .optional(),
  reason: z
    .string({ error: "is required: say why the payment is refunded" })
    .trim()
    .min(1, "is required: say why the payment is refunded")
    .max(REASON_MAX, `must be at most ${REASON_MAX} characters`),
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
    return Response.json(result, { status: 201, headers: NO_STORE });
  } catch (e) {
    if (e instanceof RefundError) {
      if (e.code === "payment_not_found") throw notFound(e.message);
      if (e.code === "in_progress") throw conflict(REFUND_IN_PROGRESS);
      throw unprocessable(e.message, { [e.field]: e.message });
    }
    // Made at Stripe, recorded later from Stripe's own account of it: not a failure to repeat.
    if (e instanceof RefundPendingError) {
      return Response.json(
        { pending: true, message: e.message, stripeRefundId: e.stripeRefundId },
        { status: 202, headers: NO_STORE },
      );
    }
    if (e instanceof RefundUnknownError)
      throw new HttpError(
        502,
        "Stripe did not answer, so whether it refunded is not known yet. It is checked within a few minutes: reload then before trying again.",
      );
    // Stripe refused (e.g. already refunded there): its own words, nothing recorded (Stripe docs: "Error handling").
    if (e instanceof Stripe.errors.StripeInvalidRequestError || e instanceof Stripe.errors.StripeCardError) {
      throw unprocessable(`Stripe refused the refund: ${e.message}`, { amount: e.message });
    }
    if (e instanceof Stripe.errors.StripeError)
      throw new HttpError(502, `Stripe refused the request; nothing was refunded (${e.message}).`);
    throw e;
  }
});
