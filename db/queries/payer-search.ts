// The admin payments table's name-or-address search: which of three forms reaches the payments.
import { sql, type SQL } from "drizzle-orm";
import { LRUCache } from "lru-cache";
import type { Tx as Db } from "./auth";
import { payments, users } from "../schema";
import { contains, nameOrEmail, nameOrEmailLike } from "@/lib/billing/admin/sql";
import { isAppDb } from "../client";
import { processListener } from "../notices";

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
  | { kind: "people"; pattern: string } // read inside the page's statement
  | { kind: "walk"; pattern: string };

/** The walk pays from this share of everyone matching (the crossover measured between 1 % and 4 %). */
const WALK_SHARE = 0.02;
const WALK_MIN = 100;

// What a search found, kept a minute by this process (lru-cache bounds it by entries and by ids):
// the admin's next page, sort or filter with the same search skips finding its people. A "walk"
// keeps only the choice — every page tests the payments' copy of the payer as it is. A "people"
// search keeps the people's ids while this process hears users change (migration 0006 announces
// every insert, delete and change of name or address on the channel below, and a notice empties the
// cache): pgbench put the 200-person page 0.6 ms faster with the ids given than with the trigram
// lookup inside its statement (this machine). Without the notices it keeps only the choice, and each
// page finds the people inside its own statement, as it is.
const PEOPLE_CHANNEL = "rosinwood_people";
type Kept = { kind: "walk" } | { kind: "people"; ids?: string[] };
type Store = { cache: LRUCache<string, Kept>; generation: number };
const STORE = Symbol.for("rosinwood.payer-search"); // one per process, as db/notices.ts explains
const shared = globalThis as typeof globalThis & { [STORE]?: Store };
const makeCache = () =>
  new LRUCache<string, Kept>({
    max: 1000,
    maxSize: 200_000,
    sizeCalculation: (k) => 1 + (k.kind === "people" ? (k.ids?.length ?? 0) : 0),
    ttl: 60_000,
  });
const store = () => (shared[STORE] ??= { cache: makeCache(), generation: 0 });

/** Forget every kept search (a person was added, removed or renamed somewhere). */
export function forgetPeople(): void {
  const s = store();
  s.cache.clear();
  s.generation++;
}

const people = processListener(PEOPLE_CHANNEL, forgetPeople, forgetPeople);

/** Tests: what this process keeps for a search (lower-cased), if anything. */
export const keptSearch = (key: string): Kept | undefined => store().cache.get(key);

/** Tests: settles once this process hears the people's changes. */
export const peopleNoticesReady = (): Promise<void> => people.ready();

/**
 * Whether changes to the people `db` reads reach this process: only for its own handles on
 * DATABASE_URL (a script or test passing a database of its own is not heard), once listening.
 */
function hearing(db: Db): boolean {
  if (!isAppDb(db)) return false;
  try {
    people.start();
  } catch {
    return false;
  }
  return people.listening();
}

let everyone = { n: 0, at: -Infinity };
/** PostgreSQL's estimate of how many people there are (pg_class.reltuples, kept by autovacuum; −1 before the first ANALYZE), read at most every five minutes: it only steers the choice. */
async function peopleEstimate(db: Db): Promise<number> {
  if (performance.now() - everyone.at > 300_000) {
    const [row] = await db.execute<{ n: number }>(
      sql`select greatest(reltuples, 0)::int as n from pg_class where oid = 'users'::regclass`,
    );
    everyone = { n: Number(row?.n ?? 0), at: performance.now() };
  }
  return everyone.n;
}

/** The search's form. `walkFrom` (tests) sets how many matching people make it a walk, and skips the kept search. */
export async function payerFilter(db: Db, q: string | undefined, walkFrom?: number): Promise<PayerFilter> {
  const search = nameOrEmail(q);
  if (!search || !q) return { kind: "everyone" };
  const key = q.toLowerCase(); // ILIKE: the same people whatever the case
  const heard = hearing(db);
  const kept = walkFrom === undefined ? store().cache.get(key) : undefined;
  if (kept?.kind === "walk") return { kind: "walk", pattern: contains(q) };
  if (kept?.kind === "people" && kept.ids && heard) return { kind: "people", ids: kept.ids };
  if (kept?.kind === "people" && !heard) return { kind: "people", pattern: contains(q) };
  // Heard: the ids are read below and kept, unless a notice came while reading (it may be for a
  // change the read did not see).
  const before = heard ? store().generation : undefined;
  const enough = walkFrom ?? Math.max(WALK_MIN, Math.ceil(WALK_SHARE * (await peopleEstimate(db))));
  const found =
    enough > 0
      ? await db.select({ id: users.id }).from(users).where(search).limit(enough).prepare("payer_people").execute()
      : [];
  if (found.length >= enough) {
    if (walkFrom === undefined) store().cache.set(key, { kind: "walk" });
    return { kind: "walk", pattern: contains(q) };
  }
  const ids = found.map((r) => r.id);
  if (walkFrom === undefined)
    store().cache.set(
      key,
      before !== undefined && before === store().generation ? { kind: "people", ids } : { kind: "people" },
    );
  return { kind: "people", ids };
}

/** The form the page's statement takes for a filter: part of its shape, the values apart. */
export type PayerShape = "everyone" | "ids" | "inside" | "walk";
export const payerShape = (f: PayerFilter): PayerShape =>
  f.kind === "people" ? ("ids" in f ? "ids" : "inside") : f.kind;

/** The payer condition of a shape, with placeholders (drizzle's sql.placeholder) that payerValues fills. */
export function payerPlaceholder(shape: PayerShape): SQL | undefined {
  const p = sql.placeholder;
  if (shape === "walk") return sql`${payments.payerSearch} like lower(${p("pattern")})`;
  // One array parameter rather than a parameter per person (the ids are uuids from the database),
  // unnested in a subquery: given the array itself, the planner estimates each id against the
  // column's statistics, and planning the 200-person page took 0.70–0.76 ms instead of 0.53–0.58 ms,
  // with the same plan (EXPLAIN SUMMARY of the prepared statement, bench-payments' database).
  if (shape === "ids") return sql`${payments.userId} = any(array(select unnest(${p("ids")}::uuid[])))`;
  if (shape === "inside")
    return sql`${payments.userId} = any(array(select ${users.id} from ${users} where ${nameOrEmailLike(p("pattern"))}))`;
  return undefined;
}

export function payerValues(f: PayerFilter): Record<string, string> {
  if (f.kind === "walk" || (f.kind === "people" && "pattern" in f)) return { pattern: f.pattern };
  if (f.kind === "people") return { ids: `{${f.ids.join(",")}}` };
  return {};
}

/** Nobody matches: no page to read. */
export const nobody = (f: PayerFilter) => f.kind === "people" && "ids" in f && f.ids.length === 0;
