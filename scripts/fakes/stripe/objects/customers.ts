// Customers (Stripe API reference: "Customers"): create, retrieve, update, list (by email — exact and
// case-sensitive, as Stripe's filter is), delete.
import type { Handler } from "../context";
import { expand, paginate } from "../expand";
import { listOf, render } from "../render";
import { newId } from "../state";
import type { Customer } from "../types";
import { cancelNow, changedFields } from "./lifecycle";

const create: Handler = ({ fake, params }) => {
  const pm = params.obj("invoice_settings")?.str("default_payment_method") ?? null;
  if (pm) fake.store.get("payment_method", pm, "invoice_settings[default_payment_method]");
  const c = fake.store.put<Customer>({
    id: newId("cus"),
    object: "customer",
    created: fake.clock.now(),
    email: params.str("email") ?? null,
    name: params.str("name") ?? null,
    description: params.str("description") ?? null,
    metadata: params.metadata(),
    balance: params.int("balance") ?? 0,
    currency: null,
    invoice_prefix: newId("x").slice(2, 10).toUpperCase(),
    next_invoice_sequence: 1,
    delinquent: false,
    invoice_settings: { default_payment_method: pm },
  });
  fake.hooks.emit("customer.created", c);
  return expand(fake.store, render(fake.store, c), params);
};

const retrieve: Handler = ({ fake, params, ids }) =>
  expand(fake.store, render(fake.store, fake.store.get("customer", ids[0] ?? "")), params);

const update: Handler = ({ fake, params, ids }) => {
  const c = fake.store.get("customer", ids[0] ?? "");
  const before = render(fake.store, c);
  if (params.has("email")) c.email = params.nullableStr("email") ?? null;
  if (params.has("name")) c.name = params.nullableStr("name") ?? null;
  if (params.has("description")) c.description = params.nullableStr("description") ?? null;
  c.metadata = params.metadata(c.metadata);
  const settings = params.obj("invoice_settings");
  if (settings?.has("default_payment_method")) {
    const pm = settings.nullableStr("default_payment_method") ?? null;
    if (pm) fake.store.get("payment_method", pm, "invoice_settings[default_payment_method]");
    c.invoice_settings.default_payment_method = pm;
  }
  const after = render(fake.store, c);
  const prev = changedFields(before, after);
  if (Object.keys(prev).length > 0) fake.hooks.emit("customer.updated", c, prev);
  return expand(fake.store, after, params);
};

const list: Handler = ({ fake, params }) => {
  const email = params.str("email");
  const all = fake.store.all("customer").filter((c) => email === undefined || c.email === email);
  const page = paginate(all, params);
  return expand(
    fake.store,
    listOf(
      "/v1/customers",
      page.data.map((c) => render(fake.store, c)),
      page.hasMore,
    ),
    params,
  );
};

const remove: Handler = ({ fake, ids }) => {
  const c = fake.store.get("customer", ids[0] ?? "");
  // Stripe docs: deleting a customer "immediately cancels any active subscriptions on the customer".
  for (const sub of fake.store.all("subscription"))
    if (sub.customer === c.id && sub.status !== "canceled") cancelNow(fake, sub, "cancellation_requested");
  fake.store.objects.delete(c.id);
  fake.hooks.emit("customer.deleted", c);
  return { id: c.id, object: "customer", deleted: true };
};

const paymentMethod: Handler = ({ fake, params, ids }) =>
  expand(fake.store, render(fake.store, fake.store.get("payment_method", ids[0] ?? "")), params);

const customerPaymentMethods: Handler = ({ fake, params, ids }) => {
  const c = fake.store.get("customer", ids[0] ?? "", "customer");
  const page = paginate(
    fake.store.all("payment_method").filter((p) => p.customer === c.id),
    params,
  );
  return listOf(
    `/v1/customers/${c.id}/payment_methods`,
    page.data.map((p) => render(fake.store, p)),
    page.hasMore,
  );
};

export function customerRoutes(): Array<[string, RegExp, Handler]> {
  return [
    ["POST", /^\/v1\/customers$/, create],
    ["GET", /^\/v1\/customers$/, list],
    ["GET", /^\/v1\/customers\/([^/]+)$/, retrieve],
    ["POST", /^\/v1\/customers\/([^/]+)$/, update],
    ["DELETE", /^\/v1\/customers\/([^/]+)$/, remove],
    ["GET", /^\/v1\/customers\/([^/]+)\/payment_methods$/, customerPaymentMethods],
    ["GET", /^\/v1\/payment_methods\/([^/]+)$/, paymentMethod],
  ];
}
