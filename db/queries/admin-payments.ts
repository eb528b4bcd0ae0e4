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
 * The payer matches the name-or-address search, as a condition on `payments.user_id`; PostgreSQL
 * makes it a join and picks the order itself from its estimate of how many people match. Measured on
 * bench-payments' 200,000 payments (one page, the statement alone, one at a time): a search for one
 * person or a few hundred starts from those people (0.7–1.8 ms); a search most people match walks
 * the payments in the table's order (0.8 ms); the middle — several hundred to a few thousand people,
 * 4–5 % of them — walks and tests each payer (4–6 ms), the slowest case. Forcing a hashed sub-plan
 * instead (`(… in (select …) or false)`, tried in the third session) halves that middle case but
 * costs 10–20 ms for a single person and for the broad searches, so the planner keeps the choice.
 */
function payerMatching(q: string | undefined): SQL | undefined {
  const search = nameOrEmail(q);
  if (!search) return undefined;
  return sql`${payments.userId} in (select ${users.id} from ${users} where ${search})`;
}

export type PaymentRow = Awaited<ReturnType<typeof listPayments>>["rows"][number];

/**
 * One page of payments in the table's order, and whether another follows. The total is counted
 * apart (countPayments, its own request): counting reads every match, the page only its rows.
 */
export async function listPayments(db: Db, q: PaymentsQuery) {
  const payer = payerMatching(q.q);
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
  const payer = payerMatching(q.q);
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
