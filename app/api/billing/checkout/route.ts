import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { startCheckout } from "@/lib/billing/checkout";
import { stripe } from "@/lib/billing/stripe";

export const dynamic = "force-dynamic";

/** A Stripe Checkout session for the signed-in student; the browser goes to its hosted page. */
export const POST = guardRoute(
  {
    action: "billing:subscribe",
    input: z.object({
      planId: z.string({ error: "Choose a plan." }).min(1, "Choose a plan."),
      courseId: z.string().min(1).optional(),
    }),
  },
  async (ctx, input) => {
    const user = ctx.user;
    if (!user) throw new Error("guarded route without a user");
    const { url } = await startCheckout(db(), stripe(), user, input);
    return Response.json({ url }, { headers: { "cache-control": "no-store" } });
  },
);
