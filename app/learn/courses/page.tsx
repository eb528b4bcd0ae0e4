import type { Metadata } from "next";
import { MyCourses } from "@/components/ladder/my-courses";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "My courses" };

export default async function MyCoursesPage() {
  await requireArea("area:learn");
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-col gap-2">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">My courses</p>
        <h1 className="text-h2 font-semibold">Your ladders</h1>
      </header>
      <QueryProvider>
        <MyCourses />
      </QueryProvider>
    </PageContainer>
  );
}
