// POST /api/webhooks/stripe's work: verify the signature, store the event once, and hand the event to
// its own small handler in the transaction that marks it applied. Every verified event is stored, so
// none is lost for inspection: one whose object is malformed is kept with the reason and answered 400;
// one whose handler failed is kept unapplied (500) and applied when Stripe delivers it again. Unknown
// types are stored and answered 200 (Stripe docs: "Receive Stripe events in your webhook endpoint" —
// return 2xx quickly for events you do not handle).
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { z } from "zod";
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
import { signedAt, storable, TOLERANCE_SECONDS } from "./payload";
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

const envelope = z.object({
  id: z.string().min(1).max(255),
  type: z.string().min(1).max(255),
  created: z.number().int(),
  data: z.object({ object: z.record(z.string(), z.unknown()) }),
});

const refused = (error: string): WebhookOutcome => ({ status: 400, body: { received: false, error } });
const issues = (e: z.ZodError) => e.issues.map((i) => `${i.path.join(".") || "(event)"}: ${i.message}`).join("; ");

/** Verifies and applies one delivery. `raw` must be the body exactly as received (the signature covers its bytes). */
export async function receiveWebhook(
  db: Db,
  stripe: Stripe,
  raw: string,
  signature: string | null,
  secret: string,
  now: number = Date.now(),
): Promise<WebhookOutcome> {
  let parsed: unknown;
  try {
    // Stripe docs: "Check the webhook signatures" — HMAC-SHA256 over "<t>.<payload>", with a timestamp tolerance.
    parsed = stripe.webhooks.constructEvent(raw, signature ?? "", secret, TOLERANCE_SECONDS);
  } catch (e) {
    if (e instanceof Error && e.name === "SyntaxError") return keepMalformed(db, raw, raw, "the body is not JSON");
    return refused(`Webhook signature not valid: ${e instanceof Error ? e.message : String(e)}`);
  }
  // The SDK refuses only old timestamps; one from beyond the tolerance ahead is no fresher a proof.
  const t = signedAt(signature);
  if (t === null || t > now / 1000 + TOLERANCE_SECONDS)
    return refused("Webhook signature not valid: its timestamp is in the future");
  const event = envelope.safeParse(parsed);
  if (!event.success) return keepMalformed(db, raw, parsed, `malformed event: ${issues(event.error)}`);
  return applyEvent(db, stripe, event.data);
}

/** A verified body that is no event: kept under an id made from its bytes, for someone to look at. */
async function keepMalformed(db: Db, raw: string, body: unknown, error: string): Promise<WebhookOutcome> {
  const id = `malformed:${createHash("sha256").update(raw).digest("hex").slice(0, 32)}`;
  await db
    .insert(webhookEvents)
    .values({ id, type: "malformed", payload: storable(body), error })
    .onConflictDoNothing({ target: webhookEvents.id });
  return refused(error);
}

/** Stores and handles an already verified event (also used by tests that replay a recorded run). */
export async function applyEvent(db: Db, stripe: Stripe, event: EventIn): Promise<WebhookOutcome> {
  const payload = storable(event);
  try {
    return await db.transaction(async (tx) => {
      const [fresh] = await tx
        .insert(webhookEvents)
        .values({ id: event.id, type: event.type, payload })
        .onConflictDoNothing({ target: webhookEvents.id })
        .returning({ id: webhookEvents.id });
      if (!fresh) {
        const [seen] = await tx
          .select({ processedAt: webhookEvents.processedAt })
          .from(webhookEvents)
          .where(eq(webhookEvents.id, event.id))
          .for("update");
        if (seen?.processedAt) return { status: 200, body: { received: true, duplicate: true } };
        // Stored before but never applied (its handler failed then): apply it now.
      }
      const handler = HANDLERS[event.type];
      if (handler) {
        try {
          // A savepoint: a malformed object undoes the handler's writes but keeps the stored event.
          await tx.transaction((sp) => handler(sp, payload as EventIn, stripe));
        } catch (e) {
          if (!(e instanceof z.ZodError)) throw e;
          const error = `malformed ${event.type} object: ${issues(e)}`;
          await tx.update(webhookEvents).set({ error }).where(eq(webhookEvents.id, event.id));
          return refused(error);
        }
      }
      await tx
        .update(webhookEvents)
        .set({ processedAt: new Date(), error: null })
        .where(eq(webhookEvents.id, event.id));
      return { status: 200, body: { received: true } };
    });
  } catch (e) {
    // Kept unapplied with the reason; Stripe delivers it again and it is applied then.
    const error = `not applied: ${e instanceof Error ? e.message : String(e)}`.slice(0, 2000);
    await db
      .insert(webhookEvents)
      .values({ id: event.id, type: event.type, payload, error })
      .onConflictDoUpdate({ target: webhookEvents.id, set: { error } })
      .catch((stored: unknown) => console.error(`[billing] event ${event.id} could not be stored either`, stored));
    throw e;
  }
}
