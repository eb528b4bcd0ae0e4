import { z } from "zod";
import { db } from "@/db/client";
import { listAssignments } from "@/db/queries/teaching-assign";
import { guardRoute } from "@/lib/auth/guard";
import { createAssignment } from "@/lib/teaching/assignments";
import { assignmentCreateInput } from "@/lib/teaching/teach-schemas";
import { assignmentView } from "@/lib/teaching/teach-views";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** The signed-in teacher's assignments; an admin sees everyone's. */
export const GET = guardRoute({ action: "assignment:manage", input: z.object({}) }, async (ctx) => {
  const me = editorOf(ctx.user);
  const now = new Date();
  const rows = await listAssignments(db(), me.role === "admin" ? null : me.id);
  return Response.json({ assignments: rows.map((r) => assignmentView(r, now)) }, { headers: NO_STORE });
});

/** One tune to one or more students of the roster; each student gets an e-mail. */
export const POST = guardRoute({ action: "assignment:manage", input: assignmentCreateInput }, async (ctx, input) => {
  const created = await createAssignment(db(), editorOf(ctx.user), input, new Date());
  return Response.json(created, { status: 201, headers: NO_STORE });
});
