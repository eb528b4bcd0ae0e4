import type { Metadata } from "next";
import { CourseList } from "@/components/ladder-bench/course-list";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Courses" };

export default async function TeachCoursesPage() {
  const user = await requireArea("area:teach");
  return (
    <PageContainer className="flex flex-col gap-6">
      <header>
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Courses</p>
        <h1 className="text-h2 font-semibold">{user.role === "admin" ? "Every teacher's courses" : "Your courses"}</h1>
      </header>
      <QueryProvider>
        <CourseList showTeacher={user.role === "admin"} />
      </QueryProvider>
    </PageContainer>
  );
}
