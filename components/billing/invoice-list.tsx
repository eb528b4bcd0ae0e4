import Link from "next/link";
import { TableShell, TBody, Td, Th, THead } from "@/components/ui/table";
import type { BillingSummary } from "@/lib/billing/account";
import { formatMoney } from "@/lib/billing/money";

const KIND = { new: "First payment", renewal: "Renewal", plan_change: "Change of plan" } as const;
const STATUS = { paid: "Paid", failed: "Failed", refunded: "Refunded", partially_refunded: "Partly refunded" } as const;
const day = (iso: string) =>
  new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric" });

/** Invoices with amounts, refunds (as the admin tables show them) and a receipt each. */
export function InvoiceList({ payments }: { payments: BillingSummary["payments"] }) {
  if (payments.length === 0) return <p className="text-bark">No invoices yet.</p>;
  return (
    <TableShell caption="Invoices">
      <THead>
        <tr>
          <Th>Date</Th>
          <Th>What</Th>
          <Th>Amount</Th>
          <Th>Refunded</Th>
          <Th>Status</Th>
          <Th>Receipt</Th>
        </tr>
      </THead>
      <TBody>
        {payments.map((p) => (
          <tr key={p.id}>
            <Td>{day(p.createdAt)}</Td>
            <Td>{`${KIND[p.kind]}${p.planName ? ` · ${p.planName}` : ""}`}</Td>
            <Td>{formatMoney(p.amount, p.currency)}</Td>
            <Td>
              {p.refunds.length === 0
                ? "—"
                : p.refunds.map((r) => (
                    <span
                      key={r.id}
                      className="block"
                    >{`${formatMoney(r.amount, r.currency)} on ${day(r.createdAt)} (${r.reason})`}</span>
                  ))}
            </Td>
            <Td>{p.status === "failed" && p.failureMessage ? `Failed: ${p.failureMessage}` : STATUS[p.status]}</Td>
            <Td>
              {p.status === "failed" ? (
                "—"
              ) : (
                <Link href={`/learn/billing/receipts/${p.id}`}>{`Receipt ${p.receiptNumber ?? ""}`.trim()}</Link>
              )}
            </Td>
          </tr>
        ))}
      </TBody>
    </TableShell>
  );
}
