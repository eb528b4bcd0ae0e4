// The demo billing history in Stripe's object shapes (Stripe API reference: Customer, Product, Price,
// PaymentMethod, Subscription, Invoice, PaymentIntent, Charge, Refund; API version of stripe 23.1.0:
// periods on subscription items, invoice.parent.subscription_details, invoice.payments) for the
// stand-in's POST /_fake/import, with the same ids the database gets.
import { DEMO_PLANS, DECLINE, type DemoInvoice, type DemoMembership } from "./billing-history";

type Obj = Record<string, unknown>;
export type StripeImport = {
  customers: Obj[];
  products: Obj[];
  prices: Obj[];
  payment_methods: Obj[];
  subscriptions: Obj[];
  invoices: Obj[];
  payment_intents: Obj[];
  charges: Obj[];
  refunds: Obj[];
};

const lower = (c: string) => c.toLowerCase();

function invoiceObjects(m: DemoMembership, inv: DemoInvoice, out: StripeImport): void {
  const plan = DEMO_PLANS[m.plan];
  const paid = inv.status === "paid";
  const last = inv.attempts.at(-1);
  const refunded = inv.refunds.reduce((s, r) => s + r.amount, 0);
  out.invoices.push({
    id: inv.id,
    object: "invoice",
    created: inv.created,
    customer: m.customerId,
    currency: lower(plan.currency),
    // A renewal that failed for good is left uncollectible when the subscription is cancelled.
    status: paid ? "paid" : inv.status === "open" ? "open" : "uncollectible",
    billing_reason: inv.kind === "new" ? "subscription_create" : "subscription_cycle",
    number: inv.number,
    parent: { type: "subscription_details", subscription_details: { subscription: m.subscriptionId } },
    lines: {
      object: "list",
      data: [
        {
          id: `il_${inv.id.slice(3)}`,
          object: "line_item",
          amount: inv.amount,
          currency: lower(plan.currency),
          description: `1 × ${plan.name}`,
          quantity: 1,
          period: { start: inv.periodStart, end: inv.periodEnd },
          pricing: { price_details: { price: plan.priceId, product: plan.productId } },
          parent: { subscription_item_details: { subscription_item: m.itemId, proration: false } },
        },
      ],
    },
    subtotal: inv.amount,
    total: inv.amount,
    amount_due: inv.amount,
    amount_paid: paid ? inv.amount : 0,
    amount_remaining: paid ? 0 : inv.amount,
    attempt_count: inv.attempts.length,
    attempted: true,
    next_payment_attempt: inv.nextAttempt,
    period_start: inv.periodStart,
    period_end: inv.periodEnd,
    payments: {
      object: "list",
      data: [
        {
          id: `inpay_${inv.id.slice(3)}`,
          amount_paid: paid ? inv.amount : null,
          amount_requested: inv.amount,
          status: paid ? "paid" : "open",
          payment: { type: "payment_intent", payment_intent: inv.paymentIntentId },
          status_transitions: { paid_at: paid ? (last?.at ?? null) : null, canceled_at: null },
        },
      ],
    },
    status_transitions: {
      finalized_at: inv.created,
      paid_at: paid ? (last?.at ?? null) : null,
      voided_at: null,
      marked_uncollectible_at: inv.status === "failed" ? (last?.at ?? null) : null,
    },
  });
  out.payment_intents.push({
    id: inv.paymentIntentId,
    object: "payment_intent",
    created: inv.created,
    amount: inv.amount,
    currency: lower(plan.currency),
    customer: m.customerId,
    payment_method: m.paymentMethodId,
    latest_charge: last?.chargeId ?? null,
    status: paid ? "succeeded" : "requires_payment_method",
    last_payment_error: paid ? null : { code: "card_declined", decline_code: "generic_decline", message: DECLINE },
  });
  for (const a of inv.attempts) {
    const isPaid = a.ok;
    out.charges.push({
      id: a.chargeId,
      object: "charge",
      created: a.at,
      amount: inv.amount,
      amount_refunded: isPaid ? refunded : 0,
      refunded: isPaid && refunded >= inv.amount,
      currency: lower(plan.currency),
      customer: m.customerId,
      status: isPaid ? "succeeded" : "failed",
      failure_code: isPaid ? null : "card_declined",
      failure_message: isPaid ? null : DECLINE,
      payment_intent: inv.paymentIntentId,
      payment_method: m.paymentMethodId,
      receipt_number: isPaid ? inv.number : null,
      payment_method_details: { type: "card", card: { brand: "visa", last4: m.card, exp_month: 12, exp_year: 2034 } },
    });
  }
  const paidCharge = inv.attempts.find((a) => a.ok)?.chargeId ?? "";
  for (const r of inv.refunds) {
    out.refunds.push({
      id: r.id,
      object: "refund",
      created: r.created,
      amount: r.amount,
      currency: lower(plan.currency),
      charge: paidCharge,
      payment_intent: inv.paymentIntentId,
      reason: "requested_by_customer",
      status: "succeeded",
      metadata: { reason: r.reason },
    });
  }
}

/** Everything the stand-in needs to agree with the database. */
export function stripeImportOf(history: DemoMembership[], anchor: number): StripeImport {
  const out: StripeImport = {
    customers: [],
    products: [],
    prices: [],
    payment_methods: [],
    subscriptions: [],
    invoices: [],
    payment_intents: [],
    charges: [],
    refunds: [],
  };
  for (const p of Object.values(DEMO_PLANS)) {
    const created = anchor - 400 * 86_400;
    out.products.push({
      id: p.productId,
      object: "product",
      created,
      name: p.name,
      description: "The whole catalogue",
      active: true,
      default_price: p.priceId,
    });
    out.prices.push({
      id: p.priceId,
      object: "price",
      created,
      active: true,
      currency: lower(p.currency),
      unit_amount: p.amount,
      product: p.productId,
      recurring: { interval: p.interval, interval_count: 1 },
    });
  }
  for (const m of history) {
    out.customers.push({
      id: m.customerId,
      object: "customer",
      created: m.start,
      email: m.email,
      name: m.name,
      invoice_prefix: m.invoicePrefix,
      next_invoice_sequence: m.invoices.length + 1,
      invoice_settings: { default_payment_method: m.paymentMethodId },
      metadata: { demo: "larchmoor" },
    });
    out.payment_methods.push({
      id: m.paymentMethodId,
      object: "payment_method",
      created: m.start,
      customer: m.customerId,
      type: "card",
      card: { brand: "visa", last4: m.card, exp_month: 12, exp_year: 2034, funding: "credit", country: "GB" },
      billing_details: { name: m.name, email: m.email },
    });
    const plan = DEMO_PLANS[m.plan];
    out.subscriptions.push({
      id: m.subscriptionId,
      object: "subscription",
      created: m.start,
      start_date: m.start,
      customer: m.customerId,
      currency: lower(plan.currency),
      status: m.status,
      items: {
        object: "list",
        data: [
          {
            id: m.itemId,
            object: "subscription_item",
            created: m.start,
            price: plan.priceId,
            quantity: 1,
            current_period_start: m.periodStart,
            current_period_end: m.periodEnd,
          },
        ],
      },
      billing_cycle_anchor: m.start,
      cancel_at_period_end: m.cancelAtPeriodEnd,
      cancel_at: m.cancelAtPeriodEnd ? m.periodEnd : null,
      canceled_at: m.canceledAt,
      ended_at: m.endedAt,
      cancellation_details: {
        reason:
          m.status === "canceled"
            ? m.invoices.at(-1)?.status === "failed"
              ? "payment_failed"
              : "cancellation_requested"
            : m.cancelAtPeriodEnd
              ? "cancellation_requested"
              : null,
      },
      default_payment_method: m.paymentMethodId,
      latest_invoice: m.invoices.at(-1)?.id ?? null,
      metadata: {},
    });
    for (const inv of m.invoices) invoiceObjects(m, inv, out);
  }
  return out;
}
