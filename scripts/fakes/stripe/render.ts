// Stored object → the JSON Stripe answers with: fills the nullable fields the stand-in never sets, nests
// lists in Stripe's list envelope, and embeds what Stripe always embeds (a subscription item's price).
import type { Store } from "./state";
import type {
  Charge,
  CheckoutSession,
  Customer,
  Invoice,
  InvoiceLine,
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

export function listOf(url: string, data: Json[], hasMore = false): JsonObject {
  return { object: "list", data, has_more: hasMore, url };
}

const j = (o: object): JsonObject => JSON.parse(JSON.stringify(o)) as JsonObject;

function customer(c: Customer): JsonObject {
  return j({
    ...c,
    address: null,
    default_source: null,
    discount: null,
    livemode: false,
    phone: null,
    preferred_locales: [],
    shipping: null,
    tax_exempt: "none",
    test_clock: null,
    invoice_settings: {
      custom_fields: null,
      default_payment_method: c.invoice_settings.default_payment_method,
      footer: null,
      rendering_options: null,
    },
  });
}

function product(p: Product): JsonObject {
  return j({
    ...p,
    images: [],
    livemode: false,
    marketing_features: [],
    package_dimensions: null,
    shippable: null,
    statement_descriptor: null,
    tax_code: null,
    type: "service",
    unit_label: null,
    url: null,
  });
}

function price(p: Price): JsonObject {
  return j({
    ...p,
    billing_scheme: "per_unit",
    custom_unit_amount: null,
    livemode: false,
    tax_behavior: "unspecified",
    tiers_mode: null,
    transform_quantity: null,
    unit_amount_decimal: String(p.unit_amount),
    recurring: p.recurring && { ...p.recurring, meter: null, trial_period_days: null, usage_type: "licensed" },
  });
}

/** The legacy Plan view Stripe still puts beside each item's price. */
function plan(p: Price): JsonObject {
  return j({
    id: p.id,
    object: "plan",
    active: p.active,
    amount: p.unit_amount,
    amount_decimal: String(p.unit_amount),
    billing_scheme: "per_unit",
    created: p.created,
    currency: p.currency,
    interval: p.recurring?.interval ?? "month",
    interval_count: p.recurring?.interval_count ?? 1,
    livemode: false,
    metadata: p.metadata,
    meter: null,
    nickname: p.nickname,
    product: p.product,
    tiers_mode: null,
    transform_usage: null,
    trial_period_days: null,
    usage_type: "licensed",
  });
}

function item(store: Store, i: SubscriptionItem): JsonObject {
  const p = store.get("price", i.price);
  return j({ ...i, billing_thresholds: null, discounts: [], tax_rates: [], price: price(p), plan: plan(p) });
}

function subscription(store: Store, s: Subscription): JsonObject {
  const { pending_lines: _pending, items, ...rest } = s;
  return j({
    ...rest,
    application: null,
    application_fee_percent: null,
    automatic_tax: { enabled: false, liability: null },
    billing_mode: { type: "classic" },
    collection_method: "charge_automatically",
    days_until_due: null,
    default_source: null,
    description: null,
    discounts: [],
    invoice_settings: { account_tax_ids: null, issuer: { type: "self" } },
    items: listOf(
      `/v1/subscription_items?subscription=${s.id}`,
      items.map((i) => item(store, i)),
    ),
    livemode: false,
    on_behalf_of: null,
    pause_collection: null,
    pending_setup_intent: null,
    pending_update: null,
    schedule: null,
    test_clock: null,
    transfer_data: null,
    trial_end: null,
    trial_start: null,
  });
}

export function line(store: Store, invoiceId: string, l: InvoiceLine): JsonObject {
  const p = store.find("price", l.price);
  return j({
    id: l.id,
    object: "line_item",
    amount: l.amount,
    currency: l.currency,
    description: l.description,
    discount_amounts: [],
    discountable: !l.proration,
    discounts: [],
    invoice: invoiceId,
    livemode: false,
    metadata: l.metadata,
    period: l.period,
    pretax_credit_amounts: [],
    quantity: l.quantity,
    subscription: l.subscription,
    subtotal: l.amount,
    taxes: [],
    parent: {
      type: "subscription_item_details",
      invoice_item_details: null,
      subscription_item_details: {
        invoice_item: null,
        proration: l.proration,
        proration_details: { credited_items: null },
        subscription: l.subscription,
        subscription_item: l.subscription_item,
      },
    },
    pricing: {
      type: "price_details",
      price_details: { price: l.price, product: p?.product ?? null },
      unit_amount_decimal: p ? String(p.unit_amount) : null,
    },
  });
}

export function invoice(store: Store, inv: Invoice): JsonObject {
  const c = store.find("customer", inv.customer);
  const sub = inv.subscription ? store.find("subscription", inv.subscription) : undefined;
  const { subscription: subId, lines, payments, proration_date: prorationDate, ...rest } = inv;
  return j({
    ...rest,
    account_country: "GB",
    account_name: "Stripe stand-in",
    amount_overpaid: 0,
    amount_shipping: 0,
    application: null,
    auto_advance: inv.status === "open",
    automatic_tax: { enabled: false, liability: null, status: null },
    collection_method: "charge_automatically",
    customer_email: c?.email ?? null,
    customer_name: c?.name ?? null,
    default_payment_method: null,
    description: null,
    discounts: [],
    due_date: null,
    effective_at: inv.status_transitions.finalized_at,
    hosted_invoice_url: null,
    invoice_pdf: null,
    issuer: { type: "self" },
    last_finalization_error: null,
    livemode: false,
    lines: listOf(
      `/v1/invoices/${inv.id}/lines`,
      lines.map((l) => line(store, inv.id, l)),
    ),
    parent: subId
      ? {
          type: "subscription_details",
          quote_details: null,
          subscription_details: {
            metadata: sub?.metadata ?? {},
            subscription: subId,
            ...(prorationDate === undefined ? {} : { subscription_proration_date: prorationDate }),
          },
        }
      : null,
    // Stripe includes `payments` only when expanded; the stand-in always does (documented in README.md).
    payments: listOf(
      `/v1/invoice_payments?invoice=${inv.id}`,
      payments.map((p) => j(p)),
    ),
    subtotal_excluding_tax: inv.subtotal,
    test_clock: null,
    total_discount_amounts: [],
    total_excluding_tax: inv.total,
    total_pretax_credit_amounts: [],
    total_taxes: [],
    webhooks_delivered_at: null,
  });
}

function session(s: CheckoutSession): JsonObject {
  const { line_items: _items, last_error: _err, subscription_data: _sd, setup_intent_data: _sid, ...rest } = s;
  return j({
    ...rest,
    allow_promotion_codes: null,
    billing_address_collection: null,
    customer_creation: s.customer ? null : "always",
    customer_details: s.customer_details
      ? { ...s.customer_details, address: null, phone: null, tax_exempt: "none", tax_ids: [] }
      : null,
    invoice_creation: null,
    livemode: false,
    locale: null,
    payment_intent: null,
    payment_link: null,
    payment_method_collection: "always",
    payment_method_types: ["card"],
    ui_mode: "hosted",
    submit_type: null,
    total_details: s.amount_total === null ? null : { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
  });
}

export function sessionLineItems(store: Store, s: CheckoutSession): JsonObject {
  const data = s.line_items.map((li, n) => {
    const p = store.get("price", li.price);
    const name = store.find("product", p.product)?.name ?? "";
    const amount = p.unit_amount * li.quantity;
    return j({
      id: `li_${s.id.slice(3, 19)}${n}`,
      object: "item",
      amount_discount: 0,
      amount_subtotal: amount,
      amount_tax: 0,
      amount_total: amount,
      currency: p.currency,
      description: name,
      price: price(p),
      quantity: li.quantity,
    });
  });
  return listOf(`/v1/checkout/sessions/${s.id}/line_items`, data);
}

function paymentMethod(pm: PaymentMethod): JsonObject {
  return j({ ...pm, livemode: false, allow_redisplay: "unspecified" });
}

function paymentIntent(pi: PaymentIntent): JsonObject {
  return j({
    ...pi,
    capture_method: "automatic",
    client_secret: null,
    confirmation_method: "automatic",
    livemode: false,
    payment_method_types: ["card"],
    receipt_email: null,
  });
}

function charge(c: Charge): JsonObject {
  return j({
    ...c,
    balance_transaction: null,
    billing_details: { name: null, email: null },
    disputed: false,
    livemode: false,
    receipt_email: null,
    receipt_url: null,
    statement_descriptor: null,
  });
}

function refund(r: Refund): JsonObject {
  return j({
    ...r,
    balance_transaction: null,
    destination_details: null,
    transfer_reversal: null,
    source_transfer_reversal: null,
  });
}

export function render(store: Store, o: Stored): JsonObject {
  switch (o.object) {
    case "customer":
      return customer(o);
    case "product":
      return product(o);
    case "price":
      return price(o);
    case "payment_method":
      return paymentMethod(o);
    case "checkout.session":
      return session(o);
    case "subscription":
      return subscription(store, o);
    case "invoice":
      return invoice(store, o);
    case "payment_intent":
      return paymentIntent(o);
    case "charge":
      return charge(o);
    case "refund":
      return refund(o);
  }
}
