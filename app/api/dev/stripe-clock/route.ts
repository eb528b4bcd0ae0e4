import { z } from "zod";
import { guardRoute } from "@/lib/auth/guard";
import { notFound } from "@/lib/auth/errors";
import { advanceStandIn } from "@/lib/billing/stand-in-clock";
import { env } from "@/lib/env";

export const dynamic = "force-dynamic";

// Present only while the local Stripe stand-in is configured (npm start, npm test). Admins only: moving the clock
// renews or fails every membership of the demo school at once. 0 days is allowed (it runs what is already due).
export const POST = guardRoute(
  {
    action: "area:admin",
    from: "form",
    input: z.object({
      days: z.coerce.number().int("Whole days only.").min(0, "0 or more days.").max(400, "At most 400 days at a time."),
    }),
  },
  async (_ctx, input) => {
    const fakeUrl = env().STRIPE_FAKE_URL;
    if (!fakeUrl) throw notFound();
    await advanceStandIn(fakeUrl, input.days * 86_400);
    return new Response(null, { status: 303, headers: { location: `/dev/stripe?moved=${input.days}` } });
  },
);
