// A throwaway database, the Stripe stand-in in-process (scripts/fakes/stripe/server.ts), and a tiny
// HTTP server that hands the stand-in's signed webhooks to the app's route handler — so a test walks
// the whole path: SDK → stand-in → hosted page → webhook → tables.
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { authWorld } from "./auth-world";
import { callRoute, type TeachCall } from "./teach-world";

const API_KEY = "sk_test_billing_world";
const WEBHOOK_SECRET = "whsec_billing_world_secret";

export async function billingWorld() {
  const w = await authWorld();
  process.env.STRIPE_SECRET_KEY = API_KEY;
  process.env.STRIPE_WEBHOOK_SECRET = WEBHOOK_SECRET;
  const route = (await import("@/app/api/webhooks/stripe/route")) as { POST: (r: Request) => Promise<Response> };
  let paused = false;
  const hook: Server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => {
      if (paused) {
        res.writeHead(503).end();
        return;
      }
      const headers = new Headers();
      for (const [k, v] of Object.entries(req.headers)) if (typeof v === "string") headers.set(k, v);
      route
        .POST(
          new Request("http://127.0.0.1/api/webhooks/stripe", {
            method: "POST",
            headers,
            body: Buffer.concat(chunks).toString("utf8"),
          }),
        )
        .then(async (r) => res.writeHead(r.status, { "content-type": "application/json" }).end(await r.text()))
        .catch((e: unknown) => {
          console.error(e);
          res.writeHead(500).end();
        });
    });
  });
  await new Promise<void>((resolve) => hook.listen(0, "127.0.0.1", resolve));
  const hookUrl = `http://127.0.0.1:${(hook.address() as AddressInfo).port}/`;
  const { startStripeFake } = await import("@/scripts/fakes/stripe/server");
  const fake = await startStripeFake({
    port: 0,
    webhookUrl: hookUrl,
    webhookSecret: WEBHOOK_SECRET,
    apiKey: API_KEY,
    retryBaseMs: 20,
    tickMs: 0,
  });
  process.env.STRIPE_API_BASE = fake.url;
  const { stripe } = await import("@/lib/billing/stripe");

  const call = (file: string, method: string, c: TeachCall = {}) => callRoute(file, method, c);
  const json = async <T>(res: Response): Promise<T> => (await res.json()) as T;

  /** A plan made through the admin route (Stripe product and price, then the row). */
  async function plan(
    adminCookie: string,
    body: Record<string, unknown>,
  ): Promise<{ id: string; stripePriceId: string }> {
    const res = await call("admin/plans", "POST", { cookie: adminCookie, body });
    if (res.status !== 201) throw new Error(`plan not made: ${res.status} ${await res.text()}`);
    return (await json<{ plan: { id: string; stripePriceId: string } }>(res)).plan;
  }

  /** Types a card into the hosted checkout page as a person would submit its form. */
  async function pay(url: string, card: string): Promise<Response> {
    const form = new URLSearchParams({ number: card, expiry: "12 / 34", cvc: "123", name: "Test Member" });
    return fetch(url, {
      method: "POST",
      body: form,
      redirect: "manual",
      headers: { "content-type": "application/x-www-form-urlencoded" },
    });
  }

  /** Checkout through the app's route, paid on the hosted page, webhooks delivered. */
  async function subscribe(
    cookie: string,
    planId: string,
    card = "4242424242424242",
    courseId?: string,
  ): Promise<Response> {
    const res = await call("billing/checkout", "POST", { cookie, body: { planId, ...(courseId ? { courseId } : {}) } });
    if (res.status !== 200) throw new Error(`checkout refused: ${res.status} ${await res.text()}`);
    const paid = await pay((await json<{ url: string }>(res)).url, card);
    await fake.settled();
    return paid;
  }

  async function close() {
    await fake.close();
    await new Promise<void>((resolve) => hook.close(() => resolve()));
    await w.close();
  }

  return {
    ...w,
    fake,
    stripe,
    call,
    json,
    plan,
    pay,
    subscribe,
    webhookSecret: WEBHOOK_SECRET,
    pauseWebhooks: (p: boolean) => {
      paused = p;
    },
    close,
  };
}
export type BillingWorld = Awaited<ReturnType<typeof billingWorld>>;
