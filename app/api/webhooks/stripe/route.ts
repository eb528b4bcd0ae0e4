import { db } from "@/db/client";
import { HttpError } from "@/lib/auth/errors";
import { stripe, webhookSecret } from "@/lib/billing/stripe";
import { receiveWebhook } from "@/lib/billing/webhooks";

export const dynamic = "force-dynamic";

// Stripe calls this, not a person: no session and no same-origin rule apply; the signature over the
// raw body is the whole authorisation (Stripe docs: "Check the webhook signatures"). So it is the one
// route outside guardRoute, and the matrix rows show it answers 400 to anyone without a signature.
export async function POST(req: Request): Promise<Response> {
  const secret = webhookSecret();
  if (!secret)
    return Response.json(
      { error: "Webhooks are not set up here (STRIPE_WEBHOOK_SECRET is missing)." },
      { status: 400 },
    );
  const raw = await req.text();
  let client;
  try {
    client = stripe();
  } catch (e) {
    // No API key: the event cannot be handled now; a non-2xx answer makes Stripe deliver it again later.
    if (e instanceof HttpError) return Response.json({ error: e.message }, { status: e.status });
    throw e;
  }
  const outcome = await receiveWebhook(db(), client, raw, req.headers.get("stripe-signature"), secret);
  return Response.json(outcome.body, { status: outcome.status, headers: { "cache-control": "no-store" } });
}
