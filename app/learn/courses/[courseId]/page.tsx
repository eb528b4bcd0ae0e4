import type { Metadata } from "next";
import { StartCourse } from "@/components/billing/start-course";
import { LadderView } from "@/components/ladder/ladder-view";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Course ladder" };

export default async function LadderPage({ params }: { params: Promise<{ courseId: string }> }) {
  await requireArea("area:learn");
  const { courseId } = await params;
  return (
    <PageContainer>
      <QueryProvider>
        <StartCourse courseId={courseId} />
        <LadderView courseId={courseId} />
      </QueryProvider>
    </PageContainer>
  );
}
