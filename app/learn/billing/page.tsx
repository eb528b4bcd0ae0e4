import type { Metadata } from "next";
import { BillingView } from "@/components/billing/billing-view";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Billing" };

export default async function BillingPage({
  searchParams,
}: {
  searchParams: Promise<{ card?: string; welcome?: string }>;
}) {
  await requireArea("billing:manage");
  const q = await searchParams;
  const notice =
    q.card === "updated"
      ? "Your new card is saved. Any unpaid invoice is being paid with it."
      : q.welcome
        ? "Welcome: your membership is active."
        : null;
  return (
    <PageContainer className="flex flex-col gap-6">
      <h1 className="text-h2 font-semibold">Billing</h1>
      <QueryProvider>
        <BillingView notice={notice} />
      </QueryProvider>
    </PageContainer>
  );
}
