import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { selfCheckInList } from "@/lib/teaching/self-paced";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** The last month's check-ins on self-paced courses of the teacher's members (they opened the next stage themselves). */
export const GET = guardRoute({ action: "checkin:review", input: z.object({}) }, async (ctx) =>
  Response.json({ checkIns: await selfCheckInList(db(), editorOf(ctx.user), new Date()) }, { headers: NO_STORE }),
);
