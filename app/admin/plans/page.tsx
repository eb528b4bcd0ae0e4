import type { Metadata } from "next";
import { PlansAdmin } from "@/components/billing/plans-admin";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Membership plans" };

export default async function AdminPlansPage() {
  await requireArea("plans:manage");
  return (
    <PageContainer className="flex flex-col gap-6">
      <h1 className="text-h2 font-semibold">Membership plans</h1>
      <p className="max-w-prose text-bark">
        Each plan is a product with one price in Stripe. A new price applies to new members; existing members keep the
        price they joined at. A plan anyone has used can be retired (closed to new members) but not deleted.
      </p>
      <QueryProvider>
        <PlansAdmin />
      </QueryProvider>
    </PageContainer>
  );
}
