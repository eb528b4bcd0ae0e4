// The project's own Stripe stand-in. There is no stripe-mock on npm (Stripe's stripe-mock is a Go
// binary, and it is stateless: it answers fixed examples, keeps no subscriptions, has no hosted page,
// clock or webhooks), so Rosinwood carries this one. The official `stripe` SDK reaches it through
// `new Stripe(key, { host: "127.0.0.1", port, protocol: "http" })`. It speaks the part of Stripe's API the
// app uses — customers, products, prices, checkout sessions, subscriptions, invoices (with previews),
// refunds — with Stripe's shapes, ids, list envelopes and errors; serves a hosted checkout page that
// takes Stripe's test cards; sends signed webhooks; and has a clock that can be moved forward so
// renewals, failed renewals and period ends happen on demand. See README.md beside this file.
//
// Run directly (scripts/lib.sh start_stripe_fake), it reads STRIPE_FAKE_PORT, STRIPE_FAKE_STATE,
// STRIPE_FAKE_WEBHOOK_URL, STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET.
import { existsSync } from "node:fs";
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import { pathToFileURL } from "node:url";
import { Clock } from "./clock";
import type { Fake } from "./context";
import { advance, fakeRoutes } from "./fake-routes";
import { catalogRoutes } from "./objects/catalog";
import { checkoutRoutes } from "./objects/checkout";
import { customerRoutes } from "./objects/customers";
import { runDue } from "./objects/lifecycle";
import { billingRoutes } from "./objects/billing-routes";
import { moneyRoutes } from "./objects/refunds";
import { createHandler, type Route } from "./router";
import { Store } from "./state";
import type { EventRecord } from "./types";
import { Webhooks } from "./webhooks";

export interface StripeFakeOptions {
  port: number;
  stateFile?: string;
  webhookUrl?: string;
  webhookSecret: string;
  apiKey: string;
  /** Sets the clock at start (ignored when a state file already holds one). */
  startAt?: Date;
  onEvent?: (event: EventRecord) => void;
  /** First webhook retry delay in ms (default 1000; doubles each time). */
  retryBaseMs?: number;
  /** How often the running clock's due work is checked (default 5000 ms; 0 turns it off). */
  tickMs?: number;
}

export interface StripeFake {
  url: string;
  close(): Promise<void>;
  /** Moves the clock and runs what became due; resolves once the resulting webhooks were attempted. */
  advanceClock(seconds: number): Promise<{ now: number; ran: number }>;
  now(): number;
  events(): EventRecord[];
  /** Resolves when no webhook delivery is due now. */
  settled(): Promise<void>;
}

export async function startStripeFake(opts: StripeFakeOptions): Promise<StripeFake> {
  const hadState = opts.stateFile !== undefined && existsSync(opts.stateFile);
  const store = new Store(opts.stateFile);
  const clock = new Clock(store);
  if (opts.startAt && !hadState) clock.setStart(opts.startAt);
  const hooks = new Webhooks(store, clock, {
    url: opts.webhookUrl,
    secret: opts.webhookSecret,
    retryBaseMs: opts.retryBaseMs,
    onEvent: opts.onEvent,
  });
  const fake: Fake = { store, clock, hooks, baseUrl: "" };
  const routes: Route[] = [
    ...customerRoutes(),
    ...catalogRoutes(),
    ...checkoutRoutes(),
    ...billingRoutes(),
    ...moneyRoutes(),
  ];
  const server = createServer(createHandler(fake, opts.apiKey, routes, fakeRoutes));
  server.keepAliveTimeout = 5000;
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port, "127.0.0.1", () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  fake.baseUrl = `http://127.0.0.1:${port}`;
  store.save();
  hooks.kick();
  const tickMs = opts.tickMs ?? 5000;
  const tick =
    tickMs > 0
      ? setInterval(() => {
          try {
            runDue(fake, clock.now());
          } catch (err) {
            // Bad imported data must not stop the stand-in; the log says what failed.
            console.error("Stripe stand-in: due work failed:", err);
          }
        }, tickMs)
      : null;
  tick?.unref();
  return {
    url: fake.baseUrl,
    async close() {
      if (tick) clearInterval(tick);
      hooks.stop();
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      store.save();
    },
    async advanceClock(seconds: number) {
      const out = advance(fake, seconds);
      await hooks.settled();
      return { now: Number(out.now), ran: Number(out.ran) };
    },
    now: () => clock.now(),
    events: () => store.events,
    settled: () => hooks.settled(),
  };
}

const isMain = process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href;
if (isMain) {
  const env = process.env;
  const fake = await startStripeFake({
    port: Number(env.STRIPE_FAKE_PORT ?? 4020),
    stateFile: env.STRIPE_FAKE_STATE || undefined,
    webhookUrl: env.STRIPE_FAKE_WEBHOOK_URL || undefined,
    webhookSecret: env.STRIPE_WEBHOOK_SECRET ?? "whsec_rosinwood_local_signing_secret",
    apiKey: env.STRIPE_SECRET_KEY ?? "sk_test_rosinwood_local",
  });
  console.log(`Stripe stand-in on ${fake.url} (webhooks to ${env.STRIPE_FAKE_WEBHOOK_URL || "nowhere"})`);
  const stop = () => void fake.close().then(() => process.exit(0));
  process.on("SIGTERM", stop);
  process.on("SIGINT", stop);
}
