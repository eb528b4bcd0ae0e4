import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { notFound } from "@/lib/auth/errors";
import { catalogueCourse } from "@/lib/catalogue/catalogue";
import { json } from "@/lib/catalogue/respond";

export const dynamic = "force-dynamic";

/** One course of the catalogue, by id or slug; an unpublished one only for its teacher and admins. */
export const GET = guardRoute(
  { action: "catalogue:view", input: z.object({ courseId: z.string().min(1).max(200) }) },
  async (ctx, input) => {
    const course = await catalogueCourse(db(), ctx.user, input.courseId);
    if (!course) throw notFound("We couldn't find that course.");
    return json(course);
  },
);
