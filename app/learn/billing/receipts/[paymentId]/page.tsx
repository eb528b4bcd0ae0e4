import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { db } from "@/db/client";
import { paymentsOf } from "@/db/queries/billing";
import { PrintButton } from "@/components/billing/print-button";
import { PageContainer } from "@/components/layout/page-container";
import { requireArea } from "@/lib/auth/next-context";
import { formatDay, formatMoney } from "@/lib/billing/money";
import { env } from "@/lib/env";

export const metadata: Metadata = { title: "Receipt" };

const KIND = {
  new: "Membership, first payment",
  renewal: "Membership renewal",
  plan_change: "Change of plan",
} as const;

/** One's own payment only: another person's, or none, is "not found". */
export default async function ReceiptPage({ params }: { params: Promise<{ paymentId: string }> }) {
  const user = await requireArea("billing:manage");
  const { paymentId } = await params;
  if (!/^[0-9a-f-]{36}$/i.test(paymentId)) notFound();
  const [p] = await paymentsOf(db(), user.id, paymentId);
  if (!p || p.status === "failed") notFound();
  const refunded = p.refunds.reduce((s, r) => s + r.amount, 0);
  return (
    <PageContainer className="flex max-w-prose flex-col gap-6 print:py-0">
      <header className="flex flex-col gap-1">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">{env().SCHOOL_NAME} · Rosinwood</p>
        <h1 className="text-h2 font-semibold">Receipt {p.receiptNumber ?? p.stripeInvoiceId}</h1>
        <p className="text-bark">
          Paid on {formatDay(p.createdAt)} by {user.name} ({user.email})
        </p>
      </header>
      <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-2">
        <dt className="font-semibold">For</dt>
        <dd>{`${KIND[p.kind]}${p.planName ? `: ${p.planName}` : ""}`}</dd>
        {p.periodStart && p.periodEnd ? (
          <>
            <dt className="font-semibold">Period</dt>
            <dd>{`${formatDay(p.periodStart)} to ${formatDay(p.periodEnd)}`}</dd>
          </>
        ) : null}
        <dt className="font-semibold">Amount paid</dt>
        <dd>{formatMoney(p.amount, p.currency)}</dd>
        {p.refunds.map((r) => (
          <div key={r.id} className="contents">
            <dt className="font-semibold">Refunded {formatDay(r.createdAt)}</dt>
            <dd>{`${formatMoney(r.amount, r.currency)} (${r.reason})`}</dd>
          </div>
        ))}
        {refunded > 0 ? (
          <>
            <dt className="font-semibold">Net paid</dt>
            <dd>{formatMoney(p.amount - refunded, p.currency)}</dd>
          </>
        ) : null}
      </dl>
      <PrintButton />
    </PageContainer>
  );
}
