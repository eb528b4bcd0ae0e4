import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { commentInput, commentOnCheckIn } from "@/lib/teaching/self-paced";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** The teacher's word on a check-in that opened the next stage by itself; e-mailed to the student once. */
export const POST = guardRoute({ action: "checkin:review", input: commentInput }, async (ctx, input) => {
  const done = await commentOnCheckIn(db(), editorOf(ctx.user), input.checkInId, input.comment, new Date());
  return Response.json(done, { status: 201, headers: NO_STORE });
});
