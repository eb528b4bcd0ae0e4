import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { notFound, unauthorized } from "@/lib/auth/errors";
import { ladderJson } from "@/lib/catalogue/catalogue";
import { json } from "@/lib/catalogue/respond";

export const dynamic = "force-dynamic";

/** A course's ladder for the signed-in person: each rung open, in progress, done or locked (and why). */
export const GET = guardRoute(
  { action: "ladder:view", input: z.object({ courseId: z.string().min(1).max(200) }) },
  async (ctx, input) => {
    if (!ctx.user) throw unauthorized();
    const ladder = await ladderJson(db(), ctx.user, input.courseId);
    if (!ladder) throw notFound("We couldn't find that course.");
    return json(ladder);
  },
);
