// What the admin money pages read besides their tables (db/queries/admin-payments.ts,
// admin-members.ts): the filter menus' choices and the revenue by month.
import { and, asc, gte, sql } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import type { Tx as Db } from "./auth";
import { courses, payments, plans, refunds } from "../schema";

/** Courses and plans for the tables' filter menus. */
export async function filterChoices(db: Db) {
  const [planRows, courseRows] = await Promise.all([
    db.select({ id: plans.id, name: plans.name }).from(plans).orderBy(asc(plans.name)),
    db.select({ id: courses.id, name: courses.title }).from(courses).orderBy(asc(courses.title)),
  ]);
  return { plans: planRows, courses: courseRows };
}

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
      .select({
        month: month(refunds.createdAt),
        currency: refunds.currency,
        refunds: sql<number>`(-sum(${refunds.amount}))::int`,
      })
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
