import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { personOf, privateJson } from "@/lib/teaching/learn-respond";
import { editPractice, removePractice } from "@/lib/teaching/practice";

export const dynamic = "force-dynamic";

const input = z.looseObject({ id: z.string().min(1).max(100) });

/** Changes one's own entry; someone else's answers 404. */
export const PATCH = guardRoute({ action: "practice:write", input }, async (ctx, raw) => {
  const { id, ...body } = raw;
  await editPractice(db(), personOf(ctx), id, body);
  return privateJson({ id });
});

export const DELETE = guardRoute(
  { action: "practice:write", input: z.object({ id: z.string().min(1).max(100) }) },
  async (ctx, input) => {
    await removePractice(db(), personOf(ctx), input.id);
    return new Response(null, { status: 204, headers: { "cache-control": "private, no-store" } });
  },
);
