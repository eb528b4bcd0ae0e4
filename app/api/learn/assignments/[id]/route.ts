import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { learnAssignment } from "@/lib/teaching/learn-assignment";
import { personOf, privateJson } from "@/lib/teaching/learn-respond";

export const dynamic = "force-dynamic";

/** One of the signed-in student's assignments with its stages; anyone else's answers 404. */
export const GET = guardRoute(
  { action: "assignment:view", input: z.object({ id: z.string().min(1).max(100) }) },
  async (ctx, input) => privateJson(await learnAssignment(db(), personOf(ctx), input.id)),
);
