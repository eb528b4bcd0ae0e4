import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { editableCourse, reorderLadder } from "@/lib/courses/bench";
import { orderInput } from "@/lib/courses/schemas";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** The whole ladder in its new order (after a drag or a Move up/down): every grade and every rung. */
export const PUT = guardRoute({ action: "course:edit", input: orderInput }, async (ctx, input) => {
  const course = await editableCourse(db(), editorOf(ctx.user), input.courseId);
  await reorderLadder(db(), course, { grades: input.grades });
  return Response.json({ ok: true }, { headers: NO_STORE });
});
