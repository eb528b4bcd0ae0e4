import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { editableCourse, removeGrade, renameGrade } from "@/lib/courses/bench";
import { gradePatch, gradeRef } from "@/lib/courses/schemas";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

export const PATCH = guardRoute({ action: "course:edit", input: gradePatch }, async (ctx, input) => {
  const course = await editableCourse(db(), editorOf(ctx.user), input.courseId);
  await renameGrade(db(), course, input.gradeId, input.title);
  return Response.json({ id: input.gradeId }, { headers: NO_STORE });
});

/** The grade and its rungs; refused when it would leave a published course without a rung. */
export const DELETE = guardRoute({ action: "course:edit", input: gradeRef }, async (ctx, input) => {
  const course = await editableCourse(db(), editorOf(ctx.user), input.courseId);
  await removeGrade(db(), course, input.gradeId);
  return new Response(null, { status: 204, headers: NO_STORE });
});
