import { drizzle, type PostgresJsDatabase } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import * as schema from "./schema";
import { env } from "@/lib/env";

export type Db = PostgresJsDatabase<typeof schema>;

// One pool per process, created on first use so that `next build` never needs a database.
let client: postgres.Sql | undefined;
let instance: Db | undefined;

export function db(): Db {
  if (!instance) {
    client = postgres(env().DATABASE_URL, { max: 10, onnotice: () => {} });
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
