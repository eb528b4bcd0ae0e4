import { db } from "@/db/client";
import { listAssignments } from "@/db/queries/teaching-assign";
import { guardRoute } from "@/lib/auth/guard";
import { notFound } from "@/lib/auth/errors";
import { editAssignment, managedAssignment, withdrawAssignment } from "@/lib/teaching/assignments";
import { assignmentEditInput, assignmentId } from "@/lib/teaching/teach-schemas";
import { assignmentView } from "@/lib/teaching/teach-views";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

async function view(me: ReturnType<typeof editorOf>, id: string) {
  const a = await managedAssignment(db(), me, id);
  const [row] = await listAssignments(db(), null, { onlyId: a.id });
  if (!row) throw notFound("We couldn't find that assignment among yours.");
  return assignmentView(row, new Date());
}

export const GET = guardRoute({ action: "assignment:manage", input: assignmentId }, async (ctx, input) => {
  return Response.json(await view(editorOf(ctx.user), input.id), {
    headers: NO_STORE,
  });
});

/** Due date, note, stage plan (only before anyone checked in) and unlock rule. */
export const PATCH = guardRoute({ action: "assignment:manage", input: assignmentEditInput }, async (ctx, input) => {
  const me = editorOf(ctx.user);
  await editAssignment(db(), me, input, new Date());
  return Response.json(await view(me, input.id), { headers: NO_STORE });
});

/** Withdraws (the record stays; its stages stop changing). */
export const DELETE = guardRoute({ action: "assignment:manage", input: assignmentId }, async (ctx, input) => {
  const me = editorOf(ctx.user);
  await withdrawAssignment(db(), me, input.id, new Date());
  return Response.json(await view(me, input.id), { headers: NO_STORE });
});
