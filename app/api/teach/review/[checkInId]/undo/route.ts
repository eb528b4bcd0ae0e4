import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { undoReview } from "@/lib/teaching/review";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** Takes back one's own "needs more time" within 10 minutes: the check-in waits for review again, its note unsent. */
export const POST = guardRoute(
  { action: "checkin:review", input: z.object({ checkInId: z.uuid("Unknown check-in.") }) },
  async (ctx, input) => {
    const result = await undoReview(db(), editorOf(ctx.user), input.checkInId, new Date());
    return Response.json(result, { headers: NO_STORE });
  },
);
