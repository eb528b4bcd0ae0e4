import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { unauthorized } from "@/lib/auth/errors";
import { addNote, notesOn } from "@/lib/catalogue/notes";
import { json } from "@/lib/catalogue/respond";
import { noteInput } from "@/lib/catalogue/schemas";

export const dynamic = "force-dynamic";

const tune = z.object({ tuneId: z.string().min(1).max(100) });

/** The signed-in person's own margin notes on a tune (nobody else's, ever). */
export const GET = guardRoute({ action: "notes:write", input: tune }, async (ctx, v) => {
  if (!ctx.user) throw unauthorized();
  return json({ notes: await notesOn(db(), ctx.user, v.tuneId) });
});

export const POST = guardRoute({ action: "notes:write", input: tune.extend(noteInput.shape) }, async (ctx, v) => {
  if (!ctx.user) throw unauthorized();
  return json(await addNote(db(), ctx.user, v.tuneId, { bar: v.bar, body: v.body }), 201);
});
