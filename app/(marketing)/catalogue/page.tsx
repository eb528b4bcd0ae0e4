import type { Metadata } from "next";
import { db } from "@/db/client";
import { CourseOutline } from "@/components/catalogue/course-outline";
import { PageContainer } from "@/components/layout/page-container";
import { LinkButton } from "@/components/ui/link-button";
import { getCurrentUser } from "@/lib/auth/current-user";
import { catalogueCourses } from "@/lib/catalogue/catalogue";

export const metadata: Metadata = {
  title: "Catalogue",
  description: "Rosinwood's courses, grade by grade, with every tune on their ladders.",
};
export const dynamic = "force-dynamic"; // the catalogue changes when a teacher publishes

export default async function CataloguePage() {
  const [courses, user] = await Promise.all([catalogueCourses(db()), getCurrentUser()]);
  return (
    <PageContainer className="flex flex-col gap-8">
      <header className="flex flex-col gap-3">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Catalogue</p>
        <h1 className="text-h2 font-semibold">Courses and their tunes</h1>
        <p className="max-w-prose text-lead text-bark">
          Each course is a ladder of tunes, grade by grade. The first tune of every course is a free taster: open it,
          listen at any speed and try the core melody before you join.
        </p>
        {user?.role === "student" ? (
          <div>
            <LinkButton href="/learn/courses" variant="secondary">
              Go to my courses
            </LinkButton>
          </div>
        ) : null}
      </header>
      {courses.length === 0 ? (
        <p className="text-bark">No course is published yet. Please come back soon.</p>
      ) : (
        courses.map((c) => <CourseOutline key={c.id} course={c} />)
      )}
    </PageContainer>
  );
}
