import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { changePlan } from "@/lib/billing/account";
import { stripe } from "@/lib/billing/stripe";

export const dynamic = "force-dynamic";

/** The change the member saw previewed (same proration date, so the same charge). */
export const POST = guardRoute(
  {
    action: "billing:manage",
    input: z.object({
      planId: z.string({ error: "Choose a plan." }).min(1, "Choose a plan."),
      prorationDate: z
        .number({ error: "Preview the change first." })
        .int("Preview the change first.")
        .positive("Preview the change first."),
    }),
  },
  async (ctx, input) => {
    const user = ctx.user;
    if (!user) throw new Error("guarded route without a user");
    return Response.json(await changePlan(db(), stripe(), user.id, input.planId, input.prorationDate), {
      headers: { "cache-control": "no-store" },
    });
  },
);
