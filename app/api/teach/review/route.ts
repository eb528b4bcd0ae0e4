import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { reviewQueue } from "@/lib/teaching/review";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** The oldest check-ins waiting on the signed-in teacher's assignments (an admin: everyone's), and how many wait. */
export const GET = guardRoute({ action: "checkin:review", input: z.object({}) }, async (ctx) => {
  return Response.json(await reviewQueue(db(), editorOf(ctx.user)), { headers: NO_STORE });
});
