import type { Metadata } from "next";
import { MyCourses } from "@/components/ladder/my-courses";
import { Alert } from "@/components/ui/alert";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "My courses" };

export default async function MyCoursesPage({ searchParams }: { searchParams: Promise<{ welcome?: string }> }) {
  await requireArea("area:learn");
  const { welcome } = await searchParams;
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-col gap-2">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">My courses</p>
        <h1 className="text-h2 font-semibold">Your ladders</h1>
      </header>
      {welcome ? (
        <Alert tone="success" title="Welcome to the school">
          Your membership is active. Choose a course and start it: its teacher follows you from your first step.
        </Alert>
      ) : null}
      <QueryProvider>
        <MyCourses />
      </QueryProvider>
    </PageContainer>
  );
}
