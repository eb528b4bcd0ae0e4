import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { json } from "@/lib/catalogue/respond";
import { tuneJson } from "@/lib/catalogue/tune";

export const dynamic = "force-dynamic";

/** A tune with its stages (locked ones listed with why) and phrase map; 403 with why when none is open. */
export const GET = guardRoute(
  { action: "tune:view", input: z.object({ tuneId: z.string().min(1).max(100) }) },
  async (ctx, input) => json(await tuneJson(db(), ctx.user, input.tuneId)),
);
