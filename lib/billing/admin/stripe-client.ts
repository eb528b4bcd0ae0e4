// The Stripe client the admin's refunds use until lib/billing/stripe.ts (helper "billing-app") lands;
// built the shared design's way: host/port/protocol from STRIPE_API_BASE (the local stand-in), the
// SDK's default apiVersion, two network retries.
import Stripe from "stripe";
import { env } from "@/lib/env";

let client: Stripe | undefined;

export function adminStripe(): Stripe {
  if (client) return client;
  const e = env();
  if (!e.STRIPE_SECRET_KEY) throw new Error("STRIPE_SECRET_KEY is not set: refunds need the Stripe API (or its local stand-in)");
  const base = e.STRIPE_API_BASE ? new URL(e.STRIPE_API_BASE) : null;
  client = new Stripe(e.STRIPE_SECRET_KEY, {
    maxNetworkRetries: 2,
    ...(base ? { host: base.hostname, port: base.port || (base.protocol === "https:" ? 443 : 80), protocol: base.protocol === "https:" ? "https" : "http" } : {}),
  });
  return client;
}
