// POST /api/webhooks/stripe's work: verify the signature, store the event id once, and hand the event
// to its own small handler, all in one transaction (a handler's failure stores nothing, so Stripe's
// retry finds the event new). Unknown types are stored and answered 200 (Stripe docs: "Receive
// Stripe events in your webhook endpoint" — return 2xx quickly for events you do not handle).
import { eq } from "drizzle-orm";
import type { Tx as Db } from "@/db/queries/auth";
import { webhookEvents } from "@/db/schema";
import type { Stripe } from "../stripe";
import { chargeRefunded } from "./charge-refunded";
import { checkoutSessionCompleted } from "./checkout-session-completed";
import { subscriptionCreated } from "./customer-subscription-created";
import { subscriptionDeleted } from "./customer-subscription-deleted";
import { subscriptionUpdated } from "./customer-subscription-updated";
import { invoicePaid } from "./invoice-paid";
import { invoicePaymentFailed } from "./invoice-payment-failed";
import type { EventIn, Handler } from "./types";

export const HANDLERS: Record<string, Handler> = {
  "checkout.session.completed": checkoutSessionCompleted,
  "customer.subscription.created": subscriptionCreated,
  "customer.subscription.updated": subscriptionUpdated,
  "customer.subscription.deleted": subscriptionDeleted,
  "invoice.paid": invoicePaid,
  "invoice.payment_failed": invoicePaymentFailed,
  "charge.refunded": chargeRefunded,
};

export type WebhookOutcome = { status: 200 | 400; body: { received: boolean; duplicate?: boolean; error?: string } };

/** Verifies and applies one delivery. `raw` must be the body exactly as received (the signature covers its bytes). */
export async function receiveWebhook(
  db: Db,
  stripe: Stripe,
  raw: string,
  signature: string | null,
  secret: string,
): Promise<WebhookOutcome> {
  let event: EventIn;
  try {
    // Stripe docs: "Check the webhook signatures" — HMAC-SHA256 over "<t>.<payload>", with a timestamp tolerance.
    event = stripe.webhooks.constructEvent(raw, signature ?? "", secret) as EventIn;
  } catch (e) {
    return {
      status: 400,
      body: { received: false, error: `Webhook signature not valid: ${e instanceof Error ? e.message : String(e)}` },
    };
  }
  return applyEvent(db, stripe, event);
}

/** Stores and handles an already verified event (also used by tests that replay a recorded run). */
export async function applyEvent(db: Db, stripe: Stripe, event: EventIn): Promise<WebhookOutcome> {
  return db.transaction(async (tx) => {
    const [fresh] = await tx
      .insert(webhookEvents)
      .values({ id: event.id, type: event.type, payload: event })
      .onConflictDoNothing({ target: webhookEvents.id })
      .returning({ id: webhookEvents.id });
    if (!fresh) return { status: 200, body: { received: true, duplicate: true } };
    await HANDLERS[event.type]?.(tx, event, stripe);
    await tx.update(webhookEvents).set({ processedAt: new Date() }).where(eq(webhookEvents.id, event.id));
    return { status: 200, body: { received: true } };
  });
}
