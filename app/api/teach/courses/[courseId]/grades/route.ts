import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { addGrade, editableCourse } from "@/lib/courses/bench";
import { gradeInput } from "@/lib/courses/schemas";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** A grade at the bottom of the course. */
export const POST = guardRoute({ action: "course:edit", input: gradeInput }, async (ctx, input) => {
  const course = await editableCourse(db(), editorOf(ctx.user), input.courseId);
  return Response.json({ id: await addGrade(db(), course, input.title) }, { status: 201, headers: NO_STORE });
});
