// What paying on the hosted page does. Subscription mode: the first invoice is charged before anything
// else exists, so a declined card leaves only the failed attempt (a PaymentIntent and a failed Charge),
// as Stripe Checkout does; on success the customer (if new), the subscription, its paid invoice and the
// events follow. Setup mode saves the card as the customer's default and on the subscription (named by
// setup_intent_data.metadata.subscription_id or metadata.subscription_id, else every live subscription
// of the customer), then pays a past-due subscription's open invoices at once. Real Stripe leaves those
// last steps to the integration (update the default, then `invoices.pay`); the stand-in does them so
// the app's "update card" flow behaves as the design asks.
import type { Fake } from "../context";
import { newId } from "../state";
import type { CardError, CheckoutSession, Customer, Subscription, SubscriptionItem } from "../types";
import { periodEnd } from "../clock";
import { attachError, chargeCard, createPaymentMethod, type TEST_CARDS } from "./cards";
import { createInvoice, itemLine, recordAttempt } from "./invoices-engine";
import { retryInvoice, updateSubscription } from "./lifecycle";

type Card = (typeof TEST_CARDS)[number];
export interface CardInput {
  card: Card;
  exp: { month: number; year: number };
  name: string;
}
export type Outcome = { ok: true } | { ok: false; error: CardError };

function newCustomer(fake: Fake, s: CheckoutSession, name: string): Customer {
  const c = fake.store.put<Customer>({
    id: newId("cus"),
    object: "customer",
    created: fake.clock.now(),
    email: s.customer_email,
    name,
    description: null,
    metadata: {},
    balance: 0,
    currency: s.currency,
    invoice_prefix: newId("x").slice(2, 10).toUpperCase(),
    next_invoice_sequence: 1,
    delinquent: false,
    invoice_settings: { default_payment_method: null },
  });
  fake.hooks.emit("customer.created", c);
  return c;
}

function completeSubscription(fake: Fake, s: CheckoutSession, input: CardInput): Outcome {
  const refused = attachError(input.card);
  const amount = s.amount_total ?? 0;
  const currency = s.currency ?? "gbp";
  if (refused || input.card.behaviour === "charge_fails") {
    const pm = createPaymentMethod(fake, input.card, input.exp, input.name, null);
    const attempt = chargeCard(fake, {
      amount,
      currency,
      customer: s.customer,
      paymentMethod: pm,
      description: "Subscription creation",
    });
    return {
      ok: false,
      error: attempt.error ?? {
        code: "card_declined",
        decline_code: "generic_decline",
        message: "Your card was declined.",
      },
    };
  }
  const customer = s.customer ? fake.store.get("customer", s.customer) : newCustomer(fake, s, input.name);
  const pm = createPaymentMethod(fake, input.card, input.exp, input.name, customer.id);
  if (!customer.invoice_settings.default_payment_method) customer.invoice_settings.default_payment_method = pm.id;
  const now = fake.clock.now();
  const subId = newId("sub");
  const first = fake.store.get("price", s.line_items[0]?.price ?? "");
  const items: SubscriptionItem[] = s.line_items.map((li) => {
    const price = fake.store.get("price", li.price);
    const rec = price.recurring ?? { interval: "month" as const, interval_count: 1 };
    return {
      id: newId("si"),
      object: "subscription_item",
      created: now,
      price: price.id,
      quantity: li.quantity,
      current_period_start: now,
      current_period_end: periodEnd(now, now, rec.interval, rec.interval_count),
      metadata: {},
      subscription: subId,
    };
  });
  const sub: Subscription = {
    id: subId,
    object: "subscription",
    created: now,
    start_date: now,
    customer: customer.id,
    currency: first.currency,
    status: "active",
    items,
    billing_cycle_anchor: now,
    cancel_at_period_end: false,
    cancel_at: null,
    canceled_at: null,
    ended_at: null,
    cancellation_details: { comment: null, feedback: null, reason: null },
    default_payment_method: pm.id,
    latest_invoice: null,
    metadata: s.subscription_data.metadata,
    pending_lines: [],
  };
  const lines = items.map((i) =>
    itemLine(fake, sub, i.id, fake.store.get("price", i.price), i.quantity, {
      start: i.current_period_start,
      end: i.current_period_end,
    }),
  );
  fake.store.put(sub);
  const inv = createInvoice(fake, { sub, lines, reason: "subscription_create" });
  const paid = chargeCard(fake, {
    amount: inv.amount_due,
    currency,
    customer: customer.id,
    paymentMethod: pm,
    description: "Subscription creation",
  });
  recordAttempt(fake, inv, paid);
  Object.assign(s, {
    status: "complete",
    payment_status: "paid",
    customer: customer.id,
    subscription: sub.id,
    invoice: inv.id,
  });
  s.customer_details = { email: customer.email, name: input.name };
  fake.hooks.emit("customer.subscription.created", sub);
  fake.hooks.emit("invoice.paid", inv);
  fake.hooks.emit("checkout.session.completed", s);
  return { ok: true };
}

function completeSetup(fake: Fake, s: CheckoutSession, input: CardInput): Outcome {
  const refused = attachError(input.card);
  if (refused) return { ok: false, error: refused };
  const customer = fake.store.get("customer", s.customer ?? "");
  const pm = createPaymentMethod(fake, input.card, input.exp, input.name, customer.id);
  customer.invoice_settings.default_payment_method = pm.id;
  Object.assign(s, {
    status: "complete",
    setup_intent: newId("seti"),
    customer_details: { email: customer.email, name: input.name },
  });
  fake.hooks.emit("checkout.session.completed", s);
  const named = s.setup_intent_data.metadata.subscription_id ?? s.metadata.subscription_id;
  const subs = fake.store
    .all("subscription")
    .filter((x) => x.customer === customer.id && x.status !== "canceled" && (!named || x.id === named));
  for (const sub of subs) {
    updateSubscription(fake, sub, () => {
      sub.default_payment_method = pm.id;
    });
    if (sub.status !== "past_due") continue;
    const open = fake.store
      .all("invoice")
      .filter((i) => i.subscription === sub.id && i.status === "open")
      .reverse();
    for (const inv of open) if (!retryInvoice(fake, inv, sub)) break;
  }
  return { ok: true };
}

export function completeSession(fake: Fake, s: CheckoutSession, input: CardInput): Outcome {
  const outcome = s.mode === "setup" ? completeSetup(fake, s, input) : completeSubscription(fake, s, input);
  s.last_error = outcome.ok ? null : outcome.error.message;
  fake.store.save();
  return outcome;
}
