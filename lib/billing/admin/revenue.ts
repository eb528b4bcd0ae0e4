// The revenue chart's figures: the last twelve calendar months (UTC), the current one included, and on to
// the latest month with money in it — payments are dated by the payment service's clock, which may run
// ahead of this machine's (the local stand-in's clock moves forward on request). Every month is present
// for every currency seen (a month without money is a zero bar, not a gap).
import type { Tx as Db } from "@/db/queries/auth";
import { revenueByMonth, type RevenueMonth } from "@/db/queries/admin-money";

export type RevenueReport = { months: string[]; currencies: string[]; rows: (RevenueMonth & { net: number })[] };

/** "YYYY-MM" of the twelve months ending with `now`'s, and of any month after it up to `latest`, oldest first. */
export function reportMonths(now: Date, latest?: string): string[] {
  const out: string[] = [];
  for (let i = -11; ; i++) {
    const month = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() + i, 1)).toISOString().slice(0, 7);
    if (i > 0 && (latest === undefined || month > latest)) return out;
    out.push(month);
  }
}

export async function revenueReport(db: Db, now: Date): Promise<RevenueReport> {
  const since = new Date(`${reportMonths(now)[0]}-01T00:00:00Z`);
  const found = await revenueByMonth(db, since);
  const months = reportMonths(
    now,
    found
      .map((r) => r.month)
      .sort()
      .at(-1),
  );
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
