import { db } from "@/db/client";
import { countAssignments, listAssignments } from "@/db/queries/teaching-assign";
import { guardRoute } from "@/lib/auth/guard";
import { createAssignment } from "@/lib/teaching/assignments";
import { ASSIGNMENTS_PAGE_SIZE, assignmentCreateInput, assignmentsPage } from "@/lib/teaching/teach-schemas";
import { assignmentView } from "@/lib/teaching/teach-views";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** The signed-in teacher's assignments, ASSIGNMENTS_PAGE_SIZE to a page (`?page=2`); an admin sees everyone's. */
export const GET = guardRoute({ action: "assignment:manage", input: assignmentsPage }, async (ctx, input) => {
  const me = editorOf(ctx.user);
  const now = new Date();
  const teacherId = me.role === "admin" ? null : me.id;
  const [rows, total] = await Promise.all([
    listAssignments(db(), teacherId, { page: input.page, pageSize: ASSIGNMENTS_PAGE_SIZE }),
    countAssignments(db(), teacherId),
  ]);
  const assignments = rows.map((r) => assignmentView(r, now));
  return Response.json(
    { assignments, total, page: input.page, pageSize: ASSIGNMENTS_PAGE_SIZE },
    { headers: NO_STORE },
  );
});

/** One tune to one or more students of the roster; each student gets an e-mail. */
export const POST = guardRoute({ action: "assignment:manage", input: assignmentCreateInput }, async (ctx, input) => {
  const created = await createAssignment(db(), editorOf(ctx.user), input, new Date());
  return Response.json(created, { status: 201, headers: NO_STORE });
});
