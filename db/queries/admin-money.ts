// The admin money tables (issue 7 item 6): payments, memberships and enrolments, each sorted,
// filtered and paged here in SQL (never in the browser), plus keyset batches for the streamed CSV
// export and the revenue by month.
import { and, asc, eq, gte, sql, type SQL } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import type { Tx as Db } from "./auth";
import { courses, enrolments, payments, plans, refunds, subscriptions, users } from "../schema";
import type { EnrolmentsQuery, MembershipsQuery, PaymentsQuery } from "@/lib/billing/admin/params";
import { after, countOf, dayRange, nameOrEmail, offsetOf, ordering, textOf, type Cursor, type SortKey } from "@/lib/billing/admin/sql";

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

function paymentsWhere(q: PaymentsQuery): SQL | undefined {
  return and(
    q.status ? eq(payments.status, q.status) : undefined,
    q.plan ? eq(payments.planId, q.plan) : undefined,
    ...dayRange(payments.createdAt, q.from, q.to),
    nameOrEmail(q.q),
  );
}

export type PaymentRow = Awaited<ReturnType<typeof listPayments>>["rows"][number];

/**
 * One page and the total in one pass: the page's ids are found first, with the total as a window
 * count over the same rows (so the filters run once, mostly inside indexes), then only those rows
 * are read in full. A page past the end has no row to carry the total, so it is counted apart.
 */
export async function listPayments(db: Db, q: PaymentsQuery) {
  const where = paymentsWhere(q);
  const order = ordering(PAYMENT_SORT[q.sort], payments.id, q.dir);
  const page = db
    .select({ pid: sql<string>`${payments.id}`.as("pid"), total: sql<number>`(count(*) over ())::int`.as("total") })
    .from(payments)
    .innerJoin(users, eq(users.id, payments.userId))
    .where(where)
    .orderBy(...order)
    .limit(q.pageSize)
    .offset(offsetOf(q))
    .as("page");
  const rows = await db
    .select({ ...paymentCols, total: page.total })
    .from(page)
    .innerJoin(payments, eq(payments.id, page.pid))
    .innerJoin(users, eq(users.id, payments.userId))
    .leftJoin(plans, eq(plans.id, payments.planId))
    .orderBy(...order);
  if (rows.length > 0) return { rows: rows.map(({ total: _t, ...r }) => r), total: rows[0].total };
  if (q.page === 1) return { rows: [], total: 0 };
  const [{ n }] = await db.select({ n: countOf }).from(payments).innerJoin(users, eq(users.id, payments.userId)).where(where);
  return { rows: [], total: n };
}

/** One batch of the CSV export, in the table's order, after `cursor`. */
export async function paymentsBatch(db: Db, q: PaymentsQuery, cursor: Cursor | null, limit: number) {
  const key = PAYMENT_SORT[q.sort];
  return db
    .select({ ...paymentCols, cursorKey: textOf(key) })
    .from(payments)
    .innerJoin(users, eq(users.id, payments.userId))
    .leftJoin(plans, eq(plans.id, payments.planId))
    .where(and(paymentsWhere(q), after(key, payments.id, q.dir, cursor)))
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
  const where = membershipsWhere(q);
  const [rows, [{ n }]] = await Promise.all([
    db
      .select(membershipCols)
      .from(subscriptions)
      .innerJoin(users, eq(users.id, subscriptions.userId))
      .innerJoin(plans, eq(plans.id, subscriptions.planId))
      .where(where)
      .orderBy(...ordering(MEMBERSHIP_SORT[q.sort], subscriptions.id, q.dir))
      .limit(q.pageSize)
      .offset(offsetOf(q)),
    db.select({ n: countOf }).from(subscriptions).innerJoin(users, eq(users.id, subscriptions.userId)).where(where),
  ]);
  return { rows, total: n };
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
  const where = enrolmentsWhere(q);
  const [rows, [{ n }]] = await Promise.all([
    db
      .select(enrolmentCols)
      .from(enrolments)
      .innerJoin(users, eq(users.id, enrolments.userId))
      .innerJoin(courses, eq(courses.id, enrolments.courseId))
      .where(where)
      .orderBy(...ordering(ENROLMENT_SORT[q.sort], enrolments.id, q.dir))
      .limit(q.pageSize)
      .offset(offsetOf(q)),
    db.select({ n: countOf }).from(enrolments).innerJoin(users, eq(users.id, enrolments.userId)).innerJoin(courses, eq(courses.id, enrolments.courseId)).where(where),
  ]);
  return { rows, total: n };
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
