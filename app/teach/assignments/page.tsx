import type { Metadata } from "next";
import { Suspense } from "react";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { AssignmentList } from "@/components/teaching/assignment-list";
import { LinkButton } from "@/components/ui/link-button";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Assignments" };

export default async function AssignmentsPage() {
  const user = await requireArea("area:teach");
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-small font-semibold tracking-widest text-cedar uppercase">Assignments</p>
          <h1 className="text-h2 font-semibold">
            {user.role === "admin" ? "Every teacher's assignments" : "Your assignments"}
          </h1>
        </div>
        <div className="flex flex-wrap gap-2">
          <LinkButton href="/teach/review" variant="secondary">
            Review queue
          </LinkButton>
          <LinkButton href="/teach/calendar" variant="secondary">
            Due dates in your calendar
          </LinkButton>
          <LinkButton href="/teach/assign">Assign a tune</LinkButton>
        </div>
      </header>
      <QueryProvider>
        <Suspense fallback={<p className="text-bark">Loading your assignments…</p>}>
          <AssignmentList />
        </Suspense>
      </QueryProvider>
    </PageContainer>
  );
}
