import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { TunePage } from "@/components/tune-page/tune-page";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Tune" };

export default async function LearnTunePage({ params }: { params: Promise<{ tuneId: string }> }) {
  await requireArea("area:learn"); // layouts are not re-run on client navigation
  const { tuneId } = await params;
  return (
    <PageContainer>
      <QueryProvider>
        <TunePage tuneId={tuneId} area="learn" notes />
      </QueryProvider>
    </PageContainer>
  );
}
