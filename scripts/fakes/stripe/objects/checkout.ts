// Checkout Sessions (Stripe API reference: "Checkout Sessions"): mode=subscription with line_items
// [{price, quantity}], mode=setup to save a new card. The session's url is this stand-in's hosted page
// (checkout-page.ts), where the person types a test card.
import type { Fake, Handler } from "../context";
import { invalidParam, missingParam, requestError } from "../errors";
import { expand, paginate } from "../expand";
import { listOf, render, sessionLineItems } from "../render";
import { newId } from "../state";
import type { CheckoutSession } from "../types";

const DAY = 86_400;

/** Sessions past expires_at become expired when next looked at. */
export function freshSession(fake: Fake, id: string): CheckoutSession {
  const s = fake.store.get("checkout.session", id, "session");
  if (s.status === "open" && s.expires_at <= fake.clock.now()) {
    s.status = "expired";
    fake.hooks.emit("checkout.session.expired", s);
    fake.store.save();
  }
  return s;
}

const create: Handler = ({ fake, params }) => {
  const mode = params.str("mode");
  if (!mode) throw missingParam("mode");
  if (mode !== "subscription" && mode !== "setup") {
    throw invalidParam("mode", `Invalid mode: this stand-in supports subscription and setup (got ${mode}).`);
  }
  const successUrl = params.str("success_url");
  if (!successUrl) throw missingParam("success_url");
  const customer = params.str("customer") ?? null;
  if (customer) fake.store.get("customer", customer, "customer");
  const customerEmail = params.str("customer_email") ?? null;
  if (customer && customerEmail)
    throw requestError(
      "You may only specify one of these parameters: customer, customer_email.",
      "parameters_exclusive",
      "customer_email",
    );

  const lineItems = params.list("line_items").map((li, i) => {
    const priceId = li.str("price");
    if (!priceId) throw missingParam(`line_items[${i}][price]`);
    const price = fake.store.get("price", priceId, `line_items[${i}][price]`);
    if (!price.active)
      throw invalidParam(
        `line_items[${i}][price]`,
        `The price specified (${price.id}) is inactive. This field only accepts active prices.`,
      );
    if (mode === "subscription" && !price.recurring) {
      throw invalidParam(
        `line_items[${i}][price]`,
        "You must provide at least one recurring price in `subscription` mode when using prices.",
      );
    }
    const quantity = li.int("quantity") ?? 1;
    if (quantity < 1) throw invalidParam(`line_items[${i}][quantity]`, "Quantity must be at least 1.");
    return { price, quantity };
  });
  if (mode === "subscription" && lineItems.length === 0) throw missingParam("line_items");
  if (mode === "setup" && !customer) throw missingParam("customer");
  const currencies = new Set(lineItems.map((l) => l.price.currency));
  if (currencies.size > 1)
    throw invalidParam("line_items", "All prices on a subscription must have the same currency.");
  const amount = lineItems.reduce((s, l) => s + l.price.unit_amount * l.quantity, 0);
  const now = fake.clock.now();
  const id = newId("cs_test");
  const session = fake.store.put<CheckoutSession>({
    id,
    object: "checkout.session",
    created: now,
    expires_at: params.int("expires_at") ?? now + DAY,
    mode,
    status: "open",
    payment_status: mode === "setup" ? "no_payment_required" : "unpaid",
    customer,
    customer_email: customerEmail,
    client_reference_id: params.str("client_reference_id") ?? null,
    success_url: successUrl,
    cancel_url: params.str("cancel_url") ?? null,
    metadata: params.metadata(),
    currency: lineItems[0]?.price.currency ?? params.str("currency") ?? null,
    line_items: lineItems.map((l) => ({ price: l.price.id, quantity: l.quantity })),
    amount_subtotal: mode === "setup" ? null : amount,
    amount_total: mode === "setup" ? null : amount,
    subscription: null,
    invoice: null,
    setup_intent: null,
    subscription_data: { metadata: params.obj("subscription_data")?.metadata() ?? {} },
    setup_intent_data: { metadata: params.obj("setup_intent_data")?.metadata() ?? {} },
    last_error: null,
    url: `${fake.baseUrl}/pay/${id}`,
  });
  return expand(fake.store, render(fake.store, session), params);
};

const retrieve: Handler = ({ fake, params, ids }) =>
  expand(fake.store, render(fake.store, freshSession(fake, ids[0] ?? "")), params);

const list: Handler = ({ fake, params }) => {
  const customer = params.str("customer");
  const subscription = params.str("subscription");
  const all = fake.store
    .all("checkout.session")
    .filter((s) => (!customer || s.customer === customer) && (!subscription || s.subscription === subscription));
  const page = paginate(all, params);
  return expand(
    fake.store,
    listOf(
      "/v1/checkout/sessions",
      page.data.map((s) => render(fake.store, s)),
      page.hasMore,
    ),
    params,
  );
};

const lineItems: Handler = ({ fake, params, ids }) =>
  expand(fake.store, sessionLineItems(fake.store, freshSession(fake, ids[0] ?? "")), params);

const expire: Handler = ({ fake, params, ids }) => {
  const s = freshSession(fake, ids[0] ?? "");
  if (s.status !== "open")
    throw requestError(
      `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${s.status}".`,
    );
  s.status = "expired";
  fake.hooks.emit("checkout.session.expired", s);
  return expand(fake.store, render(fake.store, s), params);
};

export function checkoutRoutes(): Array<[string, RegExp, Handler]> {
  return [
    ["POST", /^\/v1\/checkout\/sessions$/, create],
    ["GET", /^\/v1\/checkout\/sessions$/, list],
    ["GET", /^\/v1\/checkout\/sessions\/([^/]+)$/, retrieve],
    ["GET", /^\/v1\/checkout\/sessions\/([^/]+)\/line_items$/, lineItems],
    ["POST", /^\/v1\/checkout\/sessions\/([^/]+)\/expire$/, expire],
  ];
}
