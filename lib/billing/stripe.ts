// The app's one Stripe client, built from the environment. STRIPE_API_BASE points the official SDK at
// the local stand-in (scripts/fakes/stripe/) through its host/port/protocol options; unset, it talks to
// Stripe itself. The API version is left as the SDK's own default (the one its types describe).
import Stripe from "stripe";
import { env } from "@/lib/env";
import { HttpError } from "@/lib/auth/errors";

export type { Stripe };

export interface StripeSettings {
  secretKey: string | undefined;
  apiBase?: string | undefined;
}

/** A client for the given key and address (tests pass the stand-in's). */
export function makeStripe({ secretKey, apiBase }: StripeSettings): Stripe {
  if (!secretKey) throw new HttpError(503, "Payments are not set up here yet (STRIPE_SECRET_KEY is missing).");
  const opts: ConstructorParameters<typeof Stripe>[1] = { maxNetworkRetries: 2 };
  if (apiBase) {
    const u = new URL(apiBase);
    opts.host = u.hostname;
    opts.port = u.port ? Number(u.port) : u.protocol === "https:" ? 443 : 80;
    opts.protocol = u.protocol === "http:" ? "http" : "https";
  }
  return new Stripe(secretKey, opts);
}

let cached: { key: string; client: Stripe } | undefined;

/** The app's client, one per process (rebuilt when tests change the environment's key or address). */
export function stripe(): Stripe {
  const e = env();
  // Read the live environment as well, so an integration test that starts a stand-in after env() was cached still reaches it.
  const secretKey = process.env.STRIPE_SECRET_KEY ?? e.STRIPE_SECRET_KEY;
  const apiBase = process.env.STRIPE_API_BASE ?? e.STRIPE_API_BASE;
  const key = `${secretKey}|${apiBase}`;
  if (!cached || cached.key !== key) cached = { key, client: makeStripe({ secretKey, apiBase }) };
  return cached.client;
}

/** The webhook signing secret (read live for the same reason). */
export function webhookSecret(): string | undefined {
  return process.env.STRIPE_WEBHOOK_SECRET ?? env().STRIPE_WEBHOOK_SECRET;
}
