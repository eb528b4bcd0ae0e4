import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { AssignmentList, CardSection, NextRungs, RecentFeedback } from "@/components/learn/today-lists";
import { MinutesChart } from "@/components/learn/minutes-chart";
import { LinkButton } from "@/components/ui/link-button";
import { db } from "@/db/client";
import { requireArea } from "@/lib/auth/next-context";
import { todayFor } from "@/lib/teaching/today";

export const metadata: Metadata = { title: "Today" };

function greeting(now: Date, zone: string): string {
  const hour =
    Number(new Intl.DateTimeFormat("en-GB", { timeZone: zone, hour: "numeric", hour12: false }).format(now)) % 24;
  return hour < 12 ? "Good morning" : hour < 18 ? "Good afternoon" : "Good evening";
}

function streakWords(streak: number, practisedToday: boolean): string {
  if (streak === 0) return "No streak yet: log some practice today to start one.";
  const days = `${streak} day${streak === 1 ? "" : "s"} in a row`;
  return practisedToday ? `${days}, today included.` : `${days} up to yesterday: practise today to keep it going.`;
}

export default async function TodayPage() {
  // Layouts are not re-run on every client navigation, so the page checks too.
  const user = await requireArea("area:learn");
  const now = new Date();
  const data = await todayFor(db(), { id: user.id, role: user.role }, now);
  const first = user.name.split(/\s+/)[0];
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-col gap-2">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Today</p>
        <h1 className="text-h2 font-semibold">{`${greeting(now, data.timeZone)}, ${first}`}</h1>
        <p className="text-small text-bark">{`Dates and times in your time zone (${data.timeZone}).`}</p>
      </header>
      <div className="grid gap-6 lg:grid-cols-2">
        <CardSection title="Your assignments">
          <AssignmentList items={data.assignments} />
          <div className="flex flex-wrap gap-2">
            <LinkButton href="/learn/assignments" variant="secondary" size="sm">
              All assignments
            </LinkButton>
            <LinkButton href="/learn/calendar" variant="secondary" size="sm">
              Due dates in your calendar
            </LinkButton>
          </div>
        </CardSection>
        <CardSection title="Next on your courses">
          <NextRungs items={data.nextRungs} />
        </CardSection>
        <CardSection title="Practice">
          <p className="font-semibold" data-testid="streak">
            {streakWords(data.streak, data.practisedToday)}
          </p>
          <MinutesChart days={data.minutes} />
          <div>
            <LinkButton href="/learn/practice" variant="secondary" size="sm">
              Log practice
            </LinkButton>
          </div>
        </CardSection>
        <CardSection title="Recent feedback">
          <RecentFeedback items={data.feedback} />
        </CardSection>
      </div>
    </PageContainer>
  );
}
