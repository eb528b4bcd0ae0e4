import type { Metadata } from "next";
import { Suspense } from "react";
import { EnrolmentsTable } from "@/components/admin/enrolments-table";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { db } from "@/db/client";
import { filterChoices } from "@/db/queries/admin-money";
import { teachingStaff } from "@/db/queries/enrolments";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Enrolments" };

export default async function EnrolmentsPage() {
  await requireArea("area:admin");
  const [{ plans, courses }, staff] = await Promise.all([filterChoices(db()), teachingStaff(db())]);
  const teachers = staff.map((s) => ({ id: s.id, name: s.name }));
  return (
    <PageContainer className="flex flex-col gap-6">
      <h1 className="text-h2 font-semibold">Enrolments</h1>
      <QueryProvider>
        <Suspense fallback={<p>Loading enrolments…</p>}>
          <EnrolmentsTable plans={plans} courses={courses} teachers={teachers} />
        </Suspense>
      </QueryProvider>
    </PageContainer>
  );
}
