import { drizzle, type PostgresJsDatabase } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import * as schema from "./schema";

export type Db = PostgresJsDatabase<typeof schema>;

// One pool per process, created on first use so that `next build` never needs a database.
let client: postgres.Sql | undefined;
let instance: Db | undefined;

export function db(): Db {
  if (!instance) {
    // Checked with the other settings at start-up (lib/env.ts, instrumentation.ts); db/ does not import lib/.
    const url = process.env.DATABASE_URL;
    if (!url) throw new Error("DATABASE_URL is not set: the PostgreSQL address the app uses (see .env.example)");
    // postgres.js prepares each statement text once per connection, and PostgreSQL may then keep one
    // generic plan for it whatever the values (docs: PREPARE, plan_cache_mode): an admin search matching
    // one person and one matching thousands share a text but need opposite plans. Plan with the values.
    const connection = { plan_cache_mode: "force_custom_plan" };
    client = postgres(url, { max: 10, onnotice: () => {}, connection });
    instance = drizzle(client, { schema });
  }
  return instance;
}

/** For scripts and tests: a client on a given address, closed by the caller. */
export function connect(url: string): { db: Db; close: () => Promise<void> } {
  const sql = postgres(url, { max: 5, onnotice: () => {} });
  return { db: drizzle(sql, { schema }), close: () => sql.end({ timeout: 5 }) };
}

export async function closeDb(): Promise<void> {
  await client?.end({ timeout: 5 });
  client = undefined;
  instance = undefined;
}
