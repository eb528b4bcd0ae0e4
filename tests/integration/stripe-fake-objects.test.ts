// The Stripe stand-in through the real SDK: object shapes and ids, list envelopes and pagination,
// metadata updates, and Stripe's errors as the SDK surfaces them. No database needed.
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { FAKE_API_KEY, monthlyPlan, sdkFor, startStripeWorld, type StripeWorld } from "./helpers/stripe-fake-world";

let world: StripeWorld;
// Every object's time comes from the stand-in's clock, not the machine's.
const START = new Date("2026-04-01T09:00:00Z");
beforeAll(async () => {
  world = await startStripeWorld({ startAt: START });
});
afterAll(async () => world.close());

describe("objects and lists", () => {
  it("creates, retrieves, updates and lists customers by e-mail", async () => {
    const { stripe } = world;
    const a = await stripe.customers.create({
      email: "ada@example.test",
      name: "Ada",
      metadata: { user_id: "u-1", keep: "yes" },
    });
    await stripe.customers.create({ email: "bea@example.test" });
    // Stripe docs: "Object IDs" — customers are cus_…
    expect(a.id).toMatch(/^cus_[A-Za-z0-9]+$/);
    expect(a.object).toBe("customer");
    expect(a.created).toBeGreaterThanOrEqual(START.getTime() / 1000);
    expect(a.created).toBeLessThan(START.getTime() / 1000 + 60);
    const got = await stripe.customers.retrieve(a.id);
    expect(got).toMatchObject({ id: a.id, email: "ada@example.test", metadata: { user_id: "u-1", keep: "yes" } });
    // Stripe docs: "Metadata" — an empty value unsets one key, others stay.
    const updated = await stripe.customers.update(a.id, { name: "Ada L.", metadata: { user_id: "", plan: "m" } });
    expect(updated.name).toBe("Ada L.");
    expect(updated.metadata).toEqual({ keep: "yes", plan: "m" });
    const byEmail = await stripe.customers.list({ email: "ada@example.test" });
    // Stripe docs: "Pagination" — the list envelope.
    expect(byEmail).toMatchObject({ object: "list", has_more: false, url: "/v1/customers" });
    expect(byEmail.data.map((c) => c.id)).toEqual([a.id]);
  });

  it("pages through a list newest first with starting_after", async () => {
    const { stripe } = world;
    const made: string[] = [];
    for (let i = 0; i < 5; i++)
      made.push((await stripe.products.create({ name: `Paging ${i}`, metadata: { batch: "paging" } })).id);
    const first = await stripe.products.list({ limit: 3 });
    expect(first.data).toHaveLength(3);
    expect(first.has_more).toBe(true);
    expect(first.data.map((p) => p.id)).toEqual([made[4], made[3], made[2]]);
    const next = await stripe.products.list({ limit: 3, starting_after: first.data[2]?.id });
    expect(next.data.map((p) => p.id).slice(0, 2)).toEqual([made[1], made[0]]);
    // The SDK's auto-pagination walks the same cursors.
    const all: string[] = [];
    for await (const p of stripe.products.list({ limit: 2 })) all.push(p.id);
    expect(all.filter((id) => made.includes(id))).toEqual([...made].reverse());
  });

  it("keeps prices fixed but lets them be archived, and filters by product and active", async () => {
    const { stripe } = world;
    const price = await monthlyPlan(stripe, 1800, "month", "Monthly membership");
    expect(price).toMatchObject({
      object: "price",
      currency: "gbp",
      unit_amount: 1800,
      type: "recurring",
      active: true,
    });
    expect(price.recurring).toMatchObject({ interval: "month", interval_count: 1, usage_type: "licensed" });
    expect(price.id).toMatch(/^price_/);
    const archived = await stripe.prices.update(price.id, { active: false });
    expect(archived.active).toBe(false);
    const product = String(price.product);
    expect((await stripe.prices.list({ product, active: true })).data).toHaveLength(0);
    expect((await stripe.prices.list({ product, active: false })).data.map((p) => p.id)).toEqual([price.id]);
    const renamed = await stripe.products.update(product, { name: "Monthly membership (old)", active: false });
    expect(renamed).toMatchObject({ name: "Monthly membership (old)", active: false });
    const withProduct = await stripe.prices.retrieve(price.id, { expand: ["product"] });
    expect((withProduct.product as Stripe.Product).name).toBe("Monthly membership (old)");
  });

  it("makes a checkout session with Stripe's shape and the hosted page's url", async () => {
    const { stripe } = world;
    const price = await monthlyPlan(stripe, 18000, "year", "Yearly membership");
    const session = await stripe.checkout.sessions.create({
      mode: "subscription",
      customer_email: "new@example.test",
      line_items: [{ price: price.id, quantity: 1 }],
      success_url: "http://app.test/ok?s={CHECKOUT_SESSION_ID}",
      cancel_url: "http://app.test/plans",
      metadata: { user_id: "u-9" },
      subscription_data: { metadata: { user_id: "u-9" } },
    });
    expect(session.id).toMatch(/^cs_test_/);
    expect(session).toMatchObject({
      object: "checkout.session",
      mode: "subscription",
      status: "open",
      payment_status: "unpaid",
      amount_total: 18000,
      currency: "gbp",
      customer_email: "new@example.test",
      metadata: { user_id: "u-9" },
      subscription: null,
    });
    expect(session.url).toBe(`${world.fake.url}/pay/${session.id}`);
    const items = await stripe.checkout.sessions.listLineItems(session.id);
    expect(items.data[0]).toMatchObject({ quantity: 1, amount_total: 18000, description: "Yearly membership" });
  });
});

describe("idempotent requests", () => {
  it("answers a repeated Idempotency-Key with the first result, and refuses it with other parameters", async () => {
    // Stripe docs: "Idempotent requests".
    const a = await world.stripe.customers.create({ email: "once@example.test" }, { idempotencyKey: "customer:once" });
    const b = await world.stripe.customers.create({ email: "once@example.test" }, { idempotencyKey: "customer:once" });
    expect(b.id).toBe(a.id);
    expect((await world.stripe.customers.list({ email: "once@example.test" })).data).toHaveLength(1);
    const other = await world.stripe.customers
      .create({ email: "twice@example.test" }, { idempotencyKey: "customer:once" })
      .catch((e: unknown) => e);
    expect(other).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });
});

describe("errors as the SDK surfaces them", () => {
  it("answers a wrong key with 401 (StripeAuthenticationError)", async () => {
    const wrong = sdkFor(world.fake.url, "sk_test_not_the_key");
    const err = await wrong.customers.list().catch((e: unknown) => e);
    // Stripe docs: "Errors" — 401 Unauthorized: no valid API key provided.
    expect(err).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect((err as Stripe.errors.StripeError).statusCode).toBe(401);
    expect((err as Stripe.errors.StripeError).message).toMatch(/^Invalid API Key provided: sk_test_\**/);
  });

  it("answers a missing parameter with 400 parameter_missing naming it", async () => {
    const err = await world.stripe.prices
      .create({ currency: "gbp", unit_amount: 100 } as Stripe.PriceCreateParams)
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(err).toMatchObject({
      statusCode: 400,
      code: "parameter_missing",
      param: "product",
      type: "StripeInvalidRequestError",
    });
    const badMode = await world.stripe.checkout.sessions
      .create({ success_url: "http://app.test/ok" } as Stripe.Checkout.SessionCreateParams)
      .catch((e: unknown) => e);
    expect(badMode).toMatchObject({ statusCode: 400, code: "parameter_missing", param: "mode" });
  });

  it("answers a malformed value with 400 naming the parameter", async () => {
    const res = await fetch(`${world.fake.url}/v1/prices`, {
      method: "POST",
      headers: { authorization: `Bearer ${FAKE_API_KEY}`, "content-type": "application/x-www-form-urlencoded" },
      body: "currency=gbp&product=prod_x&unit_amount=12.5",
    });
    expect(res.status).toBe(400);
    // Stripe docs: "Error codes" — parameter_invalid_integer.
    expect(await res.json()).toMatchObject({
      error: { type: "invalid_request_error", code: "parameter_invalid_integer", param: "unit_amount" },
    });
  });

  it("answers an unknown id with 404 resource_missing", async () => {
    const err = await world.stripe.subscriptions.retrieve("sub_doesnotexist").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(err).toMatchObject({ statusCode: 404, code: "resource_missing", param: "id" });
    expect((err as Error).message).toBe("No such subscription: 'sub_doesnotexist'");
    const price = await world.stripe.checkout.sessions
      .create({
        mode: "subscription",
        success_url: "http://app.test/ok",
        line_items: [{ price: "price_nope", quantity: 1 }],
      })
      .catch((e: unknown) => e);
    expect(price).toMatchObject({ statusCode: 404, code: "resource_missing", param: "line_items[0][price]" });
  });
});
