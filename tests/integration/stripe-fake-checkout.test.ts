// The hosted checkout page with Stripe's published test cards (Stripe docs: "Testing"): the form posted
// as a person would, the outcome of each card, and what exists afterwards.
import type Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  CARDS,
  monthlyPlan,
  payOnHostedPage,
  startStripeWorld,
  subscribe,
  type StripeWorld,
} from "./helpers/stripe-fake-world";

let world: StripeWorld;
let price: Stripe.Price;
beforeAll(async () => {
  world = await startStripeWorld({ startAt: new Date("2026-04-01T00:00:00Z") });
  price = await monthlyPlan(world.stripe);
});
afterAll(async () => world.close());

const typesFor = (customer: string) =>
  world.fake
    .events()
    .filter((e) => JSON.stringify(e.data.object).includes(customer))
    .map((e) => e.type);

describe("hosted checkout page", () => {
  it("shows the form with its labels and what is being paid", async () => {
    const session = await world.stripe.checkout.sessions.create({
      mode: "subscription",
      customer_email: "look@example.test",
      line_items: [{ price: price.id, quantity: 1 }],
      success_url: "http://app.test/ok",
    });
    const html = await (await fetch(session.url ?? "")).text();
    for (const label of ["Card number", "Expiry date (month / year)", "Security code (CVC)", "Name on card"])
      expect(html).toContain(`>${label}</label>`);
    expect(html).toContain(">Pay £18.00 now</button>");
    expect(html).toContain("Monthly membership: £18.00, then every month");
    expect(html).toContain("<h1>Local payment stand-in</h1>");
  });

  it("4242 4242 4242 4242 succeeds: redirect with the session id, subscription active, first invoice paid", async () => {
    const { customer, session, paid, sub } = await subscribe(world, price.id, CARDS.visa, "ok@example.test");
    expect(paid.status).toBe(303);
    expect(paid.location).toBe(`http://app.test/billing/done?session=${session.id}`);
    const done = await world.stripe.checkout.sessions.retrieve(session.id, { expand: ["invoice"] });
    expect(done).toMatchObject({
      status: "complete",
      payment_status: "paid",
      customer: customer.id,
      customer_details: { email: "ok@example.test", name: "Ffion Test" },
    });
    expect(sub?.status).toBe("active");
    expect(sub?.items.data[0]?.price.id).toBe(price.id);
    const invoice = done.invoice as Stripe.Invoice;
    expect(invoice).toMatchObject({
      status: "paid",
      amount_paid: 1800,
      billing_reason: "subscription_create",
      customer: customer.id,
    });
    expect(invoice.parent?.subscription_details?.subscription).toBe(sub?.id);
    const intent = String(invoice.payments?.data[0]?.payment.payment_intent);
    const pi = await world.stripe.paymentIntents.retrieve(intent, { expand: ["latest_charge"] });
    expect(pi.status).toBe("succeeded");
    expect((pi.latest_charge as Stripe.Charge).payment_method_details?.card?.last4).toBe("4242");
    expect(typesFor(customer.id)).toEqual([
      "customer.created",
      "customer.subscription.created",
      "invoice.paid",
      "checkout.session.completed",
    ]);
  });

  it("4000 0000 0000 0002 is declined, said in the page's own words, and creates no subscription", async () => {
    const { session, paid, sub } = await subscribe(world, price.id, CARDS.declined, "no@example.test");
    expect(paid.status).toBe(402);
    // Stripe docs: "Testing" — generic decline, card_declined / generic_decline.
    expect(paid.html).toContain(
      'role="alert" class="alert">That card was turned down by its bank. Try another card.</p>',
    );
    expect(sub).toBeNull();
    const again = await world.stripe.checkout.sessions.retrieve(session.id);
    expect(again.status).toBe("open");
    expect((await world.stripe.subscriptions.list({ customer: String(session.customer) })).data).toHaveLength(0);
    expect((await world.stripe.invoices.list({ customer: String(session.customer) })).data).toHaveLength(0);
    const failed = await world.stripe.charges.list({ customer: String(session.customer) });
    expect(failed.data.map((c) => [c.status, c.failure_code])).toEqual([["failed", "card_declined"]]);
  });

  it("4000 0000 0000 9995 is declined for insufficient funds", async () => {
    const { paid, sub } = await subscribe(world, price.id, CARDS.insufficientFunds, "poor@example.test");
    expect(paid.status).toBe(402);
    // Stripe docs: "Testing" — decline code insufficient_funds.
    expect(paid.html).toContain("That card does not have enough money on it for this payment.");
    expect(sub).toBeNull();
  });

  it("4000 0000 0000 0341 attaches but its charge fails, so a first payment is declined", async () => {
    const { paid, sub } = await subscribe(world, price.id, CARDS.chargeFails, "later@example.test");
    expect(paid.status).toBe(402);
    expect(paid.html).toContain("That card was turned down by its bank.");
    expect(sub).toBeNull();
  });

  it("refuses incomplete fields with a message beside each, keeping the session open", async () => {
    const session = await world.stripe.checkout.sessions.create({
      mode: "subscription",
      customer_email: "typo@example.test",
      line_items: [{ price: price.id, quantity: 1 }],
      success_url: "http://app.test/ok",
    });
    const bad = await payOnHostedPage(session.url ?? "", "4242 4242 4242 4241", {
      expiry: "13/30",
      cvc: "1",
      name: " ",
    });
    expect(bad.status).toBe(422);
    expect(bad.html).toContain('id="number-error">That card number has a typo somewhere');
    expect(bad.html).toContain('id="expiry-error">');
    expect(bad.html).toContain('id="cvc-error">The security code is 3 digits: on the back of the card.');
    expect(bad.html).toContain('id="name-error">');
    const past = await payOnHostedPage(session.url ?? "", CARDS.visa, { expiry: "01/26" });
    expect(past.html).toContain('id="expiry-error">That card has expired.');
    expect((await world.stripe.checkout.sessions.retrieve(session.id)).status).toBe("open");
  });

  it("a completed or expired session no longer takes a card", async () => {
    const { session } = await subscribe(world, price.id, CARDS.visa, "twice@example.test");
    const second = await payOnHostedPage(session.url ?? "", CARDS.visa);
    expect(second.status).toBe(200);
    expect(second.html).toContain("This payment has already gone through.");
    const other = await world.stripe.checkout.sessions.create({
      mode: "subscription",
      customer_email: "late@example.test",
      line_items: [{ price: price.id, quantity: 1 }],
      success_url: "http://app.test/ok",
    });
    await world.fake.advanceClock(25 * 3600); // Stripe docs: Checkout Sessions expire after 24 hours by default.
    expect((await world.stripe.checkout.sessions.retrieve(other.id)).status).toBe("expired");
    expect((await payOnHostedPage(other.url ?? "", CARDS.visa)).html).toContain("This payment page has timed out.");
  });
});
