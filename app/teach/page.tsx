import type { Metadata } from "next";
import { Suspense } from "react";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { NewMembers } from "@/components/teaching/new-members";
import { RosterTable } from "@/components/teaching/roster-table";
import { Card, CardTitle } from "@/components/ui/card";
import { LinkButton } from "@/components/ui/link-button";
import { db } from "@/db/client";
import { listRoster } from "@/db/queries/people";
import { countWaiting } from "@/db/queries/teaching-review";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Roster" };

export default async function RosterPage() {
  const user = await requireArea("area:teach");
  // Only this teacher's own students (the table's route is keyed by the signed-in person too); an admin sees everyone.
  const teacherId = user.role === "admin" ? null : user.id;
  const [roster, waiting] = await Promise.all([
    teacherId ? listRoster(db(), teacherId) : null,
    countWaiting(db(), teacherId), // the first thing to do on a teaching day: say so on the way in
  ]);
  const empty = roster !== null && roster.length === 0;
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-small font-semibold tracking-widest text-cedar uppercase">Roster</p>
          <h1 className="text-h2 font-semibold">{user.role === "admin" ? "Every student" : "Your students"}</h1>
        </div>
        <div className="flex flex-wrap gap-2">
          <LinkButton href="/teach/review" variant="secondary">
            {waiting ? `Review queue · ${waiting} waiting` : "Review queue"}
          </LinkButton>
          <LinkButton href="/teach/check-ins" variant="secondary">
            Self-paced check-ins
          </LinkButton>
          <LinkButton href="/teach/assign" variant="secondary">
            Assign a tune
          </LinkButton>
          <LinkButton href="/teach/invite">Invite students</LinkButton>
        </div>
      </header>
      <QueryProvider>
        <NewMembers />
      </QueryProvider>
      {empty ? (
        <Card tone="warm" className="max-w-prose">
          <CardTitle level={2}>No students yet</CardTitle>
          <p className="text-bark">Invite your students by e-mail; each one joins this roster when they accept.</p>
        </Card>
      ) : (
        <QueryProvider>
          {/* The table reads the address's query (useSearchParams): its own boundary, as every such client part has. */}
          <Suspense fallback={<p className="text-bark">Loading your students…</p>}>
            <RosterTable />
          </Suspense>
        </QueryProvider>
      )}
    </PageContainer>
  );
}
