// Products and prices (Stripe API reference: "Products", "Prices"). A price's amount, currency and
// interval never change once made (Stripe only lets active, nickname, lookup_key and metadata change);
// a plan's new price is a new Price, the old one archived with active=false.
import type { Handler } from "../context";
import { invalidParam, missingParam } from "../errors";
import { expand, paginate } from "../expand";
import { listOf, render } from "../render";
import { newId } from "../state";
import type { Interval, Price, Product } from "../types";
import { changedFields } from "./lifecycle";

const INTERVALS = ["day", "week", "month", "year"] as const;

const createProduct: Handler = ({ fake, params }) => {
  const name = params.str("name");
  if (!name) throw missingParam("name");
  const id = params.str("id") ?? newId("prod");
  if (fake.store.objects.has(id)) throw invalidParam("id", `Product already exists.`, "resource_already_exists");
  const now = fake.clock.now();
  const p = fake.store.put<Product>({
    id,
    object: "product",
    created: now,
    updated: now,
    active: params.bool("active") ?? true,
    name,
    description: params.str("description") ?? null,
    metadata: params.metadata(),
    default_price: null,
  });
  fake.hooks.emit("product.created", p);
  return expand(fake.store, render(fake.store, p), params);
};

const updateProduct: Handler = ({ fake, params, ids }) => {
  const p = fake.store.get("product", ids[0] ?? "");
  const before = render(fake.store, p);
  if (params.has("name")) p.name = params.reqStr("name");
  if (params.has("description")) p.description = params.nullableStr("description") ?? null;
  if (params.has("active")) p.active = params.bool("active") ?? p.active;
  if (params.has("default_price")) {
    const dp = params.nullableStr("default_price") ?? null;
    if (dp) fake.store.get("price", dp, "default_price");
    p.default_price = dp;
  }
  p.metadata = params.metadata(p.metadata);
  p.updated = fake.clock.now();
  const after = render(fake.store, p);
  fake.hooks.emit("product.updated", p, changedFields(before, after));
  return expand(fake.store, after, params);
};

const getProduct: Handler = ({ fake, params, ids }) =>
  expand(fake.store, render(fake.store, fake.store.get("product", ids[0] ?? "")), params);

const listProducts: Handler = ({ fake, params }) => {
  const active = params.bool("active");
  const page = paginate(
    fake.store.all("product").filter((p) => active === undefined || p.active === active),
    params,
  );
  return expand(
    fake.store,
    listOf(
      "/v1/products",
      page.data.map((p) => render(fake.store, p)),
      page.hasMore,
    ),
    params,
  );
};

const createPrice: Handler = ({ fake, params }) => {
  const currency = params.str("currency");
  if (!currency) throw missingParam("currency");
  const productId = params.str("product");
  const productData = params.obj("product_data");
  if (!productId && !productData) throw missingParam("product");
  const unitAmount = params.int("unit_amount");
  if (unitAmount === undefined) throw missingParam("unit_amount");
  if (unitAmount < 0) throw invalidParam("unit_amount", "This value must be greater than or equal to 0.");
  const recurringParams = params.obj("recurring");
  let recurring: Price["recurring"] = null;
  if (recurringParams) {
    const interval = recurringParams.oneOf("interval", INTERVALS);
    if (!interval) throw missingParam("recurring[interval]");
    const count = recurringParams.int("interval_count") ?? 1;
    if (count < 1) throw invalidParam("recurring[interval_count]", "Invalid interval_count: must be at least 1.");
    recurring = { interval: interval as Interval, interval_count: count };
  }
  const now = fake.clock.now();
  let product = productId ? fake.store.get("product", productId, "product") : undefined;
  if (!product) {
    product = fake.store.put<Product>({
      id: newId("prod"),
      object: "product",
      created: now,
      updated: now,
      active: true,
      name: productData?.reqStr("name") ?? "",
      description: null,
      metadata: productData?.metadata() ?? {},
      default_price: null,
    });
    fake.hooks.emit("product.created", product);
  }
  const price = fake.store.put<Price>({
    id: newId("price"),
    object: "price",
    created: now,
    active: params.bool("active") ?? true,
    currency: currency.toLowerCase(),
    unit_amount: unitAmount,
    product: product.id,
    nickname: params.str("nickname") ?? null,
    lookup_key: params.str("lookup_key") ?? null,
    metadata: params.metadata(),
    type: recurring ? "recurring" : "one_time",
    recurring,
  });
  fake.hooks.emit("price.created", price);
  return expand(fake.store, render(fake.store, price), params);
};

const updatePrice: Handler = ({ fake, params, ids }) => {
  const p = fake.store.get("price", ids[0] ?? "");
  for (const fixed of ["unit_amount", "currency", "recurring", "product"]) {
    if (params.has(fixed)) throw invalidParam(fixed, `Received unknown parameter: ${fixed}`, "parameter_unknown");
  }
  const before = render(fake.store, p);
  if (params.has("active")) p.active = params.bool("active") ?? p.active;
  if (params.has("nickname")) p.nickname = params.nullableStr("nickname") ?? null;
  if (params.has("lookup_key")) p.lookup_key = params.nullableStr("lookup_key") ?? null;
  p.metadata = params.metadata(p.metadata);
  const after = render(fake.store, p);
  fake.hooks.emit("price.updated", p, changedFields(before, after));
  return expand(fake.store, after, params);
};

const getPrice: Handler = ({ fake, params, ids }) =>
  expand(fake.store, render(fake.store, fake.store.get("price", ids[0] ?? "")), params);

const listPrices: Handler = ({ fake, params }) => {
  const active = params.bool("active");
  const product = params.str("product");
  const keys = params.strings("lookup_keys");
  const all = fake.store
    .all("price")
    .filter(
      (p) =>
        (active === undefined || p.active === active) &&
        (!product || p.product === product) &&
        (keys.length === 0 || (p.lookup_key !== null && keys.includes(p.lookup_key))),
    );
  const page = paginate(all, params);
  return expand(
    fake.store,
    listOf(
      "/v1/prices",
      page.data.map((p) => render(fake.store, p)),
      page.hasMore,
    ),
    params,
  );
};

export function catalogRoutes(): Array<[string, RegExp, Handler]> {
  return [
    ["POST", /^\/v1\/products$/, createProduct],
    ["GET", /^\/v1\/products$/, listProducts],
    ["GET", /^\/v1\/products\/([^/]+)$/, getProduct],
    ["POST", /^\/v1\/products\/([^/]+)$/, updateProduct],
    ["POST", /^\/v1\/prices$/, createPrice],
    ["GET", /^\/v1\/prices$/, listPrices],
    ["GET", /^\/v1\/prices\/([^/]+)$/, getPrice],
    ["POST", /^\/v1\/prices\/([^/]+)$/, updatePrice],
  ];
}
