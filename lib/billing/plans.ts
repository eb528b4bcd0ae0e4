// Membership plans (issue 7 item 1), kept in step with Stripe: a plan is a Stripe product with one
// current price. Prices cannot be changed in Stripe (Stripe docs: "Change prices" — create a new
// price and archive the old one), so a new amount or interval is a new price for new members, while
// existing subscriptions keep theirs. A plan that any subscription or payment used is retired, never
// deleted. Stripe is asked first: when it refuses, nothing is written here; when the write here fails
// after Stripe said yes, what Stripe made is taken off sale again.
import { createHash, randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { z } from "zod";
import type { Tx as Db } from "@/db/queries/auth";
import { findPlan, planInUse, type PlanRow } from "@/db/queries/billing";
import { plans } from "@/db/schema";
import { conflict, notFound, unprocessable } from "@/lib/auth/errors";
import { CURRENCIES } from "./money";
import type { Stripe } from "./stripe";

const name = z
  .string({ error: "Give the plan a name." })
  .trim()
  .min(1, "Give the plan a name.")
  .max(80, "Keep the name under 80 characters.");
const amount = z
  .number({ error: "Give the price as a whole number of minor units (pence or cents), e.g. 1800 for £18.00." })
  .int("Give the price as a whole number of minor units (pence or cents), e.g. 1800 for £18.00.")
  .positive("The price must be above zero.")
  .max(99_999_999, "Stripe takes at most 99999999 minor units in one price.");
// ISO 4217 codes; the three the school sells in.
const currency = z
  .string({ error: "Choose a currency: GBP, EUR or USD." })
  .transform((c) => c.trim().toUpperCase())
  .pipe(z.enum(CURRENCIES, { error: "Choose a currency: GBP, EUR or USD (ISO 4217 codes)." }));
const interval = z.enum(["month", "year"], { error: "The interval is month or year." });
const opens = z
  .string()
  .trim()
  .min(1, "Say what the plan opens.")
  .max(300, "Keep “what it opens” under 300 characters.");

export const planInput = z.object({ name, amount, currency, interval, opens: opens.default("The whole catalogue") });
export const planPatch = z.object({
  name: name.optional(),
  opens: opens.optional(),
  amount: amount.optional(),
  currency: currency.optional(),
  interval: interval.optional(),
});
export type PlanInput = z.output<typeof planInput>;
export type PlanPatch = z.output<typeof planPatch>;

/** Stripe's error in words for a 422 (its message names the parameter at fault). */
function stripeRefusal(e: unknown): never {
  if (e && typeof e === "object" && "type" in e && "message" in e && typeof e.message === "string") {
    const param = "param" in e && typeof e.param === "string" ? e.param : "form";
    throw unprocessable(`Stripe refused the plan: ${e.message}`, {
      [param === "unit_amount" ? "amount" : param]: e.message,
    });
  }
  throw e;
}

async function newPrice(
  stripe: Stripe,
  productId: string,
  p: { amount: number; currency: string; interval: "month" | "year" },
  idempotencyKey: string,
) {
  return stripe.prices.create(
    {
      product: productId,
      unit_amount: p.amount,
      currency: p.currency.toLowerCase(),
      recurring: { interval: p.interval },
    },
    { idempotencyKey },
  );
}

/** Takes what Stripe made for a plan off sale again, when the plan itself could not be saved here. */
async function undoInStripe(stripe: Stripe, productId: string, priceId?: string): Promise<void> {
  try {
    if (priceId) await stripe.prices.update(priceId, { active: false });
    await stripe.products.update(productId, { active: false });
  } catch (e) {
    // Left for the admin to see in Stripe: an inactive plan's product, named in the log.
    console.error(`[billing] product ${productId} (price ${priceId ?? "none"}) could not be taken off sale`, e);
  }
}

/**
 * A Stripe product and price, then the row. The input is validated before any Stripe call (the
 * route's schema and the guard's text rule); when the row cannot be written after Stripe made them,
 * they are taken off sale again, so no product is left on sale without its plan. The keys come from
 * the new plan's own id (Stripe docs: "Idempotent requests"), so the SDK's retries make one of each.
 */
export async function createPlan(db: Db, stripe: Stripe, input: PlanInput): Promise<PlanRow> {
  const id = randomUUID();
  let product: Stripe.Product | undefined;
  let price: Stripe.Price;
  try {
    product = await stripe.products.create(
      { name: input.name, description: input.opens, metadata: { plan_id: id } },
      { idempotencyKey: `plan:${id}:product` },
    );
    price = await newPrice(stripe, product.id, input, `plan:${id}:price`);
  } catch (e) {
    if (product) await undoInStripe(stripe, product.id);
    stripeRefusal(e);
  }
  try {
    const [row] = await db
      .insert(plans)
      .values({ id, ...input, stripeProductId: product.id, stripePriceId: price.id })
      .returning();
    return row;
  } catch (e) {
    await undoInStripe(stripe, product.id, price.id);
    throw e;
  }
}

export async function updatePlan(db: Db, stripe: Stripe, id: string, patch: PlanPatch): Promise<PlanRow> {
  const plan = await findPlan(db, id);
  if (!plan) throw notFound("We couldn't find that plan.");
  const next = {
    name: patch.name ?? plan.name,
    opens: patch.opens ?? plan.opens,
    amount: patch.amount ?? plan.amount,
    currency: patch.currency ?? plan.currency,
    interval: patch.interval ?? plan.interval,
  };
  const priceChanged =
    next.amount !== plan.amount || next.currency !== plan.currency || next.interval !== plan.interval;
  if (priceChanged && plan.retiredAt) throw conflict("A retired plan keeps its price.");
  let stripePriceId = plan.stripePriceId;
  try {
    if (plan.stripeProductId && (next.name !== plan.name || next.opens !== plan.opens)) {
      await stripe.products.update(plan.stripeProductId, { name: next.name, description: next.opens });
    }
    if (priceChanged && plan.stripeProductId) {
      const key = createHash("sha256")
        .update(JSON.stringify([id, plan.stripePriceId, next]))
        .digest("hex");
      stripePriceId = (await newPrice(stripe, plan.stripeProductId, next, `plan-price:${key}`)).id;
      if (plan.stripePriceId) await stripe.prices.update(plan.stripePriceId, { active: false });
    }
  } catch (e) {
    stripeRefusal(e);
  }
  try {
    const [row] = await db
      .update(plans)
      .set({ ...next, stripePriceId })
      .where(eq(plans.id, id))
      .returning();
    return row;
  } catch (e) {
    // Stripe goes back to what the row still says: the old name, the old price on sale, the new one off.
    if (plan.stripeProductId && (next.name !== plan.name || next.opens !== plan.opens))
      await stripe.products.update(plan.stripeProductId, { name: plan.name, description: plan.opens }).catch(() => {});
    if (stripePriceId && stripePriceId !== plan.stripePriceId) {
      await stripe.prices.update(stripePriceId, { active: false }).catch(() => {});
      if (plan.stripePriceId) await stripe.prices.update(plan.stripePriceId, { active: true }).catch(() => {});
    }
    throw e;
  }
}

/** New members can no longer choose it; existing members keep it. */
export async function retirePlan(db: Db, stripe: Stripe, id: string): Promise<PlanRow> {
  const plan = await findPlan(db, id);
  if (!plan) throw notFound("We couldn't find that plan.");
  if (plan.retiredAt) return plan;
  if (plan.stripePriceId) await stripe.prices.update(plan.stripePriceId, { active: false });
  const [row] = await db.update(plans).set({ retiredAt: new Date() }).where(eq(plans.id, id)).returning();
  return row;
}

/** Only a plan nobody ever used; one in use answers 409. */
export async function deletePlan(db: Db, stripe: Stripe, id: string): Promise<void> {
  const plan = await findPlan(db, id);
  if (!plan) throw notFound("We couldn't find that plan.");
  if (await planInUse(db, id)) throw conflict(`“${plan.name}” is in use by a membership: retire it instead.`);
  // Stripe keeps products that had prices; deactivating them is Stripe's way of removing one from sale.
  if (plan.stripePriceId) await stripe.prices.update(plan.stripePriceId, { active: false });
  if (plan.stripeProductId) await stripe.products.update(plan.stripeProductId, { active: false });
  await db.delete(plans).where(eq(plans.id, id));
}

export type PlanJson = Omit<PlanRow, "retiredAt" | "createdAt"> & { retiredAt: string | null; createdAt: string };
export const planJson = (p: PlanRow): PlanJson => ({
  ...p,
  retiredAt: p.retiredAt?.toISOString() ?? null,
  createdAt: p.createdAt.toISOString(),
});
