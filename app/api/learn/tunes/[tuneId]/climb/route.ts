import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { tuneClimb } from "@/lib/teaching/course-check-in";
import { personOf, privateJson } from "@/lib/teaching/learn-respond";

export const dynamic = "force-dynamic";

/** The member's stages of a course's tune and the one being worked on; `why` when they cannot check it in. */
export const GET = guardRoute(
  { action: "checkin:create", input: z.object({ tuneId: z.uuid("Unknown tune.") }) },
  async (ctx, input) => privateJson(await tuneClimb(db(), personOf(ctx), input.tuneId)),
);
