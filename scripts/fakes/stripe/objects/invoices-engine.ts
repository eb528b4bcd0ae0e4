// Invoices as Stripe makes them for subscriptions: lines summed, the customer's credit balance applied
// (Stripe docs: "Customer credit balance"), finalized at once, then paid by a charge on the card.
// A failed renewal is retried on a shortened, fixed schedule: 3 days after the first failure, then 5
// days after that; the third failure is the last. This stands in for Stripe's Smart Retries (which pick
// the moments themselves, up to 8 tries within a configurable window, default 2 weeks — Stripe docs:
// "Automate payment retries"), simplified so a test or a demo can step through it with the clock.
import type { Fake } from "../context";
import { money } from "../context";
import { newId } from "../state";
import type { BillingReason, CardError, Invoice, InvoiceLine, PaymentMethod, Price, Subscription } from "../types";
import { chargeCard, type ChargeResult } from "./cards";

export const RETRY_DELAYS_DAYS = [3, 5];
const DAY = 86_400;

export function itemLine(
  fake: Fake,
  sub: Subscription,
  itemId: string,
  price: Price,
  quantity: number,
  period: { start: number; end: number },
): InvoiceLine {
  const name = fake.store.find("product", price.product)?.name ?? price.nickname ?? price.id;
  const per = price.recurring
    ? ` / ${price.recurring.interval_count > 1 ? `${price.recurring.interval_count} ` : ""}${price.recurring.interval}`
    : "";
  return {
    id: newId("il"),
    object: "line_item",
    amount: price.unit_amount * quantity,
    currency: price.currency,
    description: `${quantity} × ${name} (at ${money(price.unit_amount, price.currency)}${per})`,
    quantity,
    period,
    price: price.id,
    proration: false,
    subscription: sub.id,
    subscription_item: itemId,
    metadata: {},
  };
}

/** An invoice built but not stored: used as is by the preview, stored by createInvoice. */
export function draftInvoice(
  fake: Fake,
  args: {
    sub: Subscription;
    lines: InvoiceLine[];
    reason: BillingReason;
    id?: string;
    usage?: { start: number; end: number };
  },
): Invoice {
  const now = fake.clock.now();
  const customer = fake.store.get("customer", args.sub.customer);
  const total = args.lines.reduce((s, l) => s + l.amount, 0);
  const starting = customer.balance;
  const amountDue = Math.max(0, total + starting);
  return {
    id: args.id ?? newId("in"),
    object: "invoice",
    created: now,
    customer: customer.id,
    currency: args.sub.currency,
    status: "draft",
    billing_reason: args.reason,
    number: null,
    receipt_number: null,
    subscription: args.sub.id,
    lines: args.lines,
    subtotal: total,
    total,
    starting_balance: starting,
    ending_balance: null,
    amount_due: amountDue,
    amount_paid: 0,
    amount_remaining: amountDue,
    attempt_count: 0,
    attempted: false,
    next_payment_attempt: null,
    // Stripe's invoice period is the usage period before the invoice (for a renewal, the period that just
    // ended; otherwise the moment it is made); the service period is on each line.
    period_start: args.usage?.start ?? now,
    period_end: args.usage?.end ?? now,
    metadata: {},
    payments: [],
    status_transitions: { finalized_at: null, paid_at: null, voided_at: null, marked_uncollectible_at: null },
  };
}

/** Creates and finalizes the invoice; a zero amount due is paid on the spot, as Stripe does. */
export function createInvoice(
  fake: Fake,
  args: { sub: Subscription; lines: InvoiceLine[]; reason: BillingReason; usage?: { start: number; end: number } },
): Invoice {
  const inv = draftInvoice(fake, args);
  const customer = fake.store.get("customer", inv.customer);
  const now = fake.clock.now();
  customer.balance = Math.min(0, inv.total + inv.starting_balance);
  inv.ending_balance = customer.balance;
  inv.number = `${customer.invoice_prefix}-${String(customer.next_invoice_sequence++).padStart(4, "0")}`;
  inv.status = "open";
  inv.status_transitions.finalized_at = now;
  if (inv.amount_due === 0) {
    inv.status = "paid";
    inv.status_transitions.paid_at = now;
  }
  fake.store.put(inv);
  args.sub.latest_invoice = inv.id;
  return inv;
}

export function paymentMethodFor(fake: Fake, sub: Subscription): PaymentMethod | undefined {
  const id =
    sub.default_payment_method ?? fake.store.find("customer", sub.customer)?.invoice_settings.default_payment_method;
  return id ? fake.store.find("payment_method", id) : undefined;
}

/** Records one payment attempt's outcome on the invoice and schedules the next retry after a failure. */
export function recordAttempt(fake: Fake, inv: Invoice, result: ChargeResult): CardError | null {
  const now = fake.clock.now();
  inv.attempt_count += 1;
  inv.attempted = true;
  inv.payments.push({
    id: newId("inpay"),
    object: "invoice_payment",
    created: now,
    amount_paid: result.error ? null : inv.amount_due,
    amount_requested: inv.amount_due,
    currency: inv.currency,
    invoice: inv.id,
    is_default: !result.error,
    status: result.error ? "canceled" : "paid",
    payment: { type: "payment_intent", payment_intent: result.intent.id },
    status_transitions: { canceled_at: result.error ? now : null, paid_at: result.error ? null : now },
  });
  if (result.error) {
    const delay = RETRY_DELAYS_DAYS[inv.attempt_count - 1];
    inv.next_payment_attempt = delay === undefined ? null : now + delay * DAY;
    return result.error;
  }
  inv.status = "paid";
  inv.amount_paid = inv.amount_due;
  inv.amount_remaining = 0;
  inv.receipt_number = result.charge.receipt_number;
  inv.next_payment_attempt = null;
  inv.status_transitions.paid_at = now;
  return null;
}

/** Charges the invoice's amount due to the given card (or the subscription's) and records the attempt. */
export function payInvoice(fake: Fake, inv: Invoice, sub: Subscription, pm?: PaymentMethod): CardError | null {
  if (inv.status !== "open") return null;
  const result = chargeCard(fake, {
    amount: inv.amount_due,
    currency: inv.currency,
    customer: inv.customer,
    paymentMethod: pm ?? paymentMethodFor(fake, sub),
    description:
      inv.billing_reason === "subscription_create"
        ? "Subscription creation"
        : inv.billing_reason === "subscription_update"
          ? "Subscription update"
          : "Subscription cycle",
  });
  return recordAttempt(fake, inv, result);
}
