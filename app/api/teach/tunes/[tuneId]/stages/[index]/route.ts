import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { editableTune, editorOf } from "@/lib/tunes/access";
import { NO_STORE, problemsResponse } from "@/lib/tunes/respond";
import { stageEditInput, stageRef } from "@/lib/tunes/schemas";
import { editStage, rebuildStage } from "@/lib/tunes/stages";

export const dynamic = "force-dynamic";

/** A stage written by hand: kept as written, flagged later if the tune's source changes. */
export const PUT = guardRoute({ action: "tune:edit", input: stageEditInput }, async (ctx, input) => {
  const tune = await editableTune(db(), editorOf(ctx.user), input.tuneId);
  const outcome = await editStage(db(), tune, input.index, input.abc);
  if (!outcome.ok) return problemsResponse(outcome.problems);
  return Response.json({ index: input.index, handEdited: true }, { headers: NO_STORE });
});

/** Rebuild from source: the hand edit is dropped and the engine's stage comes back. */
export const DELETE = guardRoute({ action: "tune:edit", input: stageRef }, async (ctx, input) => {
  const tune = await editableTune(db(), editorOf(ctx.user), input.tuneId);
  await rebuildStage(db(), tune, input.index);
  return Response.json({ index: input.index, handEdited: false }, { headers: NO_STORE });
});
