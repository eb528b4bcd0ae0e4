import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { personOf, privateJson } from "@/lib/teaching/learn-respond";
import { addPractice, listPractice, practiceTunes } from "@/lib/teaching/practice";

export const dynamic = "force-dynamic";

/** One's own practice log, newest first, with the tunes one may log practice on. */
export const GET = guardRoute({ action: "practice:write", input: z.object({}) }, async (ctx) => {
  const me = personOf(ctx);
  const [entries, tunes] = await Promise.all([listPractice(db(), me), practiceTunes(db(), me)]);
  return privateJson({ entries, tunes });
});

// Fields are checked in lib/teaching/practice.ts so each wrong one is named (422).
export const POST = guardRoute({ action: "practice:write", input: z.looseObject({}) }, async (ctx, body) =>
  privateJson({ id: await addPractice(db(), personOf(ctx), body) }, 201),
);
