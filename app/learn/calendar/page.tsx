import type { Metadata } from "next";
import Link from "next/link";
import { CalendarFeedCard } from "@/components/calendar/calendar-feed-card";
import { PageContainer } from "@/components/layout/page-container";
import { db } from "@/db/client";
import { requireArea } from "@/lib/auth/next-context";
import { currentCalendarToken, feedAddress } from "@/lib/calendar/tokens";

export const metadata: Metadata = { title: "Calendar feed" };

export default async function CalendarPage() {
  // Layouts are not re-run on every client navigation, so the page checks too.
  const user = await requireArea("area:learn");
  const token = await currentCalendarToken(db(), user.id);
  return (
    <PageContainer className="flex max-w-3xl flex-col gap-6">
      <p>
        <Link href="/learn">← Back to Today</Link>
      </p>
      <h1 className="text-h2 font-semibold">Due dates in your calendar</h1>
      <CalendarFeedCard initialUrl={token ? feedAddress(token) : null} audience="student" />
    </PageContainer>
  );
}
