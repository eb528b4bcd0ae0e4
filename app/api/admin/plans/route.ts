import { z } from "zod";
import { db } from "@/db/client";
import { listPlans } from "@/db/queries/billing";
import { guardRoute } from "@/lib/auth/guard";
import { createPlan, planInput, planJson } from "@/lib/billing/plans";
import { stripe } from "@/lib/billing/stripe";

export const dynamic = "force-dynamic";
const NO_STORE = { "cache-control": "no-store" };

/** Every plan, retired ones too (the admin's list). */
export const GET = guardRoute({ action: "plans:manage", input: z.object({}) }, async () => {
  const rows = await listPlans(db());
  return Response.json({ plans: rows.map(planJson) }, { headers: NO_STORE });
});

/** A new plan: a Stripe product and price first, then the row with their ids. */
export const POST = guardRoute({ action: "plans:manage", input: planInput }, async (_ctx, input) => {
  const row = await createPlan(db(), stripe(), input);
  return Response.json({ plan: planJson(row) }, { status: 201, headers: NO_STORE });
});
