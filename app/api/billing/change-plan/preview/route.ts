import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { previewPlanChange } from "@/lib/billing/account";
import { stripe } from "@/lib/billing/stripe";

export const dynamic = "force-dynamic";

/** Stripe's proration for a change of plan, shown before the member confirms. */
export const POST = guardRoute(
  {
    action: "billing:manage",
    input: z.object({ planId: z.string({ error: "Choose a plan." }).min(1, "Choose a plan.") }),
  },
  async (ctx, input) => {
    const user = ctx.user;
    if (!user) throw new Error("guarded route without a user");
    return Response.json(await previewPlanChange(db(), stripe(), user.id, input.planId), {
      headers: { "cache-control": "no-store" },
    });
  },
);
