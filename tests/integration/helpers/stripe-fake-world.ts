// The Stripe stand-in in-process on a free port, the real SDK pointed at it, a local webhook receiver,
// and the hosted page driven by plain form posts.
import { createServer, type IncomingMessage } from "node:http";
import type { AddressInfo } from "node:net";
import Stripe from "stripe";
import { startStripeFake, type StripeFake } from "@/scripts/fakes/stripe/server";

export const FAKE_API_KEY = "sk_test_stripe_fake_tests";
export const FAKE_WEBHOOK_SECRET = "whsec_stripe_fake_tests_secret";

export interface StripeWorld {
  fake: StripeFake;
  stripe: Stripe;
  close: () => Promise<void>;
}

export function sdkFor(url: string, key = FAKE_API_KEY): Stripe {
  const u = new URL(url);
  // maxNetworkRetries 0: a test must see the stand-in's first answer.
  return new Stripe(key, { host: u.hostname, port: Number(u.port), protocol: "http", maxNetworkRetries: 0 });
}

export async function startStripeWorld(
  opts: { startAt?: Date; webhookUrl?: string; retryBaseMs?: number; stateFile?: string } = {},
): Promise<StripeWorld> {
  const fake = await startStripeFake({
    port: 0,
    apiKey: FAKE_API_KEY,
    webhookSecret: FAKE_WEBHOOK_SECRET,
    tickMs: 0,
    ...opts,
  });
  return { fake, stripe: sdkFor(fake.url), close: () => fake.close() };
}

export interface Received {
  body: string;
  signature: string;
  type: string;
  id: string;
  at: number;
}

/** A webhook endpoint that answers the given statuses in turn (then 200) and keeps what it got. */
export async function startReceiver(
  statuses: number[] = [],
): Promise<{ url: string; received: Received[]; close: () => Promise<void> }> {
  const received: Received[] = [];
  const queue = [...statuses];
  const read = (req: IncomingMessage) =>
    new Promise<string>((resolve) => {
      const chunks: Buffer[] = [];
      req.on("data", (c: Buffer) => chunks.push(c));
      req.on("end", () => resolve(Buffer.concat(chunks).toString("utf8")));
    });
  const server = createServer((req, res) => {
    void read(req).then((body) => {
      const event = JSON.parse(body) as { id: string; type: string };
      received.push({
        body,
        signature: String(req.headers["stripe-signature"] ?? ""),
        type: event.type,
        id: event.id,
        at: Date.now(),
      });
      res.writeHead(queue.shift() ?? 200).end();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}/webhook`,
    received,
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}

export const CARDS = {
  visa: "4242 4242 4242 4242",
  declined: "4000 0000 0000 0002",
  insufficientFunds: "4000 0000 0000 9995",
  chargeFails: "4000 0000 0000 0341",
} as const;

/** Posts the hosted page's form, as a person pressing "Pay" would. */
export async function payOnHostedPage(
  url: string,
  card: string,
  fields: Partial<Record<"expiry" | "cvc" | "name", string>> = {},
) {
  const res = await fetch(url, {
    method: "POST",
    body: new URLSearchParams({ number: card, expiry: "12 / 34", cvc: "123", name: "Ffion Test", ...fields }),
    redirect: "manual",
  });
  return { status: res.status, location: res.headers.get("location"), html: await res.text() };
}

export async function monthlyPlan(
  stripe: Stripe,
  amount = 1800,
  interval: "month" | "year" = "month",
  name = "Monthly membership",
) {
  const product = await stripe.products.create({ name });
  return stripe.prices.create({ product: product.id, currency: "gbp", unit_amount: amount, recurring: { interval } });
}

/** A customer subscribed through the hosted page with the given card; returns the subscription. */
export async function subscribe(
  world: StripeWorld,
  priceId: string,
  card: string = CARDS.visa,
  email = "fiddler@example.test",
) {
  const customer = await world.stripe.customers.create({ email, name: "Ffion Test" });
  const session = await world.stripe.checkout.sessions.create({
    mode: "subscription",
    customer: customer.id,
    line_items: [{ price: priceId, quantity: 1 }],
    success_url: "http://app.test/billing/done?session={CHECKOUT_SESSION_ID}",
    cancel_url: "http://app.test/plans",
  });
  const paid = await payOnHostedPage(session.url ?? "", card);
  const done = await world.stripe.checkout.sessions.retrieve(session.id);
  const sub = done.subscription ? await world.stripe.subscriptions.retrieve(String(done.subscription)) : null;
  return { customer, session, paid, sub };
}

/** Saves a new card through a setup-mode session (the app's "update card"). */
export async function updateCard(world: StripeWorld, customerId: string, subscriptionId: string, card: string) {
  const session = await world.stripe.checkout.sessions.create({
    mode: "setup",
    customer: customerId,
    currency: "gbp",
    setup_intent_data: { metadata: { subscription_id: subscriptionId } },
    success_url: "http://app.test/learn/billing?updated={CHECKOUT_SESSION_ID}",
  });
  return payOnHostedPage(session.url ?? "", card);
}

export const DAY = 86_400;

export async function waitFor(check: () => boolean, timeoutMs: number, what: string): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (!check()) {
    if (Date.now() > until) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
}
