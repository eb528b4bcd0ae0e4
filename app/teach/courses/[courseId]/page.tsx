import type { Metadata } from "next";
import { LadderBench } from "@/components/ladder-bench/ladder-bench";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Ladder bench" };

export default async function LadderBenchPage({ params }: { params: Promise<{ courseId: string }> }) {
  await requireArea("area:teach"); // layouts are not re-run on client navigation
  const { courseId } = await params;
  return (
    <PageContainer>
      <QueryProvider>
        <LadderBench courseId={courseId} />
      </QueryProvider>
    </PageContainer>
  );
}
