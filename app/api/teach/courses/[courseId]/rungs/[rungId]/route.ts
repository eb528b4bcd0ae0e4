import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { editableCourse, patchRung, removeRung } from "@/lib/courses/bench";
import { rungPatch, rungRef } from "@/lib/courses/schemas";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** The required stage, or whether the rung is a taster. */
export const PATCH = guardRoute({ action: "course:edit", input: rungPatch }, async (ctx, input) => {
  const course = await editableCourse(db(), editorOf(ctx.user), input.courseId);
  await patchRung(db(), course, input.rungId, { requiredStage: input.requiredStage, isTaster: input.isTaster });
  return Response.json({ id: input.rungId }, { headers: NO_STORE });
});

export const DELETE = guardRoute({ action: "course:edit", input: rungRef }, async (ctx, input) => {
  const course = await editableCourse(db(), editorOf(ctx.user), input.courseId);
  await removeRung(db(), course, input.rungId);
  return new Response(null, { status: 204, headers: NO_STORE });
});
