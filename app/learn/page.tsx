import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { Card, CardTitle } from "@/components/ui/card";
import { LinkButton } from "@/components/ui/link-button";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Today" };

function greeting(now: Date): string {
  const hour = now.getUTCHours(); // the person's own time zone comes with the "Today" page proper
  return hour < 12 ? "Good morning" : hour < 18 ? "Good afternoon" : "Good evening";
}

export default async function TodayPage() {
  // Layouts are not re-run on every client navigation, so the page checks too.
  const user = await requireArea("area:learn");
  const first = user.name.split(/\s+/)[0];
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-col gap-2">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Today</p>
        <h1 className="text-h2 font-semibold">
          {greeting(new Date())}, {first}
        </h1>
      </header>
      <Card tone="warm" className="flex max-w-prose flex-col gap-3">
        <CardTitle level={2}>Nothing to practise yet</CardTitle>
        <p className="text-bark">
          When your teacher gives you a tune, or you start a course, your next step will be waiting here: open
          assignments by due date, the next rung of your course and your teacher&apos;s latest feedback.
        </p>
        <div>
          <LinkButton href="/catalogue" variant="secondary">
            Browse the catalogue
          </LinkButton>
        </div>
      </Card>
    </PageContainer>
  );
}
