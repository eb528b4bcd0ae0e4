import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { unauthorized } from "@/lib/auth/errors";
import { myCourses, suggestedCourses } from "@/lib/catalogue/catalogue";
import { json } from "@/lib/catalogue/respond";

export const dynamic = "force-dynamic";

/** The courses the signed-in person is enrolled in (or teaches), with how far they have come, and ones to start next. */
export const GET = guardRoute({ action: "ladder:view", input: z.object({}) }, async (ctx) => {
  if (!ctx.user) throw unauthorized();
  const [courses, suggestions] = await Promise.all([myCourses(db(), ctx.user), suggestedCourses(db(), ctx.user)]);
  return json({ courses, suggestions });
});
