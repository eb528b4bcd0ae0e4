// The admin money tables' route handlers, one pair per table: a page (its rows and
// whether another follows) and, apart, the exact number of rows the filters match. The table asks
// for the count once per set of filters and keeps it while the admin pages or re-sorts, so paging
// never waits for a count over every match.
import type { z } from "zod";
import { db, type Db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { parseQuery, rawQuery, type ListQuery } from "./params";

const noStore = { headers: { "cache-control": "no-store" } };

export function pageRoute<S extends z.ZodType<ListQuery>, R>(
  schema: S,
  list: (db: Db, q: z.output<S>) => Promise<{ rows: R[]; hasMore: boolean }>,
) {
  return guardRoute({ action: "money:view", input: rawQuery }, async (_ctx, raw) => {
    const q = parseQuery(schema, raw);
    const { rows, hasMore } = await list(db(), q);
    return Response.json({ rows, hasMore, page: q.page, pageSize: q.pageSize }, noStore);
  });
}

/** The same parameters as the page (page, size and order are accepted and play no part). */
export function countRoute<S extends z.ZodType<ListQuery>>(
  schema: S,
  count: (db: Db, q: z.output<S>) => Promise<number>,
) {
  return guardRoute({ action: "money:view", input: rawQuery }, async (_ctx, raw) => {
    const total = await count(db(), parseQuery(schema, raw));
    return Response.json({ total }, noStore);
  });
}
