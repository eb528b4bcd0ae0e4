import { z } from "zod";
import { db } from "@/db/client";
import { listTunes } from "@/db/queries/tunes";
import { guardRoute } from "@/lib/auth/guard";
import type { SavedBody, TuneSummary } from "@/lib/tunes/api-types";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE, problemsResponse } from "@/lib/tunes/respond";
import { createTune } from "@/lib/tunes/save";
import { tuneInput } from "@/lib/tunes/schemas";

export const dynamic = "force-dynamic";

/** The signed-in teacher's tunes; an admin sees every teacher's. */
export const GET = guardRoute({ action: "tune:edit", input: z.object({}) }, async (ctx) => {
  const me = editorOf(ctx.user);
  const rows = await listTunes(db(), me.role === "admin" ? null : me.id);
  const tunes: TuneSummary[] = rows.map((r) => ({ ...r, updatedAt: r.updatedAt.toISOString() }));
  return Response.json({ tunes }, { headers: NO_STORE });
});

/** A new tune, owned by whoever writes it. */
export const POST = guardRoute({ action: "tune:edit", input: tuneInput }, async (ctx, input) => {
  const me = editorOf(ctx.user);
  const saved = await createTune(db(), me.id, input);
  if (!saved.ok) return problemsResponse(saved.problems, saved.planReasons, saved.notes);
  const { ok: _ok, ...body } = saved;
  return Response.json(body satisfies SavedBody, { status: 201, headers: NO_STORE });
});
