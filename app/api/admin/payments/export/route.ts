import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { paymentsCsv } from "@/lib/billing/admin/exports";
import { paymentsQuery, parseQuery, rawQuery } from "@/lib/billing/admin/params";

export const dynamic = "force-dynamic";

/** Every payment row matching the table's filters, in its order, as streamed CSV (RFC 4180). */
export const GET = guardRoute({ action: "money:view", input: rawQuery }, async (_ctx, raw) =>
  paymentsCsv(db(), parseQuery(paymentsQuery, raw)),
);
