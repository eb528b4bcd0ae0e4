// What the admin tables' queries share (admin-payments.ts, admin-members.ts): their parameters,
// name-or-address search, whole-day ranges, ordering with the id as tie-breaker, offset pages and
// keyset batches for the CSV export.
import { asc, desc, gte, lt, sql, type SQL } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import { users } from "../schema";

export type Dir = "asc" | "desc";
/** Every table's filters and paging beside its own status and sort (parsed by lib/billing/admin/params.ts). */
export type ListParams = {
  plan?: string;
  from?: string;
  to?: string;
  q?: string;
  dir: Dir;
  page: number;
  pageSize: number;
};
/** A sort key: the expression, and the type its text form is cast back to for keyset comparisons. */
export type SortKey = { expr: SQL | AnyPgColumn; cast: "timestamptz" | "integer" | "text" };
/** Where the previous CSV batch stopped: the sort key's text and the row id. */
export type Cursor = { key: string; id: string };

// `q` is a fragment of a name or address typed by an admin: LIKE's wildcards in it are literal.
const contains = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** People whose name or address contains `q`, any case (served by the trigram indexes on users). */
export function nameOrEmail(q: string | undefined): SQL | undefined {
  if (!q) return undefined;
  const pattern = contains(q);
  return sql`(${users.name} ilike ${pattern} or ${users.email} ilike ${pattern})`;
}

/** [from, to] as whole UTC days, both inclusive. */
export function dayRange(col: AnyPgColumn, from?: string, to?: string): SQL[] {
  const out: SQL[] = [];
  if (from) out.push(gte(col, new Date(`${from}T00:00:00Z`)));
  if (to) out.push(lt(col, new Date(Date.parse(`${to}T00:00:00Z`) + 86_400_000)));
  return out;
}

export function ordering(key: SortKey, id: AnyPgColumn, dir: Dir): SQL[] {
  const by = dir === "asc" ? asc : desc;
  return [by(key.expr), by(id)];
}

/** Rows strictly after the cursor in the table's order (row comparison: the key, then the id). */
export function after(key: SortKey, id: AnyPgColumn, dir: Dir, c: Cursor | null): SQL | undefined {
  if (!c) return undefined;
  const cmp = dir === "asc" ? sql`>` : sql`<`;
  return sql`(${key.expr}, ${id}) ${cmp} (${c.key}::${sql.raw(key.cast)}, ${c.id}::uuid)`;
}

/** A page asked with one extra row: the rows to show (without the batches' cursor text), and whether another page follows. */
export function pageOf<R extends { cursorKey: string }>(rows: R[], pageSize: number) {
  const shown = rows.slice(0, pageSize).map(({ cursorKey: _cursor, ...row }) => row);
  return { rows: shown, hasMore: rows.length > pageSize };
}

export const offsetOf = (q: { page: number; pageSize: number }) => (q.page - 1) * q.pageSize;
export const countOf = sql<number>`count(*)::int`;
export const textOf = (key: SortKey) => sql<string>`(${key.expr})::text`;
