import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { unauthorized } from "@/lib/auth/errors";
import { myCourses } from "@/lib/catalogue/catalogue";
import { json } from "@/lib/catalogue/respond";

export const dynamic = "force-dynamic";

/** The courses the signed-in person is enrolled in (or teaches), with how far they have come. */
export const GET = guardRoute({ action: "ladder:view", input: z.object({}) }, async (ctx) => {
  if (!ctx.user) throw unauthorized();
  return json({ courses: await myCourses(db(), ctx.user) });
});
