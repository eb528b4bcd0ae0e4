// The admin payments table (issue 7 item 6): one page in the table's order, its total apart, and
// keyset batches for the streamed CSV export — sorted, filtered and paged here in SQL, never in the
// browser. The table routes read through reportsDb() (db/client.ts).
import { and, eq, gte, lt, sql, type Placeholder, type SQL } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { payments, plans, users } from "../schema";
import type { PaymentsQuery } from "@/lib/billing/admin/params";
import {
  nobody,
  payerFilter,
  payerPlaceholder,
  payerShape,
  payerValues,
  type PayerFilter,
  type PayerShape,
} from "./payer-search";
import {
  after,
  countOf,
  dayBounds,
  nameOrEmail,
  offsetOf,
  ordering,
  pageOf,
  textOf,
  type Cursor,
  type SortKey,
} from "@/lib/billing/admin/sql";

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

// The page's columns: the payer and the plan read by a scalar subquery per row rather than joined.
// The page has at most a hundred and one rows, each a primary-key probe, and PostgreSQL then has no
// join order to weigh: planning each execution with its values (db/client.ts) took 0.19–0.29 ms
// instead of 0.42–0.49 ms for the page with a walk or without a search, and pgbench put the whole
// statement 0.1–1.0 ms a request faster (bench-payments' four pages, this machine, EXPLAIN SUMMARY).
const payerOf = (col: typeof users.name | typeof users.email) =>
  sql<string>`(select ${col} from ${users} where ${users.id} = ${payments.userId})`;
const pageCols = {
  ...paymentCols,
  userId: payments.userId,
  name: payerOf(users.name),
  email: payerOf(users.email),
  plan: sql<string | null>`(select ${plans.name} from ${plans} where ${plans.id} = ${payments.planId})`,
};
const PAGE_ORDER: Record<PaymentsQuery["sort"], SortKey> = {
  ...PAYMENT_SORT,
  name: { expr: pageCols.name, cast: "text" },
};

type FilterName = "status" | "plan" | "from" | "to";
type Arg = <T>(name: FilterName, value: T) => T | Placeholder;
const byValue: Arg = (_name, value) => value;
const byPlaceholder: Arg = (name) => sql.placeholder(name);

/**
 * The filters present in `q`, each compared with its value — or, for a statement built once per
 * shape (the page's), with a placeholder of its name that filterValues fills on execution.
 */
function paymentsWhere(q: PaymentsQuery, payer: SQL | undefined, arg: Arg = byValue): SQL | undefined {
  const days = dayBounds(q.from, q.to);
  return and(
    q.status ? eq(payments.status, arg("status", q.status)) : undefined,
    q.plan ? eq(payments.planId, arg("plan", q.plan)) : undefined,
    days.from ? gte(payments.createdAt, arg("from", days.from)) : undefined,
    days.to ? lt(payments.createdAt, arg("to", days.to)) : undefined,
    payer,
  );
}

/** The placeholders' values: the instants as the column would write them (a placeholder's value goes to the driver as it is). */
function filterValues(q: PaymentsQuery): Record<FilterName, string | undefined> {
  const days = dayBounds(q.from, q.to);
  return { status: q.status, plan: q.plan, from: days.from?.toISOString(), to: days.to?.toISOString() };
}

export type PaymentRow = Awaited<ReturnType<typeof listPayments>>["rows"][number];

/**
 * The page's statement for one shape — which filters are present, the payer's form, the sort and
 * direction — with placeholders for every value (drizzle's sql.placeholder): its ids first, from the
 * covering indexes alone, then those rows in full.
 */
function buildPage(db: Db, q: PaymentsQuery, payer: PayerShape) {
  const p = sql.placeholder;
  // An index-only walk for the ids: a scan reading each payment row to test its filters measured
  // eight times slower.
  const base = db.select({ id: payments.id }).from(payments);
  const ids = (q.sort === "name" ? base.innerJoin(users, eq(users.id, payments.userId)) : base)
    .where(paymentsWhere(q, payerPlaceholder(payer), byPlaceholder))
    .orderBy(...ordering(PAYMENT_SORT[q.sort], payments.id, q.dir))
    .limit(p("limit"))
    .offset(p("offset"));
  // `id = any(array(…))` rather than a join with the ids: the same plan, planned in 0.8 ms instead of
  // 1.1 (the planner weighs fewer join orders; bench-payments' page, this machine).
  return db
    .select(pageCols)
    .from(payments)
    .where(sql`${payments.id} = any(array(${ids}))`)
    .orderBy(...ordering(PAGE_ORDER[q.sort], payments.id, q.dir))
    .prepare("admin_table_page");
}

// Each shape's statement is built once and kept (at most 4 sorts × 2 directions × 16 sets of filters ×
// 4 payer forms), per database handle: building it with its values on every request was about a
// tenth of the web process's CPU on this page (a V8 profile of `next start` under wrk).
const built = new WeakMap<Db, Map<string, ReturnType<typeof buildPage>>>();

function pageQuery(db: Db, q: PaymentsQuery, payer: PayerFilter) {
  const shape = payerShape(payer);
  const key = [q.sort, q.dir, q.status ? "s" : "", q.plan ? "p" : "", q.from ? "f" : "", q.to ? "t" : "", shape].join(
    " ",
  );
  let statements = built.get(db);
  if (!statements) built.set(db, (statements = new Map()));
  let statement = statements.get(key);
  if (!statement) statements.set(key, (statement = buildPage(db, q, shape)));
  return statement.execute({ ...filterValues(q), ...payerValues(payer), limit: q.pageSize + 1, offset: offsetOf(q) });
}

/**
 * One page of payments in the table's order, and whether another follows. The total is counted
 * apart (countPayments, its own request): counting reads every match, the page only its rows.
 */
export async function listPayments(db: Db, q: PaymentsQuery, filter?: PayerFilter) {
  const found = filter ?? (await payerFilter(db, q.q));
  const rows = nobody(found) ? [] : await pageQuery(db, q, found);
  return pageOf(rows, q.pageSize);
}

/**
 * How many payments the filters match (exact). A count reads every match, so the walk that serves a
 * broad search's page does not help it (it would test every payment the other filters leave: 9 ms
 * for "wood" where 35,000 remain); the payer condition is left to the planner, which joins the
 * matching people to their payments (measured 4–5 ms for "wood", under 2 ms for a few people).
 */
export async function countPayments(db: Db, q: PaymentsQuery): Promise<number> {
  const search = nameOrEmail(q.q);
  const payer = search && sql`${payments.userId} in (select ${users.id} from ${users} where ${search})`;
  const [{ n }] = await db
    .select({ n: countOf })
    .from(payments)
    .where(paymentsWhere(q, payer))
    .prepare("admin_table_count")
    .execute();
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
