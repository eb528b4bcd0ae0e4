// Webhooks from the Stripe stand-in: signed so the SDK's own verifier accepts them (Stripe docs: "Check
// the webhook signatures"), retried after a failed delivery, and carrying Stripe's event shape.
import Stripe from "stripe";
import { afterEach, describe, expect, it } from "vitest";
import {
  FAKE_WEBHOOK_SECRET,
  monthlyPlan,
  startReceiver,
  startStripeWorld,
  subscribe,
  waitFor,
} from "./helpers/stripe-fake-world";

const cleanups: Array<() => Promise<void>> = [];
afterEach(async () => {
  for (const c of cleanups.splice(0)) await c();
});

async function world(statuses: number[] = [], retryBaseMs = 100) {
  const receiver = await startReceiver(statuses);
  const w = await startStripeWorld({ webhookUrl: receiver.url, retryBaseMs });
  cleanups.push(receiver.close, w.close);
  return { receiver, w };
}

describe("webhooks", () => {
  it("signs each event so stripe.webhooks.constructEvent verifies it", async () => {
    const { receiver, w } = await world();
    const customer = await w.stripe.customers.create({ email: "signed@example.test" });
    await w.fake.settled();
    const got = receiver.received.find((r) => r.type === "customer.created");
    expect(got).toBeDefined();
    if (!got) return;
    expect(got.signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    const event = w.stripe.webhooks.constructEvent(got.body, got.signature, FAKE_WEBHOOK_SECRET);
    expect(event.type).toBe("customer.created");
    expect(event.id).toMatch(/^evt_/);
    expect(event.api_version).toBe(Stripe.API_VERSION);
    expect((event.data.object as Stripe.Customer).id).toBe(customer.id);
    // Another secret, or a body changed in transit, must not verify.
    expect(() => w.stripe.webhooks.constructEvent(got.body, got.signature, "whsec_someone_else")).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
    expect(() =>
      w.stripe.webhooks.constructEvent(got.body.replace("signed@", "forged@"), got.signature, FAKE_WEBHOOK_SECRET),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);
  });

  it("retries after a 500 and a refused connection, then succeeds, with a fresh signature each time", async () => {
    const { receiver, w } = await world([500, 503]);
    await w.stripe.customers.create({ email: "retry@example.test" });
    await waitFor(() => receiver.received.length >= 3, 10_000, "three deliveries");
    const [a, b, c] = receiver.received;
    expect([a?.id, b?.id, c?.id]).toEqual([a?.id, a?.id, a?.id]);
    // Back-off doubles: 100 ms, then 200 ms (the stand-in's 1 s, 2 s … scaled down for the test).
    expect((b?.at ?? 0) - (a?.at ?? 0)).toBeGreaterThanOrEqual(90);
    expect((c?.at ?? 0) - (b?.at ?? 0)).toBeGreaterThanOrEqual(190);
    for (const r of receiver.received)
      expect(w.stripe.webhooks.constructEvent(r.body, r.signature, FAKE_WEBHOOK_SECRET).id).toBe(a?.id);
    await waitFor(() => w.fake.events()[0]?.delivery.status === "delivered", 5000, "delivered status");
    expect(w.fake.events()[0]?.delivery).toMatchObject({ status: "delivered", attempts: 3, last_status: 200 });

    // Nobody listening: a connection error counts as a failed attempt too.
    await receiver.close();
    await w.stripe.customers.create({ email: "nobody@example.test" });
    await waitFor(() => (w.fake.events()[1]?.delivery.attempts ?? 0) >= 2, 5000, "a retried connection error");
    expect(w.fake.events()[1]?.delivery.status).toBe("pending");
    expect(w.fake.events()[1]?.delivery.last_error).toMatch(/ECONNREFUSED|fetch failed/);
  });

  it("sends data.previous_attributes on updates and lists what it sent at /_fake/events", async () => {
    const { receiver, w } = await world();
    const price = await monthlyPlan(w.stripe);
    const { sub } = await subscribe(w, price.id);
    await w.stripe.subscriptions.update(sub?.id ?? "", { cancel_at_period_end: true });
    await w.fake.settled();
    const updated = receiver.received.filter((r) => r.type === "customer.subscription.updated").at(-1);
    const event = w.stripe.webhooks.constructEvent(updated?.body ?? "", updated?.signature ?? "", FAKE_WEBHOOK_SECRET);
    const object = event.data.object as Stripe.Subscription;
    expect(object.cancel_at_period_end).toBe(true);
    expect(object.cancel_at).toBe(object.items.data[0]?.current_period_end);
    expect(event.data.previous_attributes).toMatchObject({ cancel_at_period_end: false, cancel_at: null });
    const listed = (await (await fetch(`${w.fake.url}/_fake/events?type=customer.subscription.updated`)).json()) as {
      data: Array<{ id: string; delivery: { status: string } }>;
    };
    expect(listed.data[0]).toMatchObject({ id: event.id, delivery: { status: "delivered" } });
  });
});
