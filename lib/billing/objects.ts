// The few fields the webhook handlers read from Stripe's objects, parsed with zod rather than trusted.
// Both the current shapes (API 2025-03-31 and later: periods on subscription items, an invoice's
// subscription under parent.subscription_details, its payment intent under payments) and the older
// top-level fields are accepted (Stripe docs: API changelog "basil"), so the real service and the
// stand-in read alike.
import { z } from "zod";

const idOf = z.union([z.string(), z.object({ id: z.string() }).transform((o) => o.id)]);
const nullableId = idOf.nullable().optional();
const unix = z.number().int();

export const subscriptionObject = z
  .object({
    id: z.string(),
    customer: idOf,
    status: z.enum([
      "incomplete",
      "incomplete_expired",
      "trialing",
      "active",
      "past_due",
      "canceled",
      "unpaid",
      "paused",
    ]),
    cancel_at_period_end: z.boolean().default(false),
    canceled_at: unix.nullable().optional(),
    ended_at: unix.nullable().optional(),
    start_date: unix.optional(),
    created: unix.optional(),
    current_period_start: unix.optional(),
    current_period_end: unix.optional(),
    metadata: z.record(z.string(), z.string()).nullable().optional(),
    items: z.object({
      data: z.array(
        z.object({
          current_period_start: unix.optional(),
          current_period_end: unix.optional(),
          price: z.object({ id: z.string(), product: idOf.optional() }),
        }),
      ),
    }),
  })
  .transform((s) => {
    const item = s.items.data[0];
    return {
      id: s.id,
      customer: s.customer,
      status: s.status,
      cancelAtPeriodEnd: s.cancel_at_period_end,
      canceledAt: s.canceled_at ?? null,
      endedAt: s.ended_at ?? null,
      startedAt: s.start_date ?? s.created ?? null,
      periodStart: item?.current_period_start ?? s.current_period_start ?? null,
      periodEnd: item?.current_period_end ?? s.current_period_end ?? null,
      priceId: item?.price.id ?? null,
      productId: item?.price.product ?? null,
      metadata: s.metadata ?? {},
    };
  });
export type SubscriptionFacts = z.output<typeof subscriptionObject>;

export const invoiceObject = z
  .object({
    id: z.string(),
    customer: idOf,
    number: z.string().nullable().optional(),
    created: unix,
    currency: z.string().length(3),
    amount_paid: z.number().int(),
    amount_due: z.number().int(),
    billing_reason: z.string().nullable().optional(),
    status: z.string().nullable().optional(),
    period_start: unix.optional(),
    period_end: unix.optional(),
    subscription: nullableId,
    payment_intent: nullableId,
    parent: z
      .object({ subscription_details: z.object({ subscription: idOf }).nullable().optional() })
      .nullable()
      .optional(),
    payments: z
      .object({ data: z.array(z.object({ payment: z.object({ payment_intent: nullableId }).optional() })) })
      .optional(),
    lines: z
      .object({
        data: z.array(
          z.object({
            period: z.object({ start: unix, end: unix }).optional(),
            price: idOf.nullable().optional(),
            pricing: z
              .object({ price_details: z.object({ price: idOf }).nullable().optional() })
              .nullable()
              .optional(),
            proration: z.boolean().optional(),
            parent: z
              .object({ subscription_item_details: z.object({ proration: z.boolean() }).nullable().optional() })
              .nullable()
              .optional(),
          }),
        ),
      })
      .optional(),
    last_payment_error: z.object({ message: z.string() }).nullable().optional(),
  })
  .transform((i) => {
    const lines = i.lines?.data ?? [];
    // The subscription's own line (not a proration) carries the period and the price paid for.
    const main = lines.find((l) => !(l.proration ?? l.parent?.subscription_item_details?.proration)) ?? lines[0];
    const priceId = main?.price ?? main?.pricing?.price_details?.price ?? null;
    return {
      id: i.id,
      customer: i.customer,
      number: i.number ?? null,
      created: i.created,
      currency: i.currency.toUpperCase(),
      amountPaid: i.amount_paid,
      amountDue: i.amount_due,
      billingReason: i.billing_reason ?? null,
      subscription: i.parent?.subscription_details?.subscription ?? i.subscription ?? null,
      paymentIntent:
        i.payments?.data.find((p) => p.payment?.payment_intent)?.payment?.payment_intent ?? i.payment_intent ?? null,
      periodStart: main?.period?.start ?? i.period_start ?? null,
      periodEnd: main?.period?.end ?? i.period_end ?? null,
      priceId,
      failureMessage: i.last_payment_error?.message ?? null,
    };
  });
export type InvoiceFacts = z.output<typeof invoiceObject>;

export const checkoutSessionObject = z.object({
  id: z.string(),
  mode: z.enum(["payment", "setup", "subscription"]),
  customer: nullableId,
  subscription: nullableId,
  metadata: z.record(z.string(), z.string()).nullable().optional(),
});

export const chargeObject = z.object({
  id: z.string(),
  customer: nullableId,
  payment_intent: nullableId,
  invoice: nullableId,
  currency: z.string().length(3),
  refunds: z
    .object({
      data: z.array(
        z.object({
          id: z.string(),
          amount: z.number().int(),
          currency: z.string().length(3),
          status: z.string().nullable().optional(),
          reason: z.string().nullable().optional(),
          metadata: z.record(z.string(), z.string()).nullable().optional(),
          created: unix,
        }),
      ),
    })
    .nullable()
    .optional(),
});

export const toDate = (unixSeconds: number | null): Date | null =>
  unixSeconds === null ? null : new Date(unixSeconds * 1000);
