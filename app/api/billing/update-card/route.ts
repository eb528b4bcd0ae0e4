import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { updateCardSession } from "@/lib/billing/account";
import { stripe } from "@/lib/billing/stripe";

export const dynamic = "force-dynamic";

/** A Stripe-hosted page (checkout in setup mode) to save a new card. */
export const POST = guardRoute({ action: "billing:manage", input: z.object({}) }, async (ctx) => {
  const user = ctx.user;
  if (!user) throw new Error("guarded route without a user");
  return Response.json(await updateCardSession(db(), stripe(), user.id), { headers: { "cache-control": "no-store" } });
});
