import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { newMembersOf } from "@/lib/courses/members";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** Members who came to the signed-in teacher this week (an admin: everyone's), with whether each was welcomed. */
export const GET = guardRoute({ action: "roster:view", input: z.object({}) }, async (ctx) =>
  Response.json({ members: await newMembersOf(db(), editorOf(ctx.user), new Date()) }, { headers: NO_STORE }),
);
