import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { reviewCheckIn } from "@/lib/teaching/review";
import { reviewInput } from "@/lib/teaching/teach-schemas";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** Sign off (opens the next stage for that student only) or "needs more time", with feedback. */
export const POST = guardRoute({ action: "checkin:review", input: reviewInput }, async (ctx, input) => {
  const result = await reviewCheckIn(db(), editorOf(ctx.user), input, new Date());
  return Response.json(result, { headers: NO_STORE });
});
