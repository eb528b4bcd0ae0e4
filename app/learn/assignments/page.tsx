import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { AssignmentList } from "@/components/learn/today-lists";
import { db } from "@/db/client";
import { userZone } from "@/db/queries/learning";
import { requireArea } from "@/lib/auth/next-context";
import { assignmentList } from "@/lib/teaching/today";

export const metadata: Metadata = { title: "Assignments" };

/** Every active assignment, finished ones included (Today shows only the open ones). */
export default async function LearnAssignmentsPage() {
  const user = await requireArea("area:learn"); // layouts are not re-run on client navigation
  const zone = await userZone(db(), user.id);
  const items = await assignmentList(db(), { id: user.id, role: user.role }, zone, new Date(), { open: false });
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-col gap-1">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Assignments</p>
        <h1 className="text-h2 font-semibold">Your assignments</h1>
        <p className="text-small text-bark">{`Soonest due first; dates and times in your time zone (${zone}).`}</p>
      </header>
      <AssignmentList items={items} />
    </PageContainer>
  );
}
