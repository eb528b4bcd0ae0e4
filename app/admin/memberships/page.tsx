import type { Metadata } from "next";
import { Suspense } from "react";
import { MembershipsTable } from "@/components/admin/memberships-table";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { db } from "@/db/client";
import { filterChoices } from "@/db/queries/admin-money";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Memberships" };

export default async function MembershipsPage() {
  await requireArea("area:admin");
  const { plans } = await filterChoices(db());
  return (
    <PageContainer className="flex flex-col gap-6">
      <h1 className="text-h2 font-semibold">Memberships</h1>
      <QueryProvider>
        <Suspense fallback={<p>Loading memberships…</p>}>
          <MembershipsTable plans={plans} />
        </Suspense>
      </QueryProvider>
    </PageContainer>
  );
}
