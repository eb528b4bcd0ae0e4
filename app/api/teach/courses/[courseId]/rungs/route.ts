import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { addRung, editableCourse } from "@/lib/courses/bench";
import { rungInput } from "@/lib/courses/schemas";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** One of your tunes at the bottom of a grade, with the stage that opens the next rung. */
export const POST = guardRoute({ action: "course:edit", input: rungInput }, async (ctx, input) => {
  const me = editorOf(ctx.user);
  const course = await editableCourse(db(), me, input.courseId);
  const id = await addRung(db(), me, course, input);
  return Response.json({ id }, { status: 201, headers: NO_STORE });
});
