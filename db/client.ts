import { drizzle, type PostgresJsDatabase } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import * as schema from "./schema";
import { env } from "@/lib/env";

export type Db = PostgresJsDatabase<typeof schema>;

// One pool per process, created on first use so that `next build` never needs a database.
let client: postgres.Sql | undefined;
let instance: Db | undefined;

let generation = 0;
/** Which main pool this is: a new one after closeDb() (a listener on the old one is gone with it). */
export const poolGeneration = () => generation;

export function db(): Db {
  if (!instance) {
    generation++;
    client = postgres(env().DATABASE_URL, { max: 10, onnotice: () => {} });
    instance = drizzle(client, { schema });
  }
  return instance;
}

// A second, small pool for the admin tables' reads (db/queries/admin-payments.ts, admin-members.ts). Their filters are
// all optional and their selectivity differs by orders of magnitude (a name matching eight hundred
// people, a status matching nine payments in ten), so a prepared statement's generic plan — which
// PostgreSQL adopts after five executions when it looks cheaper (docs: PREPARE, "plan_cache_mode") —
// was measured ten times slower than the plan made for the actual values. force_custom_plan plans
// each execution with its values (about half a millisecond). Three connections: more than the
// machine's cores only queue inside PostgreSQL, where they are served unfairly (bench-payments).
//
// Their statements run prepared (drizzle's `.prepare(name).execute()`), as does the session lookup
// (lib/auth/lucia.ts): postgres.js sends a statement with parameters that is not prepared in two
// round trips — Parse and Describe to learn the parameters' types, then Bind and Execute
// (node_modules/postgres/src/connection.js, build() and toBuffer()) — and a prepared one in a single
// round trip once its connection has seen its text (it keeps one per distinct text per connection,
// naming it itself; the name given to drizzle is only a label). The admin tables' texts are bounded:
// one per combination of filters present, sort and direction. Measured on the payments page: one
// write to PostgreSQL a request instead of two (strace); in-process at 20 in flight, 803 requests a
// second instead of 565 (bench-payments, with pipelining off as below).
//
// And one statement at a time on each of its connections: postgres.js sends a prepared statement on
// a connection still busy with another (pipelining, up to `max_pipeline` statements, 100 by default:
// node_modules/postgres/src/index.js parseOptions; the option is missing from its typings), where it
// waits behind whatever runs there while another connection may be free. With the statements
// prepared and pipelining on, the one-person search's p95 at 20 in flight was 105 ms in-process; with
// `max_pipeline: 0` the rest wait in the pool's own queue, in order, and it was 56 ms. The pool is
// for reads only: postgres.js reserves a connection for `sql.begin` through the same pipelining
// check, so a transaction on it fails with UNSAFE_TRANSACTION (the main pool keeps the default).
const oneAtATime = { max_pipeline: 0 } as object;
let reportsClient: postgres.Sql | undefined;
let reports: Db | undefined;

export function reportsDb(): Db {
  if (!reports) {
    reportsClient = postgres(env().DATABASE_URL, {
      max: 3,
      onnotice: () => {},
      connection: { plan_cache_mode: "force_custom_plan" },
      ...oneAtATime,
    });
    reports = drizzle(reportsClient, { schema });
  }
  return reports;
}

/** Whether `d` is one of this process's own handles on DATABASE_URL (db() or reportsDb()), the database its listeners hear. */
export const isAppDb = (d: unknown): boolean => d !== undefined && (d === instance || d === reports);

/**
 * LISTEN on a channel through the main pool's client (postgres.js keeps one connection for it and
 * listens again after a reconnect, calling `onListen` each time: notices sent meanwhile are lost).
 */
export async function listen(
  channel: string,
  onNotice: (payload: string) => void,
  onListen: () => void,
): Promise<void> {
  db();
  await client!.listen(channel, onNotice, onListen);
}

/** For scripts and tests: a client on a given address, closed by the caller. */
export function connect(url: string): { db: Db; close: () => Promise<void> } {
  const sql = postgres(url, { max: 5, onnotice: () => {} });
  return { db: drizzle(sql, { schema }), close: () => sql.end({ timeout: 5 }) };
}

export async function closeDb(): Promise<void> {
  await Promise.all([client?.end({ timeout: 5 }), reportsClient?.end({ timeout: 5 })]);
  client = undefined;
  instance = undefined;
  reportsClient = undefined;
  reports = undefined;
}
