import { db } from "@/db/client";
import { listPayments } from "@/db/queries/admin-money";
import { guardRoute } from "@/lib/auth/guard";
import { paymentsQuery, parseQuery, rawQuery } from "@/lib/billing/admin/params";

export const dynamic = "force-dynamic";

/** One page of the admin's payments table, sorted and filtered on the server. */
export const GET = guardRoute({ action: "money:view", input: rawQuery }, async (_ctx, raw) => {
  const q = parseQuery(paymentsQuery, raw);
  const { rows, total } = await listPayments(db(), q);
  return Response.json({ rows, total, page: q.page, pageSize: q.pageSize }, { headers: { "cache-control": "no-store" } });
});
