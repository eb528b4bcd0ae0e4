import { z } from "zod";
import { db } from "@/db/client";
import { userZone } from "@/db/queries/learning";
import { guardRoute } from "@/lib/auth/guard";
import { personOf, privateJson } from "@/lib/teaching/learn-respond";
import { assignmentList } from "@/lib/teaching/today";

export const dynamic = "force-dynamic";

/** The signed-in person's active assignments, soonest due first (done ones included, marked by their stages). */
export const GET = guardRoute({ action: "assignment:view", input: z.object({}) }, async (ctx) => {
  const me = personOf(ctx);
  const assignments = await assignmentList(db(), me, await userZone(db(), me.id), new Date(), { open: false });
  return privateJson({ assignments });
});
