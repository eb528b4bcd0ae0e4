// POST /_fake/import: loads objects given in Stripe's shapes (as the API answers them, e.g. a
// subscription's items as a list envelope with price objects) so the demo seed can write the same
// history to the database and here with the same ids. Upsert by id: importing twice changes nothing.
// No events are sent for imported objects.
import type { Fake } from "./context";
import { invalidParam } from "./errors";
import { newId } from "./state";
import type {
  Charge,
  Customer,
  Invoice,
  InvoiceLine,
  InvoicePayment,
  Json,
  JsonObject,
  PaymentIntent,
  PaymentMethod,
  Price,
  Product,
  Refund,
  Stored,
  Subscription,
  SubscriptionItem,
} from "./types";

type O = JsonObject;
const isObj = (v: Json | undefined): v is O => typeof v === "object" && v !== null && !Array.isArray(v);
const obj = (o: O, k: string): O => (isObj(o[k]) ? (o[k] as O) : {});
const str = (o: O, k: string): string | null => (typeof o[k] === "string" ? (o[k] as string) : null);
const num = (o: O, k: string, d = 0): number => (typeof o[k] === "number" ? (o[k] as number) : d);
const numOrNull = (o: O, k: string): number | null => (typeof o[k] === "number" ? (o[k] as number) : null);
const bool = (o: O, k: string, d: boolean): boolean => (typeof o[k] === "boolean" ? (o[k] as boolean) : d);
const idOf = (v: Json | undefined): string | null =>
  typeof v === "string" ? v : isObj(v) && typeof v.id === "string" ? v.id : null;
const meta = (o: O): Record<string, string> =>
  Object.fromEntries(Object.entries(obj(o, "metadata")).map(([k, v]) => [k, String(v)]));
/** A list envelope's data, or a plain array. */
const items = (v: Json | undefined): O[] =>
  (Array.isArray(v) ? v : isObj(v) && Array.isArray(v.data) ? v.data : []).filter(isObj);

function need(o: O, kind: string, prefix: string): string {
  const id = str(o, "id");
  if (!id || !id.startsWith(prefix))
    throw invalidParam(`${kind}.id`, `Each ${kind} needs an id starting with ${prefix} (got ${String(id)}).`);
  return id;
}

function customer(o: O): Customer {
  return {
    id: need(o, "customer", "cus_"),
    object: "customer",
    created: num(o, "created"),
    email: str(o, "email"),
    name: str(o, "name"),
    description: str(o, "description"),
    metadata: meta(o),
    balance: num(o, "balance"),
    currency: str(o, "currency"),
    invoice_prefix: str(o, "invoice_prefix") ?? newId("x").slice(2, 10).toUpperCase(),
    next_invoice_sequence: num(o, "next_invoice_sequence", 1),
    delinquent: bool(o, "delinquent", false),
    invoice_settings: { default_payment_method: idOf(obj(o, "invoice_settings").default_payment_method) },
  };
}

function product(o: O): Product {
  return {
    id: need(o, "product", "prod_"),
    object: "product",
    created: num(o, "created"),
    updated: num(o, "updated", num(o, "created")),
    active: bool(o, "active", true),
    name: str(o, "name") ?? "",
    description: str(o, "description"),
    metadata: meta(o),
    default_price: idOf(o.default_price),
  };
}

function price(o: O): Price {
  const rec = obj(o, "recurring");
  const interval = str(rec, "interval");
  return {
    id: need(o, "price", "price_"),
    object: "price",
    created: num(o, "created"),
    active: bool(o, "active", true),
    currency: (str(o, "currency") ?? "gbp").toLowerCase(),
    unit_amount: num(o, "unit_amount"),
    product: idOf(o.product) ?? "",
    nickname: str(o, "nickname"),
    lookup_key: str(o, "lookup_key"),
    metadata: meta(o),
    type: interval ? "recurring" : "one_time",
    recurring:
      interval === "day" || interval === "week" || interval === "month" || interval === "year"
        ? { interval, interval_count: num(rec, "interval_count", 1) }
        : null,
  };
}

function paymentMethod(o: O): PaymentMethod {
  const card = obj(o, "card");
  const bd = obj(o, "billing_details");
  return {
    id: need(o, "payment_method", "pm_"),
    object: "payment_method",
    created: num(o, "created"),
    customer: idOf(o.customer),
    type: "card",
    card: {
      brand: str(card, "brand") ?? "visa",
      last4: str(card, "last4") ?? "4242",
      exp_month: num(card, "exp_month", 12),
      exp_year: num(card, "exp_year", 2034),
      funding: str(card, "funding") ?? "credit",
      country: str(card, "country") ?? "GB",
    },
    billing_details: { name: str(bd, "name"), email: str(bd, "email") },
    metadata: meta(o),
  };
}

function subscription(o: O): Subscription {
  const id = need(o, "subscription", "sub_");
  const subItems: SubscriptionItem[] = items(o.items).map((i) => ({
    id: str(i, "id") ?? newId("si"),
    object: "subscription_item",
    created: num(i, "created", num(o, "created")),
    price: idOf(i.price) ?? "",
    quantity: num(i, "quantity", 1),
    current_period_start: num(i, "current_period_start", num(o, "current_period_start")),
    current_period_end: num(i, "current_period_end", num(o, "current_period_end")),
    metadata: meta(i),
    subscription: id,
  }));
  const cd = obj(o, "cancellation_details");
  const status = str(o, "status") ?? "active";
  return {
    id,
    object: "subscription",
    created: num(o, "created"),
    start_date: num(o, "start_date", num(o, "created")),
    customer: idOf(o.customer) ?? "",
    currency: str(o, "currency") ?? "gbp",
    status: status as Subscription["status"],
    items: subItems,
    billing_cycle_anchor: num(o, "billing_cycle_anchor", subItems[0]?.current_period_start ?? num(o, "created")),
    cancel_at_period_end: bool(o, "cancel_at_period_end", false),
    cancel_at: numOrNull(o, "cancel_at"),
    canceled_at: numOrNull(o, "canceled_at"),
    ended_at: numOrNull(o, "ended_at"),
    cancellation_details: { comment: str(cd, "comment"), feedback: str(cd, "feedback"), reason: str(cd, "reason") },
    default_payment_method: idOf(o.default_payment_method),
    latest_invoice: idOf(o.latest_invoice),
    metadata: meta(o),
    pending_lines: [],
  };
}

function invoice(o: O): Invoice {
  const id = need(o, "invoice", "in_");
  const sub = idOf(obj(obj(o, "parent"), "subscription_details").subscription) ?? idOf(o.subscription);
  const currency = str(o, "currency") ?? "gbp";
  const lines: InvoiceLine[] = items(o.lines).map((l) => {
    const sid = obj(obj(l, "parent"), "subscription_item_details");
    return {
      id: str(l, "id") ?? newId("il"),
      object: "line_item",
      amount: num(l, "amount"),
      currency: str(l, "currency") ?? currency,
      description: str(l, "description") ?? "",
      quantity: num(l, "quantity", 1),
      period: { start: num(obj(l, "period"), "start"), end: num(obj(l, "period"), "end") },
      price: idOf(obj(obj(l, "pricing"), "price_details").price) ?? idOf(l.price) ?? "",
      proration: bool(sid, "proration", bool(l, "proration", false)),
      subscription: sub,
      subscription_item: str(sid, "subscription_item"),
      metadata: meta(l),
    };
  });
  const st = obj(o, "status_transitions");
  const payments: InvoicePayment[] = items(o.payments).map((p) => ({
    id: str(p, "id") ?? newId("inpay"),
    object: "invoice_payment",
    created: num(p, "created", num(o, "created")),
    amount_paid: numOrNull(p, "amount_paid"),
    amount_requested: num(p, "amount_requested"),
    currency,
    invoice: id,
    is_default: bool(p, "is_default", true),
    status: (str(p, "status") ?? "paid") as InvoicePayment["status"],
    payment: { type: "payment_intent", payment_intent: idOf(obj(p, "payment").payment_intent) ?? "" },
    status_transitions: {
      canceled_at: numOrNull(obj(p, "status_transitions"), "canceled_at"),
      paid_at: numOrNull(obj(p, "status_transitions"), "paid_at"),
    },
  }));
  const total = num(
    o,
    "total",
    lines.reduce((s, l) => s + l.amount, 0),
  );
  return {
    id,
    object: "invoice",
    created: num(o, "created"),
    customer: idOf(o.customer) ?? "",
    currency,
    status: (str(o, "status") ?? "paid") as Invoice["status"],
    billing_reason: (str(o, "billing_reason") ?? "subscription_cycle") as Invoice["billing_reason"],
    number: str(o, "number"),
    receipt_number: str(o, "receipt_number"),
    subscription: sub,
    lines,
    subtotal: num(o, "subtotal", total),
    total,
    starting_balance: num(o, "starting_balance"),
    ending_balance: numOrNull(o, "ending_balance"),
    amount_due: num(o, "amount_due", total),
    amount_paid: num(o, "amount_paid"),
    amount_remaining: num(o, "amount_remaining"),
    attempt_count: num(o, "attempt_count", 1),
    attempted: bool(o, "attempted", true),
    next_payment_attempt: numOrNull(o, "next_payment_attempt"),
    period_start: num(o, "period_start", num(o, "created")),
    period_end: num(o, "period_end", num(o, "created")),
    metadata: meta(o),
    payments,
    status_transitions: {
      finalized_at: numOrNull(st, "finalized_at"),
      paid_at: numOrNull(st, "paid_at"),
      voided_at: numOrNull(st, "voided_at"),
      marked_uncollectible_at: numOrNull(st, "marked_uncollectible_at"),
    },
  };
}

function paymentIntent(o: O): PaymentIntent {
  const status = str(o, "status") === "succeeded" ? "succeeded" : "requires_payment_method";
  const err = obj(o, "last_payment_error");
  return {
    id: need(o, "payment_intent", "pi_"),
    object: "payment_intent",
    created: num(o, "created"),
    amount: num(o, "amount"),
    amount_received: num(o, "amount_received", status === "succeeded" ? num(o, "amount") : 0),
    currency: str(o, "currency") ?? "gbp",
    customer: idOf(o.customer),
    payment_method: idOf(o.payment_method),
    latest_charge: idOf(o.latest_charge),
    description: str(o, "description"),
    status,
    metadata: meta(o),
    last_payment_error: str(err, "message")
      ? {
          type: "card_error",
          code: str(err, "code") ?? "card_declined",
          decline_code: str(err, "decline_code") ?? "generic_decline",
          message: str(err, "message") ?? "",
        }
      : null,
  };
}

function charge(o: O): Charge {
  const ok = str(o, "status") !== "failed";
  const card = obj(obj(o, "payment_method_details"), "card");
  const outcome = obj(o, "outcome");
  return {
    id: need(o, "charge", "ch_"),
    object: "charge",
    created: num(o, "created"),
    amount: num(o, "amount"),
    amount_captured: num(o, "amount_captured", ok ? num(o, "amount") : 0),
    amount_refunded: num(o, "amount_refunded"),
    currency: str(o, "currency") ?? "gbp",
    customer: idOf(o.customer),
    description: str(o, "description"),
    paid: bool(o, "paid", ok),
    captured: bool(o, "captured", ok),
    refunded: bool(o, "refunded", false),
    status: ok ? "succeeded" : "failed",
    failure_code: str(o, "failure_code"),
    failure_message: str(o, "failure_message"),
    outcome: {
      type: str(outcome, "type") ?? (ok ? "authorized" : "issuer_declined"),
      seller_message: str(outcome, "seller_message") ?? "",
      reason: str(outcome, "reason"),
      network_status: str(outcome, "network_status") ?? (ok ? "approved_by_network" : "declined_by_network"),
    },
    payment_intent: idOf(o.payment_intent),
    payment_method: idOf(o.payment_method),
    receipt_number: str(o, "receipt_number"),
    payment_method_details: {
      type: "card",
      card: {
        brand: str(card, "brand") ?? "visa",
        last4: str(card, "last4") ?? "4242",
        exp_month: num(card, "exp_month", 12),
        exp_year: num(card, "exp_year", 2034),
      },
    },
    metadata: meta(o),
  };
}

function refund(o: O): Refund {
  return {
    id: need(o, "refund", "re_"),
    object: "refund",
    created: num(o, "created"),
    amount: num(o, "amount"),
    currency: str(o, "currency") ?? "gbp",
    charge: idOf(o.charge) ?? "",
    payment_intent: idOf(o.payment_intent),
    reason: str(o, "reason") as Refund["reason"],
    status: "succeeded",
    metadata: meta(o),
    receipt_number: str(o, "receipt_number"),
  };
}

const KINDS: Array<[string, (o: O) => Stored]> = [
  ["customers", customer],
  ["products", product],
  ["prices", price],
  ["payment_methods", paymentMethod],
  ["subscriptions", subscription],
  ["invoices", invoice],
  ["payment_intents", paymentIntent],
  ["charges", charge],
  ["refunds", refund],
];

export function importObjects(fake: Fake, body: unknown): Record<string, number> {
  if (!isObj(body as Json))
    throw invalidParam("body", "Send a JSON object: { customers: [...], products: [...], ... }.");
  const input = body as O;
  const counts: Record<string, number> = {};
  for (const [key, build] of KINDS) {
    const list = input[key];
    if (list === undefined) continue;
    if (!Array.isArray(list)) throw invalidParam(key, `${key} must be an array.`);
    counts[key] = 0;
    for (const o of list.filter(isObj)) {
      fake.store.put(build(o));
      counts[key] += 1;
    }
  }
  return counts;
}
