// The admin payments table (issue 7 item 6): one page in the table's order, its total apart, and
// keyset batches for the streamed CSV export — sorted, filtered and paged here in SQL, never in the
// browser. The table routes read through reportsDb() (db/client.ts).
import { and, eq, sql, type SQL } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { payments, plans, users } from "../schema";
import type { PaymentsQuery } from "@/lib/billing/admin/params";
import { after, countOf, dayRange, nameOrEmail, offsetOf, ordering, pageOf, textOf, type Cursor, type SortKey } from "@/lib/billing/admin/sql";

export type { Cursor };

const PAYMENT_SORT: Record<PaymentsQuery["sort"], SortKey> = {
  date: { expr: payments.createdAt, cast: "timestamptz" },
  amount: { expr: payments.amount, cast: "integer" },
  status: { expr: sql`${payments.status}::text`, cast: "text" },
  name: { expr: users.name, cast: "text" },
};

const paymentCols = {
  id: payments.id,
  createdAt: payments.createdAt,
  userId: users.id,
  name: users.name,
  email: users.email,
  planId: payments.planId,
  plan: plans.name,
  kind: payments.kind,
  amount: payments.amount,
  refundedAmount: payments.refundedAmount,
  currency: payments.currency,
  status: payments.status,
  receiptNumber: payments.receiptNumber,
  failureMessage: payments.failureMessage,
  stripeInvoiceId: payments.stripeInvoiceId,
};

function paymentsWhere(q: PaymentsQuery, payer: SQL | undefined): SQL | undefined {
  return and(
    q.status ? eq(payments.status, q.status) : undefined,
    q.plan ? eq(payments.planId, q.plan) : undefined,
    ...dayRange(payments.createdAt, q.from, q.to),
    payer,
  );
}

/**
 * The payer matches the name-or-address search, as a condition on `payments.user_id`.
 *
 * For a page (`walk`), written so that PostgreSQL keeps it a hashed subplan: the matching people's
 * ids are read once into a hash table and each payment met while walking an index in the table's
 * order is tested against it, stopping after the page. Left as a plain IN, the planner turns it into
 * a join and, with the sorted-walk indexes of migration 0004, probes users once per payment walked
 * (bench-payments, a search matching 800 of 20,000 people: 7–20 ms against 2.5 ms). The `or false`
 * keeps the sub-select from being pulled up into a join: the planner pulls up only IN sub-selects
 * standing alone in WHERE's AND list (src/backend/optimizer/prep/prepjointree.c, from memory; the
 * plan "Filter: … (hashed SubPlan 1)" was checked with EXPLAIN on PostgreSQL 15). The hash holds
 * while the matches fit in work_mem (4 MB by default; tens of thousands of ids, an estimate).
 * For a count, the plain IN: there the join, one probe per matching person, is the cheaper plan.
 */
function payerMatching(q: string | undefined, use: "walk" | "count"): SQL | undefined {
  const search = nameOrEmail(q);
  if (!search) return undefined;
  const matching = sql`${payments.userId} in (select ${users.id} from ${users} where ${search})`;
  return use === "walk" ? sql`(${matching} or false)` : matching;
}

export type PaymentRow = Awaited<ReturnType<typeof listPayments>>["rows"][number];

/**
 * One page of payments in the table's order, and whether another follows. The total is counted
 * apart (countPayments, its own request): counting reads every match, the page only its rows.
 */
export async function listPayments(db: Db, q: PaymentsQuery) {
  const payer = payerMatching(q.q, "walk");
  const order = ordering(PAYMENT_SORT[q.sort], payments.id, q.dir);
  // The page's ids first, from the covering indexes alone (an index-only walk; a scan reading each
  // payment row to test its filters measured eight times slower), then those rows in full.
  const base = db.select({ pid: sql<string>`${payments.id}`.as("pid") }).from(payments);
  const page = (q.sort === "name" ? base.innerJoin(users, eq(users.id, payments.userId)) : base)
    .where(paymentsWhere(q, payer))
    .orderBy(...order)
    .limit(q.pageSize + 1)
    .offset(offsetOf(q))
    .as("page");
  const rows = await db
    .select(paymentCols)
    .from(page)
    .innerJoin(payments, eq(payments.id, page.pid))
    .innerJoin(users, eq(users.id, payments.userId))
    .leftJoin(plans, eq(plans.id, payments.planId))
    .orderBy(...order);
  return pageOf(rows, q.pageSize);
}

/** How many payments the filters match (exact). */
export async function countPayments(db: Db, q: PaymentsQuery): Promise<number> {
  const payer = payerMatching(q.q, "count");
  const [{ n }] = await db.select({ n: countOf }).from(payments).where(paymentsWhere(q, payer));
  return n;
}

/** One batch of the CSV export, in the table's order, after `cursor`. */
export async function paymentsBatch(db: Db, q: PaymentsQuery, cursor: Cursor | null, limit: number) {
  const key = PAYMENT_SORT[q.sort];
  return db
    .select({ ...paymentCols, cursorKey: textOf(key) })
    .from(payments)
    .innerJoin(users, eq(users.id, payments.userId))
    .leftJoin(plans, eq(plans.id, payments.planId))
    .where(and(paymentsWhere(q, nameOrEmail(q.q)), after(key, payments.id, q.dir, cursor)))
    .orderBy(...ordering(key, payments.id, q.dir))
    .limit(limit);
}
