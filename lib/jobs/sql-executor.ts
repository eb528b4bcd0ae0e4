import { sql, type SQL } from "drizzle-orm";
import type { PgDatabase } from "drizzle-orm/pg-core";
import type { PostgresJsQueryResultHKT } from "drizzle-orm/postgres-js";
import type PgBoss from "pg-boss";
import type * as schema from "@/db/schema";

/** The app's database handle or a transaction opened on it: both can enqueue mail and jobs. */
export type DbOrTx = PgDatabase<PostgresJsQueryResultHKT, typeof schema>;

/**
 * pg-boss writes its SQL for the `pg` driver ($1 placeholders, objects sent as JSON). Running that SQL
 * through drizzle lets a job be inserted in the caller's transaction, so the job exists exactly when
 * the outbox row it points at does.
 */
export function pgBossExecutor(db: DbOrTx): PgBoss.Db {
  return {
    async executeSql(text: string, values: unknown[] = []) {
      const rows = await db.execute(toDrizzleSql(text, values));
      return { rows: Array.from(rows) };
    },
  };
}

export function toDrizzleSql(text: string, values: unknown[]): SQL {
  const parts = text.split(/\$(\d+)/);
  const chunks: SQL[] = [];
  parts.forEach((part, i) => {
    // split() with a capture group alternates text and placeholder numbers.
    if (i % 2 === 0) chunks.push(sql.raw(part));
    else chunks.push(sql`${toPgValue(values[Number(part) - 1])}`);
  });
  return sql.join(chunks);
}

// drizzle's postgres-js driver passes json values through untouched, so objects are encoded here as `pg` would.
function toPgValue(value: unknown): unknown {
  if (value === undefined) return null;
  if (value === null || value instanceof Date || typeof value !== "object") return value;
  return JSON.stringify(value);
}
