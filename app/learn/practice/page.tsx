import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { PracticeLog } from "@/components/learn/practice-log";
import { QueryProvider } from "@/components/providers/query-provider";
import { db } from "@/db/client";
import { userZone } from "@/db/queries/learning";
import { requireArea } from "@/lib/auth/next-context";
import { dayIn } from "@/lib/teaching/learn-dates";

export const metadata: Metadata = { title: "Practice log" };

export default async function PracticePage() {
  const user = await requireArea("area:learn"); // layouts are not re-run on client navigation
  const zone = await userZone(db(), user.id);
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-col gap-1">
        <h1 className="text-h2 font-semibold">Practice log</h1>
        <p className="text-small text-bark">{`Days are counted in your time zone (${zone}).`}</p>
      </header>
      <QueryProvider>
        <PracticeLog today={dayIn(zone)} />
      </QueryProvider>
    </PageContainer>
  );
}
