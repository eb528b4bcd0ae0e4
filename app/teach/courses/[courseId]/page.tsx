import type { Metadata } from "next";
import { CourseBuilder } from "@/components/course-builder/course-builder";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Course builder" };

export default async function CourseBuilderPage({ params }: { params: Promise<{ courseId: string }> }) {
  await requireArea("area:teach"); // layouts are not re-run on client navigation
  const { courseId } = await params;
  return (
    <PageContainer>
      <QueryProvider>
        <CourseBuilder courseId={courseId} />
      </QueryProvider>
    </PageContainer>
  );
}
