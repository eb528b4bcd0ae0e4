import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { AssignForm } from "@/components/teaching/assign-form";
import { db } from "@/db/client";
import { findUserById } from "@/db/queries/auth";
import { assignFormData } from "@/db/queries/teaching-assign";
import { requireArea } from "@/lib/auth/next-context";
import { storedPlan } from "@/lib/tunes/schemas";
import { isTimeZone, instantToZonedLocal } from "@/lib/teaching/teach-time";

export const metadata: Metadata = { title: "Assign a tune" };

type Search = Promise<{
  tune?: string | string[];
  student?: string | string[];
}>;
const one = (v: string | string[] | undefined) => (typeof v === "string" ? v : undefined);

export default async function AssignPage({ searchParams }: { searchParams: Search }) {
  const user = await requireArea("area:teach");
  const q = await searchParams;
  const data = await assignFormData(db(), user.role === "admin" ? null : user.id);
  const me = await findUserById(db(), user.id);
  const zone = me && isTimeZone(me.timeZone) ? me.timeZone : "UTC";
  // A week ahead at six in the evening, the teacher's clock: a common rhythm of weekly lessons.
  const defaultDue = `${instantToZonedLocal(new Date(Date.now() + 7 * 86_400_000), zone).slice(0, 10)}T18:00`;
  return (
    <PageContainer className="flex flex-col gap-6">
      <header>
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Assign</p>
        <h1 className="text-h2 font-semibold">Assign a tune</h1>
      </header>
      <AssignForm
        tunes={data.tunes.map((t) => ({
          id: t.id,
          title: t.title,
          stagePlan: storedPlan(t.stagePlan),
        }))}
        students={data.students}
        teacherZone={zone}
        defaultDue={defaultDue}
        tuneId={one(q.tune)}
        studentId={one(q.student)}
      />
    </PageContainer>
  );
}
