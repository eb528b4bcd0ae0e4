import { z } from "zod";
import { db } from "@/db/client";
import { listCourses } from "@/db/queries/courses";
import { guardRoute } from "@/lib/auth/guard";
import type { CourseSummary } from "@/lib/courses/api-types";
import { createCourse } from "@/lib/courses/bench";
import { courseInput } from "@/lib/courses/schemas";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** The signed-in teacher's courses; an admin sees every teacher's. */
export const GET = guardRoute({ action: "course:edit", input: z.object({}) }, async (ctx) => {
  const me = editorOf(ctx.user);
  const rows = await listCourses(db(), me.role === "admin" ? null : me.id);
  const courses: CourseSummary[] = rows.map(({ publishedAt, updatedAt: _u, ...r }) => ({
    ...r,
    published: publishedAt !== null,
  }));
  return Response.json({ courses }, { headers: NO_STORE });
});

/** A new course starts unpublished, with no grades. */
export const POST = guardRoute({ action: "course:edit", input: courseInput }, async (ctx, input) => {
  const id = await createCourse(db(), editorOf(ctx.user), input);
  return Response.json({ id }, { status: 201, headers: NO_STORE });
});
