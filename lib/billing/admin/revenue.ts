// The revenue chart's figures: the last twelve calendar months (UTC), the current one included,
// every month present for every currency seen (a month without money is a zero bar, not a gap).
import type { Tx as Db } from "@/db/queries/auth";
import { revenueByMonth, type RevenueMonth } from "@/db/queries/admin-money";

export type RevenueReport = { months: string[]; currencies: string[]; rows: (RevenueMonth & { net: number })[] };

/** "YYYY-MM" of the twelve months ending with `now`'s, oldest first. */
export function lastTwelveMonths(now: Date): string[] {
  const out: string[] = [];
  for (let i = 11; i >= 0; i--) {
    const d = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - i, 1));
    out.push(d.toISOString().slice(0, 7));
  }
  return out;
}

export async function revenueReport(db: Db, now: Date): Promise<RevenueReport> {
  const months = lastTwelveMonths(now);
  const since = new Date(`${months[0]}-01T00:00:00Z`);
  const found = await revenueByMonth(db, since);
  const currencies = [...new Set(found.map((r) => r.currency))].sort();
  const byKey = new Map(found.map((r) => [`${r.month} ${r.currency}`, r]));
  const rows = currencies.flatMap((currency) =>
    months.map((month) => {
      const r = byKey.get(`${month} ${currency}`) ?? { month, currency, new: 0, renewals: 0, refunds: 0 };
      return { ...r, net: r.new + r.renewals + r.refunds };
    }),
  );
  return { months, currencies, rows };
}
