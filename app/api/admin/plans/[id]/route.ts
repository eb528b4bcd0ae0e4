import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { deletePlan, planJson, planPatch, retirePlan, updatePlan } from "@/lib/billing/plans";
import { stripe } from "@/lib/billing/stripe";

export const dynamic = "force-dynamic";
const NO_STORE = { "cache-control": "no-store" };
const id = z.object({ id: z.string() });

/** Rename, reword what it opens, or set a new price (a new Stripe price, for new members). */
export const PATCH = guardRoute(
  { action: "plans:manage", input: planPatch.extend(id.shape) },
  async (_ctx, { id: planId, ...patch }) => {
    const row = await updatePlan(db(), stripe(), planId, patch);
    return Response.json({ plan: planJson(row) }, { headers: NO_STORE });
  },
);

/** Deletes a plan nobody used; 409 for one in use ("retire it instead"). */
export const DELETE = guardRoute({ action: "plans:manage", input: id }, async (_ctx, input) => {
  await deletePlan(db(), stripe(), input.id);
  return new Response(null, { status: 204, headers: NO_STORE });
});

/** { action: "retire" }: closes the plan to new members; existing members keep it. */
export const POST = guardRoute(
  {
    action: "plans:manage",
    input: id.extend({ action: z.literal("retire", { error: "The only action is “retire”." }) }),
  },
  async (_ctx, input) => {
    const row = await retirePlan(db(), stripe(), input.id);
    return Response.json({ plan: planJson(row) }, { headers: NO_STORE });
  },
);
