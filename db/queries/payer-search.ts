// The admin payments table's name-or-address search: which of three forms reaches the payments.
import { sql, type SQL } from "drizzle-orm";
import { LRUCache } from "lru-cache";
import type { Tx as Db } from "./auth";
import { payments, users } from "../schema";
import { contains, nameOrEmail } from "@/lib/billing/admin/sql";

/**
 * How a search reaches the payments. Measured on bench-payments' 200,000 payments and 20,000 people
 * (the page statement alone, one at a time, this machine):
 * - **people**: few match, so their payments are found by person (payments_user_created_idx) — by
 *   the ids just read, or by reading them inside the page's statement: one person 1.1 ms, 200 people
 *   1.6–1.8 ms;
 * - **walk**: many match, so the walk in the table's order tests the payment's own copy of the payer's
 *   name and address inside the index (payer_search, migration 0005): 800 people 0.8 ms, 11,000
 *   people 0.3 ms, where testing each payer in users took 4–9 ms. The walk slows as matches thin out
 *   (200 people 3.4 ms, none 6 ms) and reading people slows as they grow (800: 5 ms), hence the choice.
 * All give the same rows: triggers keep payer_search in step with users, and ILIKE compares the
 * lower-cased text in a multibyte encoding (from memory of PostgreSQL's like.c), as lower() … LIKE does.
 */
export type PayerFilter =
  | { kind: "everyone" }
  | { kind: "people"; ids: string[] }
  | { kind: "people"; search: SQL }
  | { kind: "walk"; pattern: string };

/** The walk pays from this share of everyone matching (the crossover measured between 1 % and 4 %). */
const WALK_SHARE = 0.02;
const WALK_MIN = 100;

// The form a search took, kept a minute by this process (lru-cache bounds it): the admin's next page,
// sort or filter with the same search skips counting its people. Only the choice is kept, never
// people or rows — every page reads the database as it is — so a stale choice costs time, not truth.
const chosen = new LRUCache<string, "people" | "walk">({ max: 1000, ttl: 60_000 });

let everyone = { n: 0, at: -Infinity };
/** PostgreSQL's estimate of how many people there are (pg_class.reltuples, kept by autovacuum; −1 before the first ANALYZE), read at most every five minutes: it only steers the choice. */
async function peopleEstimate(db: Db): Promise<number> {
  if (performance.now() - everyone.at > 300_000) {
    const [row] = await db.execute<{ n: number }>(sql`select greatest(reltuples, 0)::int as n from pg_class where oid = 'users'::regclass`);
    everyone = { n: Number(row?.n ?? 0), at: performance.now() };
  }
  return everyone.n;
}

/** The search's form. `walkFrom` (tests) sets how many matching people make it a walk, and skips the kept choice. */
export async function payerFilter(db: Db, q: string | undefined, walkFrom?: number): Promise<PayerFilter> {
  const search = nameOrEmail(q);
  if (!search || !q) return { kind: "everyone" };
  const key = q.toLowerCase();
  const kept = walkFrom === undefined ? chosen.get(key) : undefined;
  if (kept === "walk") return { kind: "walk", pattern: contains(q) };
  if (kept === "people") return { kind: "people", search };
  const enough = walkFrom ?? Math.max(WALK_MIN, Math.ceil(WALK_SHARE * (await peopleEstimate(db))));
  const found = enough > 0 ? await db.select({ id: users.id }).from(users).where(search).limit(enough).prepare("payer_people").execute() : [];
  const kind = found.length < enough ? "people" : "walk";
  if (walkFrom === undefined) chosen.set(key, kind);
  return kind === "people" ? { kind, ids: found.map((r) => r.id) } : { kind, pattern: contains(q) };
}

export function payerCondition(f: PayerFilter): SQL | undefined {
  if (f.kind === "walk") return sql`${payments.payerSearch} like lower(${f.pattern})`;
  if (f.kind !== "people") return undefined;
  // One array parameter rather than a parameter per person; the ids are uuids from the database.
  if ("ids" in f) return sql`${payments.userId} = any(${`{${f.ids.join(",")}}`}::uuid[])`;
  return sql`${payments.userId} = any(array(select ${users.id} from ${users} where ${f.search}))`;
}

/** Nobody matches: no page to read. */
export const nobody = (f: PayerFilter) => f.kind === "people" && "ids" in f && f.ids.length === 0;
