import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { json } from "@/lib/catalogue/respond";
import { stageJson } from "@/lib/catalogue/tune";

export const dynamic = "force-dynamic";

const input = z.object({ tuneId: z.string().min(1).max(100), index: z.coerce.number().int().min(1).max(99) });

/** One stage's ABC; a locked stage (or a stage of a locked rung) is refused with 403 and the reason. */
export const GET = guardRoute({ action: "tune:view", input }, async (ctx, v) =>
  json(await stageJson(db(), ctx.user, v.tuneId, v.index)),
);
