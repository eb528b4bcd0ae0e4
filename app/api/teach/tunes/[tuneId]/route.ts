import { db } from "@/db/client";
import { coursesUsingTune, deleteTune } from "@/db/queries/tunes";
import { conflict } from "@/lib/auth/errors";
import { guardRoute } from "@/lib/auth/guard";
import type { SavedBody } from "@/lib/tunes/api-types";
import { editableTune, editorOf } from "@/lib/tunes/access";
import { NO_STORE, problemsResponse } from "@/lib/tunes/respond";
import { saveTune } from "@/lib/tunes/save";
import { tuneId, tuneInput } from "@/lib/tunes/schemas";
import { tuneView } from "@/lib/tunes/view";

export const dynamic = "force-dynamic";

export const GET = guardRoute({ action: "tune:edit", input: tuneId }, async (ctx, input) => {
  const tune = await editableTune(db(), editorOf(ctx.user), input.tuneId);
  return Response.json(await tuneView(db(), tune), { headers: NO_STORE });
});

/** The whole tune again: source, plan and accepted swaps; the stages follow. */
export const PUT = guardRoute({ action: "tune:edit", input: tuneInput.extend(tuneId.shape) }, async (ctx, input) => {
  const tune = await editableTune(db(), editorOf(ctx.user), input.tuneId);
  const saved = await saveTune(db(), tune, input);
  if (!saved.ok) return problemsResponse(saved.problems, saved.planReasons, saved.notes);
  const { ok: _ok, ...body } = saved;
  return Response.json(body satisfies SavedBody, { headers: NO_STORE });
});

/** Only a tune no ladder uses; assignments keep theirs too (the foreign key refuses). */
export const DELETE = guardRoute({ action: "tune:edit", input: tuneId }, async (ctx, input) => {
  const tune = await editableTune(db(), editorOf(ctx.user), input.tuneId);
  const used = await coursesUsingTune(db(), tune.id);
  if (used.length)
    throw conflict(
      `“${tune.title}” is on the ladder of ${used.map((c) => `“${c.title}”`).join(", ")}; take it off there first.`,
    );
  try {
    await deleteTune(db(), tune.id);
  } catch (e) {
    if (isForeignKeyViolation(e)) throw conflict(`“${tune.title}” is assigned to students, so it stays.`);
    throw e;
  }
  return new Response(null, { status: 204, headers: NO_STORE });
});

/** PostgreSQL's foreign_key_violation (SQLSTATE 23503), whether or not drizzle wrapped the error. */
function isForeignKeyViolation(e: unknown): boolean {
  for (let err: unknown = e; err instanceof Error; err = err.cause)
    if (Reflect.get(err, "code") === "23503") return true;
  return false;
}
