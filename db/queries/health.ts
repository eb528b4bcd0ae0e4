import { sql } from "drizzle-orm";
import { db, type Db } from "../client";

export async function databaseHealth(database: Db = db()): Promise<{ ok: boolean; latencyMs: number }> {
  const started = performance.now();
  try {
    // A short statement timeout so a hung database reports as down rather than hanging the probe.
    await database.transaction(async (tx) => {
      await tx.execute(sql`set local statement_timeout = 2000`);
      await tx.execute(sql`select 1`);
    });
    return { ok: true, latencyMs: Math.round(performance.now() - started) };
  } catch {
    return { ok: false, latencyMs: Math.round(performance.now() - started) };
  }
}
