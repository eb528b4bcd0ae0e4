import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { parseQuery, rawQuery } from "@/lib/billing/admin/params";
import { revenueReport } from "@/lib/billing/admin/revenue";

export const dynamic = "force-dynamic";

/** Revenue by month for the last twelve months (new, renewals, refunds as negatives), per currency. */
export const GET = guardRoute({ action: "money:view", input: rawQuery }, async (_ctx, raw) => {
  parseQuery(z.strictObject({}), raw);
  return Response.json(await revenueReport(db(), new Date()), { headers: { "cache-control": "no-store" } });
});
