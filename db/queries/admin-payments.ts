// The admin payments table: one page in the table's order, its total apart, and keyset batches for
// the streamed CSV export, sorted, filtered and paged in SQL.
import { and, eq, sql, type SQL } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { payments, type paymentStatusEnum, plans, users } from "../schema";
import {
  after,
  countOf,
  dayRange,
  nameOrEmail,
  offsetOf,
  ordering,
  pageOf,
  textOf,
  type Cursor,
  type ListParams,
  type SortKey,
} from "./admin-sql";

export const PAYMENT_SORTS = ["date", "amount", "status", "name"] as const;
export type PaymentsQuery = ListParams & {
  status?: (typeof paymentStatusEnum.enumValues)[number];
  sort: (typeof PAYMENT_SORTS)[number];
};

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

// `payer` is the name-or-address condition: on the joined users for a page, as a subquery for the
// count, which then needs no join (joining every payment to its payer made the count several times slower).
function paymentsWhere(q: PaymentsQuery, payer: SQL | undefined): SQL | undefined {
  return and(
    q.status ? eq(payments.status, q.status) : undefined,
    q.plan ? eq(payments.planId, q.plan) : undefined,
    ...dayRange(payments.createdAt, q.from, q.to),
    payer,
  );
}

/** The payments' select with its joins and the sort key's text (the CSV batches' cursor). */
const paymentsFrom = (db: Db, key: SortKey) =>
  db
    .select({ ...paymentCols, cursorKey: textOf(key) })
    .from(payments)
    .innerJoin(users, eq(users.id, payments.userId))
    .leftJoin(plans, eq(plans.id, payments.planId));

export type PaymentRow = Awaited<ReturnType<typeof listPayments>>["rows"][number];

/** One page in the table's order, and whether another follows (the total is its own request). */
export async function listPayments(db: Db, q: PaymentsQuery) {
  const key = PAYMENT_SORT[q.sort];
  const found = await paymentsFrom(db, key)
    .where(paymentsWhere(q, nameOrEmail(q.q)))
    .orderBy(...ordering(key, payments.id, q.dir))
    .limit(q.pageSize + 1)
    .offset(offsetOf(q));
  return pageOf(found, q.pageSize);
}

export async function countPayments(db: Db, q: PaymentsQuery): Promise<number> {
  const search = nameOrEmail(q.q);
  const payer = search && sql`${payments.userId} in (select ${users.id} from ${users} where ${search})`;
  const [{ n }] = await db.select({ n: countOf }).from(payments).where(paymentsWhere(q, payer));
  return n;
}

/** One batch of the CSV export, in the table's order, after `cursor`. */
export async function paymentsBatch(db: Db, q: PaymentsQuery, cursor: Cursor | null, limit: number) {
  const key = PAYMENT_SORT[q.sort];
  return paymentsFrom(db, key)
    .where(and(paymentsWhere(q, nameOrEmail(q.q)), after(key, payments.id, q.dir, cursor)))
    .orderBy(...ordering(key, payments.id, q.dir))
    .limit(limit);
}
