import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { unauthorized } from "@/lib/auth/errors";
import { changeNote, removeNote } from "@/lib/catalogue/notes";
import { json } from "@/lib/catalogue/respond";
import { noteInput } from "@/lib/catalogue/schemas";

export const dynamic = "force-dynamic";

const ids = z.object({ tuneId: z.string().min(1).max(100), noteId: z.string().min(1).max(100) });
const patch = ids
  .extend(noteInput.partial().shape)
  .refine((v) => v.bar !== undefined || v.body !== undefined, { message: "Nothing to change." });

/** Change one of your own notes; anyone else's note id answers 404. */
export const PATCH = guardRoute({ action: "notes:write", input: patch }, async (ctx, v) => {
  if (!ctx.user) throw unauthorized();
  return json(await changeNote(db(), ctx.user, v.tuneId, v.noteId, { bar: v.bar, body: v.body }));
});

export const DELETE = guardRoute({ action: "notes:write", input: ids }, async (ctx, v) => {
  if (!ctx.user) throw unauthorized();
  await removeNote(db(), ctx.user, v.tuneId, v.noteId);
  return new Response(null, { status: 204, headers: { "cache-control": "no-store" } });
});
