"use client";
// Revenue by month (issue 7 item 6) with recharts: new and renewals stacked above zero, refunds
// below it (stackOffset "sign" stacks negatives downwards). Amounts stay in minor units; only the
// labels are formatted. The figures are also in the table under the chart, for screen readers.
import {
  Bar,
  BarChart,
  CartesianGrid,
  Legend,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { money } from "./format";

export type RevenueRow = {
  month: string;
  currency: string;
  new: number;
  renewals: number;
  refunds: number;
  net: number;
};

const monthLabel = (m: string) =>
  new Intl.DateTimeFormat("en-GB", { month: "short", year: "2-digit", timeZone: "UTC" }).format(
    new Date(`${m}-01T00:00:00Z`),
  );

export function RevenueChart({ currency, rows }: { currency: string; rows: RevenueRow[] }) {
  const fmt = (v: number) => money(v, currency);
  return (
    <div
      className="h-80 w-full"
      role="img"
      aria-label={`Revenue by month in ${currency}: new memberships and renewals above the line, refunds below it`}
    >
      <ResponsiveContainer width="100%" height="100%">
        <BarChart
          data={rows.map((r) => ({ ...r, label: monthLabel(r.month) }))}
          stackOffset="sign"
          margin={{ top: 8, right: 8, bottom: 8, left: 8 }}
        >
          <CartesianGrid strokeDasharray="3 3" stroke="#D9C8B0" />
          <XAxis dataKey="label" tick={{ fontSize: 12 }} />
          <YAxis tickFormatter={fmt} width={80} tick={{ fontSize: 12 }} />
          <Tooltip formatter={(v) => fmt(Number(v))} />
          <Legend />
          <ReferenceLine y={0} stroke="#24190F" />
          <Bar dataKey="new" name="New" stackId="money" fill="#2F5D3A" />
          <Bar dataKey="renewals" name="Renewals" stackId="money" fill="#E3A83E" />
          <Bar dataKey="refunds" name="Refunds" stackId="money" fill="#A4262C" />
        </BarChart>
      </ResponsiveContainer>
    </div>
  );
}
