import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { AssignmentView } from "@/components/learn/assignment-view";
import { QueryProvider } from "@/components/providers/query-provider";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Assignment" };

export default async function LearnAssignmentPage({ params }: { params: Promise<{ assignmentStudentId: string }> }) {
  await requireArea("area:learn"); // layouts are not re-run on client navigation
  const { assignmentStudentId } = await params;
  return (
    <PageContainer>
      <QueryProvider>
        <AssignmentView assignmentStudentId={assignmentStudentId} />
      </QueryProvider>
    </PageContainer>
  );
}
