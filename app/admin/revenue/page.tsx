import type { Metadata } from "next";
import { RevenueChart } from "@/components/admin/revenue-chart";
import { money } from "@/components/admin/format";
import { PageContainer } from "@/components/layout/page-container";
import { TableShell, TBody, Td, Th, THead } from "@/components/ui/table";
import { db } from "@/db/client";
import { requireArea } from "@/lib/auth/next-context";
import { revenueReport } from "@/lib/billing/admin/revenue";

export const metadata: Metadata = { title: "Revenue" };

export default async function RevenuePage() {
  await requireArea("area:admin");
  const report = await revenueReport(db(), new Date());
  return (
    <PageContainer className="flex flex-col gap-6">
      <h1 className="text-h2 font-semibold">Revenue</h1>
      <p className="text-bark">
        The last twelve months (UTC), and any later month the payment service has already dated money to, by the month
        money was taken or given back. Plan changes count with renewals.
      </p>
      {report.currencies.length === 0 ? <p>No payments in the last twelve months.</p> : null}
      {report.currencies.map((currency) => {
        const rows = report.rows.filter((r) => r.currency === currency);
        return (
          <section key={currency} className="flex flex-col gap-4">
            <h2 className="font-serif text-h3">{currency}</h2>
            <RevenueChart currency={currency} rows={rows} />
            <TableShell caption={`Revenue by month in ${currency}`}>
              <THead>
                <tr>
                  <Th>Month</Th>
                  <Th className="text-right">New</Th>
                  <Th className="text-right">Renewals</Th>
                  <Th className="text-right">Refunds</Th>
                  <Th className="text-right">Net</Th>
                </tr>
              </THead>
              <TBody>
                {rows.map((r) => (
                  <tr key={r.month}>
                    <Td>{r.month}</Td>
                    <Td className="text-right">{money(r.new, currency)}</Td>
                    <Td className="text-right">{money(r.renewals, currency)}</Td>
                    <Td className="text-right">{money(r.refunds, currency)}</Td>
                    <Td className="text-right font-semibold">{money(r.net, currency)}</Td>
                  </tr>
                ))}
              </TBody>
            </TableShell>
          </section>
        );
      })}
    </PageContainer>
  );
}
