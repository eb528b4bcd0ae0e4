import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { rosterTable } from "@/lib/teaching/roster";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** The roster with last practice day and open / overdue assignments per student. */
export const GET = guardRoute({ action: "roster:view", input: z.object({}) }, async (ctx) => {
  return Response.json({ students: await rosterTable(db(), editorOf(ctx.user), new Date()) }, { headers: NO_STORE });
});
