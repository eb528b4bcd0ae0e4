// The admin money tables (issue 7 item 6): payments, memberships and enrolments, each sorted,
// filtered and paged here in SQL (never in the browser) — a page and its total are two queries, asked
// by two requests, so paging does not recount — plus keyset batches for the streamed CSV export and
// the revenue by month. The table routes read through reportsDb() (db/client.ts).
import { and, asc, eq, gte, sql, type SQL } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import type { Tx as Db } from "./auth";
import { courses, enrolments, payments, plans, refunds, subscriptions, users } from "../schema";
import type { EnrolmentsQuery, MembershipsQuery, PaymentsQuery } from "@/lib/billing/admin/params";
import { after, countOf, dayRange, nameOrEmail, offsetOf, ordering, pageOf, textOf, type Cursor, type SortKey } from "@/lib/billing/admin/sql";

export type { Cursor };

// ---- payments

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

// ---- memberships

// A membership without a period end (incomplete) sorts as "renews last".
const periodEnd = sql`coalesce(${subscriptions.currentPeriodEnd}, 'infinity'::timestamptz)`;
const MEMBERSHIP_SORT: Record<MembershipsQuery["sort"], SortKey> = {
  date: { expr: subscriptions.startedAt, cast: "timestamptz" },
  name: { expr: users.name, cast: "text" },
  status: { expr: sql`${subscriptions.status}::text`, cast: "text" },
  renews: { expr: periodEnd, cast: "timestamptz" },
};

const membershipCols = {
  id: subscriptions.id,
  userId: users.id,
  name: users.name,
  email: users.email,
  planId: plans.id,
  plan: plans.name,
  amount: plans.amount,
  currency: plans.currency,
  interval: plans.interval,
  status: subscriptions.status,
  startedAt: subscriptions.startedAt,
  currentPeriodEnd: subscriptions.currentPeriodEnd,
  cancelAtPeriodEnd: subscriptions.cancelAtPeriodEnd,
  graceUntil: subscriptions.graceUntil,
  canceledAt: subscriptions.canceledAt,
  endedAt: subscriptions.endedAt,
  stripeSubscriptionId: subscriptions.stripeSubscriptionId,
};

function membershipsWhere(q: MembershipsQuery): SQL | undefined {
  return and(
    q.status ? eq(subscriptions.status, q.status) : undefined,
    q.plan ? eq(subscriptions.planId, q.plan) : undefined,
    ...dayRange(subscriptions.startedAt, q.from, q.to),
    nameOrEmail(q.q),
  );
}

export type MembershipAdminRow = Awaited<ReturnType<typeof listMemberships>>["rows"][number];

export async function listMemberships(db: Db, q: MembershipsQuery) {
  const rows = await db
    .select(membershipCols)
    .from(subscriptions)
    .innerJoin(users, eq(users.id, subscriptions.userId))
    .innerJoin(plans, eq(plans.id, subscriptions.planId))
    .where(membershipsWhere(q))
    .orderBy(...ordering(MEMBERSHIP_SORT[q.sort], subscriptions.id, q.dir))
    .limit(q.pageSize + 1)
    .offset(offsetOf(q));
  return pageOf(rows, q.pageSize);
}

export async function countMemberships(db: Db, q: MembershipsQuery): Promise<number> {
  const [{ n }] = await db.select({ n: countOf }).from(subscriptions).innerJoin(users, eq(users.id, subscriptions.userId)).where(membershipsWhere(q));
  return n;
}

export async function membershipsBatch(db: Db, q: MembershipsQuery, cursor: Cursor | null, limit: number) {
  const key = MEMBERSHIP_SORT[q.sort];
  return db
    .select({ ...membershipCols, cursorKey: textOf(key) })
    .from(subscriptions)
    .innerJoin(users, eq(users.id, subscriptions.userId))
    .innerJoin(plans, eq(plans.id, subscriptions.planId))
    .where(and(membershipsWhere(q), after(key, subscriptions.id, q.dir, cursor)))
    .orderBy(...ordering(key, subscriptions.id, q.dir))
    .limit(limit);
}

// ---- enrolments

const ENROLMENT_SORT: Record<EnrolmentsQuery["sort"], SortKey> = {
  date: { expr: enrolments.enrolledAt, cast: "timestamptz" },
  name: { expr: users.name, cast: "text" },
  status: { expr: sql`${enrolments.status}::text`, cast: "text" },
  course: { expr: courses.title, cast: "text" },
};

// The member's newest subscription says where their membership stands beside each enrolment.
const latestSub = (col: SQL) =>
  sql<string | null>`(select ${col} from ${subscriptions} s join ${plans} pl on pl.id = s.plan_id where s.user_id = "enrolments"."user_id" order by s.started_at desc limit 1)`;

const enrolmentCols = {
  id: enrolments.id,
  userId: users.id,
  name: users.name,
  email: users.email,
  courseId: courses.id,
  course: courses.title,
  status: enrolments.status,
  enrolledAt: enrolments.enrolledAt,
  endedAt: enrolments.endedAt,
  membership: latestSub(sql.raw("s.status::text")).as("membership"),
  plan: latestSub(sql.raw("pl.name")).as("membership_plan"),
};

function enrolmentsWhere(q: EnrolmentsQuery): SQL | undefined {
  return and(
    q.status ? eq(enrolments.status, q.status) : undefined,
    q.course ? eq(enrolments.courseId, q.course) : undefined,
    // "Plan": enrolled people whose membership (not ended) is on that plan.
    q.plan
      ? sql`exists (select 1 from ${subscriptions} s where s.user_id = ${enrolments.userId} and s.plan_id = ${q.plan} and s.status not in ('canceled', 'incomplete_expired'))`
      : undefined,
    ...dayRange(enrolments.enrolledAt, q.from, q.to),
    nameOrEmail(q.q),
  );
}

export type EnrolmentAdminRow = Awaited<ReturnType<typeof listEnrolments>>["rows"][number];

export async function listEnrolments(db: Db, q: EnrolmentsQuery) {
  const rows = await db
    .select(enrolmentCols)
    .from(enrolments)
    .innerJoin(users, eq(users.id, enrolments.userId))
    .innerJoin(courses, eq(courses.id, enrolments.courseId))
    .where(enrolmentsWhere(q))
    .orderBy(...ordering(ENROLMENT_SORT[q.sort], enrolments.id, q.dir))
    .limit(q.pageSize + 1)
    .offset(offsetOf(q));
  return pageOf(rows, q.pageSize);
}

export async function countEnrolments(db: Db, q: EnrolmentsQuery): Promise<number> {
  const [{ n }] = await db.select({ n: countOf }).from(enrolments).innerJoin(users, eq(users.id, enrolments.userId)).innerJoin(courses, eq(courses.id, enrolments.courseId)).where(enrolmentsWhere(q));
  return n;
}

export async function enrolmentsBatch(db: Db, q: EnrolmentsQuery, cursor: Cursor | null, limit: number) {
  const key = ENROLMENT_SORT[q.sort];
  return db
    .select({ ...enrolmentCols, cursorKey: textOf(key) })
    .from(enrolments)
    .innerJoin(users, eq(users.id, enrolments.userId))
    .innerJoin(courses, eq(courses.id, enrolments.courseId))
    .where(and(enrolmentsWhere(q), after(key, enrolments.id, q.dir, cursor)))
    .orderBy(...ordering(key, enrolments.id, q.dir))
    .limit(limit);
}

/** Courses and plans for the tables' filter menus. */
export async function filterChoices(db: Db) {
  const [planRows, courseRows] = await Promise.all([
    db.select({ id: plans.id, name: plans.name }).from(plans).orderBy(asc(plans.name)),
    db.select({ id: courses.id, name: courses.title }).from(courses).orderBy(asc(courses.title)),
  ]);
  return { plans: planRows, courses: courseRows };
}

// ---- revenue

export type RevenueMonth = { month: string; currency: string; new: number; renewals: number; refunds: number };

/**
 * Money in and out by calendar month (UTC) from `since`: payments that took money (paid or later
 * refunded) by the month they were taken, split new / renewals (plan changes count with renewals),
 * and refunds by the month they were made, as negative amounts. Integer minor units per currency.
 */
export async function revenueByMonth(db: Db, since: Date): Promise<RevenueMonth[]> {
  const month = (col: AnyPgColumn) => sql<string>`to_char(${col} at time zone 'UTC', 'YYYY-MM')`;
  const [taken, back] = await Promise.all([
    db
      .select({
        month: month(payments.createdAt),
        currency: payments.currency,
        new: sql<number>`coalesce(sum(${payments.amount}) filter (where ${payments.kind} = 'new'), 0)::int`,
        renewals: sql<number>`coalesce(sum(${payments.amount}) filter (where ${payments.kind} <> 'new'), 0)::int`,
      })
      .from(payments)
      .where(and(sql`${payments.status} <> 'failed'`, gte(payments.createdAt, since)))
      .groupBy(sql`1`, payments.currency),
    db
      .select({ month: month(refunds.createdAt), currency: refunds.currency, refunds: sql<number>`(-sum(${refunds.amount}))::int` })
      .from(refunds)
      .where(gte(refunds.createdAt, since))
      .groupBy(sql`1`, refunds.currency),
  ]);
  const out = new Map<string, RevenueMonth>();
  const at = (m: string, c: string) => {
    const k = `${m} ${c}`;
    if (!out.has(k)) out.set(k, { month: m, currency: c, new: 0, renewals: 0, refunds: 0 });
    return out.get(k) as RevenueMonth;
  };
  for (const r of taken) Object.assign(at(r.month, r.currency), { new: r.new, renewals: r.renewals });
  for (const r of back) at(r.month, r.currency).refunds = r.refunds;
  return [...out.values()];
}
