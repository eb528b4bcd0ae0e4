import type { Metadata } from "next";
import { Suspense } from "react";
import { PaymentsTable } from "@/components/admin/payments-table";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { db } from "@/db/client";
import { filterChoices } from "@/db/queries/admin-money";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Payments" };

export default async function PaymentsPage() {
  await requireArea("area:admin");
  const { plans } = await filterChoices(db());
  return (
    <PageContainer className="flex flex-col gap-6">
      <h1 className="text-h2 font-semibold">Payments</h1>
      <p className="text-bark">
        Every membership payment, refunds included. Sorting, filters and pages are worked out on the server; the CSV
        export carries the same filters.
      </p>
      <QueryProvider>
        <Suspense fallback={<p>Loading payments…</p>}>
          <PaymentsTable plans={plans} />
        </Suspense>
      </QueryProvider>
    </PageContainer>
  );
}
