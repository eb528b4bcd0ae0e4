import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { courseView, editableCourse, patchCourse, removeCourse } from "@/lib/courses/bench";
import { courseId, coursePatch } from "@/lib/courses/schemas";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

export const GET = guardRoute({ action: "course:edit", input: courseId }, async (ctx, input) => {
  const course = await editableCourse(db(), editorOf(ctx.user), input.courseId);
  return Response.json(await courseView(db(), course), { headers: NO_STORE });
});

/** Title, summary, and publish / unpublish (publishing is refused while the rules are not met). */
export const PATCH = guardRoute({ action: "course:edit", input: coursePatch }, async (ctx, input) => {
  const course = await editableCourse(db(), editorOf(ctx.user), input.courseId);
  await patchCourse(db(), course, input);
  return Response.json(await courseView(db(), await editableCourse(db(), editorOf(ctx.user), course.id)), {
    headers: NO_STORE,
  });
});

export const DELETE = guardRoute({ action: "course:edit", input: courseId }, async (ctx, input) => {
  const course = await editableCourse(db(), editorOf(ctx.user), input.courseId);
  await removeCourse(db(), course);
  return new Response(null, { status: 204, headers: NO_STORE });
});
