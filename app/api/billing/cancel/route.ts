import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { setCancelAtPeriodEnd } from "@/lib/billing/account";
import { stripe } from "@/lib/billing/stripe";

export const dynamic = "force-dynamic";

/** Cancel at the end of the paid period (Stripe: cancel_at_period_end); lessons stay open until then. */
export const POST = guardRoute({ action: "billing:manage", input: z.object({}) }, async (ctx) => {
  const user = ctx.user;
  if (!user) throw new Error("guarded route without a user");
  return Response.json(await setCancelAtPeriodEnd(db(), stripe(), user.id, true), {
    headers: { "cache-control": "no-store" },
  });
});
