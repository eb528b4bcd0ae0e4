import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { AssignmentList } from "@/components/learn/today-lists";
import { AssignmentPageNav } from "@/components/teaching/assignment-page-nav";
import { LinkButton } from "@/components/ui/link-button";
import { db } from "@/db/client";
import { userZone } from "@/db/queries/learning";
import { requireArea } from "@/lib/auth/next-context";
import { assignmentsPage } from "@/lib/teaching/teach-schemas";
import { assignmentPage } from "@/lib/teaching/today";

export const metadata: Metadata = { title: "Assignments" };

/** Every active assignment, finished ones included (Today shows only the open ones), 20 to a page. */
export default async function LearnAssignmentsPage(props: { searchParams: Promise<{ page?: string | string[] }> }) {
  const user = await requireArea("area:learn"); // layouts are not re-run on client navigation
  // The teacher's list's rule for `page`; where it refuses (page=0, page=x), this page shows the first,
  // and a page past the last shows the last (assignmentPage).
  const asked = assignmentsPage.safeParse({ page: (await props.searchParams).page });
  const wanted = asked.success ? asked.data.page : 1;
  const zone = await userZone(db(), user.id);
  const { items, total, page, pages } = await assignmentPage(
    db(),
    { id: user.id, role: user.role },
    zone,
    new Date(),
    wanted,
  );
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-col gap-1">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Assignments</p>
        <h1 className="text-h2 font-semibold">Your assignments</h1>
        <p className="text-small text-bark">{`Still to do first, soonest due; finished ones after, latest first. Dates and times in your time zone (${zone}).`}</p>
      </header>
      <AssignmentList items={items} />
      {pages > 1 ? (
        <AssignmentPageNav
          page={page}
          pages={pages}
          total={total}
          previous={
            page > 1 ? (
              <LinkButton href={`/learn/assignments?page=${page - 1}`} variant="secondary" size="sm">
                Previous
              </LinkButton>
            ) : null
          }
          next={
            page < pages ? (
              <LinkButton href={`/learn/assignments?page=${page + 1}`} variant="secondary" size="sm">
                Next
              </LinkButton>
            ) : null
          }
        />
      ) : null}
    </PageContainer>
  );
}
