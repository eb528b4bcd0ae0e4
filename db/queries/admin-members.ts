// The admin memberships and enrolments tables: a page each, its total apart, and keyset batches for
// the streamed CSV export, sorted, filtered and paged in SQL. Each table's select and joins are
// written once (membershipsFrom, enrolmentsFrom) for its page and its batches.
import { and, eq, sql, type SQL } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import {
  courses,
  enrolments,
  type enrolmentStatusEnum,
  plans,
  subscriptions,
  type subscriptionStatusEnum,
  users,
} from "../schema";
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

export const MEMBERSHIP_SORTS = ["date", "name", "status", "renews"] as const;
export type MembershipsQuery = ListParams & {
  status?: (typeof subscriptionStatusEnum.enumValues)[number];
  sort: (typeof MEMBERSHIP_SORTS)[number];
};
export const ENROLMENT_SORTS = ["date", "name", "status", "course"] as const;
export type EnrolmentsQuery = ListParams & {
  status?: (typeof enrolmentStatusEnum.enumValues)[number];
  course?: string;
  sort: (typeof ENROLMENT_SORTS)[number];
};

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

/** The memberships' select with its joins and the sort key's text (the CSV batches' cursor), for the page and the batches alike. */
const membershipsFrom = (db: Db, key: SortKey) =>
  db
    .select({ ...membershipCols, cursorKey: textOf(key) })
    .from(subscriptions)
    .innerJoin(users, eq(users.id, subscriptions.userId))
    .innerJoin(plans, eq(plans.id, subscriptions.planId));

export async function listMemberships(db: Db, q: MembershipsQuery) {
  const found = await membershipsFrom(db, MEMBERSHIP_SORT[q.sort])
    .where(membershipsWhere(q))
    .orderBy(...ordering(MEMBERSHIP_SORT[q.sort], subscriptions.id, q.dir))
    .limit(q.pageSize + 1)
    .offset(offsetOf(q));
  return pageOf(found, q.pageSize);
}

export async function countMemberships(db: Db, q: MembershipsQuery): Promise<number> {
  const [{ n }] = await db
    .select({ n: countOf })
    .from(subscriptions)
    .innerJoin(users, eq(users.id, subscriptions.userId))
    .where(membershipsWhere(q));
  return n;
}

export async function membershipsBatch(db: Db, q: MembershipsQuery, cursor: Cursor | null, limit: number) {
  const key = MEMBERSHIP_SORT[q.sort];
  return membershipsFrom(db, key)
    .where(and(membershipsWhere(q), after(key, subscriptions.id, q.dir, cursor)))
    .orderBy(...ordering(key, subscriptions.id, q.dir))
    .limit(limit);
}

const ENROLMENT_SORT: Record<EnrolmentsQuery["sort"], SortKey> = {
  date: { expr: enrolments.enrolledAt, cast: "timestamptz" },
  name: { expr: users.name, cast: "text" },
  status: { expr: sql`${enrolments.status}::text`, cast: "text" },
  course: { expr: courses.title, cast: "text" },
};

// The member's newest subscription says where their membership stands beside each enrolment.
const latestSub = (col: SQL) =>
  sql<
    string | null
  >`(select ${col} from ${subscriptions} s join ${plans} pl on pl.id = s.plan_id where s.user_id = "enrolments"."user_id" order by s.started_at desc limit 1)`;

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
  // The teacher who follows this member on this course (the admin can hand it to another).
  teacherId: enrolments.teacherId,
  teacher: sql<string>`(select t.name from ${users} t where t.id = ${enrolments.teacherId})`.as("teacher_name"),
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

/** The enrolments' select with its joins and the sort key's text (the CSV batches' cursor), for the page and the batches alike. */
const enrolmentsFrom = (db: Db, key: SortKey) =>
  db
    .select({ ...enrolmentCols, cursorKey: textOf(key) })
    .from(enrolments)
    .innerJoin(users, eq(users.id, enrolments.userId))
    .innerJoin(courses, eq(courses.id, enrolments.courseId));

export async function listEnrolments(db: Db, q: EnrolmentsQuery) {
  const found = await enrolmentsFrom(db, ENROLMENT_SORT[q.sort])
    .where(enrolmentsWhere(q))
    .orderBy(...ordering(ENROLMENT_SORT[q.sort], enrolments.id, q.dir))
    .limit(q.pageSize + 1)
    .offset(offsetOf(q));
  return pageOf(found, q.pageSize);
}

export async function countEnrolments(db: Db, q: EnrolmentsQuery): Promise<number> {
  const [{ n }] = await db
    .select({ n: countOf })
    .from(enrolments)
    .innerJoin(users, eq(users.id, enrolments.userId))
    .where(enrolmentsWhere(q));
  return n;
}

export async function enrolmentsBatch(db: Db, q: EnrolmentsQuery, cursor: Cursor | null, limit: number) {
  const key = ENROLMENT_SORT[q.sort];
  return enrolmentsFrom(db, key)
    .where(and(enrolmentsWhere(q), after(key, enrolments.id, q.dir, cursor)))
    .orderBy(...ordering(key, enrolments.id, q.dir))
    .limit(limit);
}
