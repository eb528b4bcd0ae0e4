// SQL pieces the admin money tables share (db/queries/admin-payments.ts, admin-members.ts): name-or-address search,
// whole-day ranges, ordering with the id as tie-breaker, and keyset conditions for the CSV batches.
import { asc, desc, gte, lt, sql, type Placeholder, type SQL } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import { users } from "@/db/schema";

export type Dir = "asc" | "desc";
/** A sort key: the expression, and the type its text form is cast back to for keyset comparisons. */
export type SortKey = { expr: SQL | AnyPgColumn; cast: "timestamptz" | "integer" | "text" };
/** Where the previous CSV batch stopped: the sort key's text and the row id. */
export type Cursor = { key: string; id: string };

// `q` is a fragment of a name or address typed by an admin: LIKE's wildcards in it are literal.
export const contains = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** A person whose name or address is like `pattern` (a value, or a placeholder filled on execution). */
export const nameOrEmailLike = (pattern: string | Placeholder) =>
  sql`(${users.name} ilike ${pattern} or ${users.email} ilike ${pattern})`;

export function nameOrEmail(q: string | undefined): SQL | undefined {
  return q ? nameOrEmailLike(contains(q)) : undefined;
}

/** [from, to] as whole UTC days, both inclusive: the first instant of `from`, the first after `to`. */
export function dayBounds(from?: string, to?: string): { from?: Date; to?: Date } {
  return {
    from: from ? new Date(`${from}T00:00:00Z`) : undefined,
    to: to ? new Date(Date.parse(`${to}T00:00:00Z`) + 86_400_000) : undefined,
  };
}

export function dayRange(col: AnyPgColumn, from?: string, to?: string): SQL[] {
  const b = dayBounds(from, to);
  return [b.from && gte(col, b.from), b.to && lt(col, b.to)].filter((c): c is SQL => c !== undefined);
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

/** A page asked with one extra row: the rows to show, and whether another page follows. */
export function pageOf<R>(rows: R[], pageSize: number): { rows: R[]; hasMore: boolean } {
  return { rows: rows.slice(0, pageSize), hasMore: rows.length > pageSize };
}

export const offsetOf = (q: { page: number; pageSize: number }) => (q.page - 1) * q.pageSize;
export const countOf = sql<number>`count(*)::int`;
export const textOf = (key: SortKey) => sql<string>`(${key.expr})::text`;
