// The one next step a course's page offers whoever is looking: join, start, carry on, or why not.
import type { ReactNode } from "react";
import Link from "next/link";
import { Card } from "@/components/ui/card";
import { LinkButton } from "@/components/ui/link-button";
import type { CoursePage } from "@/lib/catalogue/course-page";

export function CourseOffer({ page, start }: { page: CoursePage; start: ReactNode }) {
  const o = page.offer;
  const ladder = `/learn/courses/${encodeURIComponent(page.slug)}`;
  const taster = page.taster ? (
    <p className="text-small text-bark">
      {"The first tune is a free taster, open to everyone: "}
      <Link href={`/catalogue/tunes/${page.taster.tuneId}`}>{`play “${page.taster.tuneTitle}” now`}</Link>.
    </p>
  ) : null;
  return (
    <Card tone="warm" className="flex max-w-prose flex-col gap-3" data-testid="course-offer">
      {o.kind === "join" ? (
        <>
          <p>Join the school to walk this ladder rung by rung with a teacher beside you.</p>
          <div>
            <LinkButton href={o.href}>Join to start</LinkButton>
          </div>
        </>
      ) : o.kind === "plan" ? (
        <>
          <p>{o.why}</p>
          <div>
            <LinkButton href={o.href}>Choose a membership plan</LinkButton>
          </div>
        </>
      ) : o.kind === "start" ? (
        <>
          <p>{`Your membership opens this course. Start it and ${page.teacherName} will follow you on it.`}</p>
          {start}
        </>
      ) : o.kind === "open" ? (
        <>
          <p>You are enrolled in this course.</p>
          <div>
            <LinkButton href={ladder}>Open your ladder</LinkButton>
          </div>
        </>
      ) : o.kind === "held" ? (
        <p>{o.why}</p>
      ) : (
        <p>
          You teach or run this course: <Link href={ladder}>see its ladder</Link>.
        </p>
      )}
      {taster}
    </Card>
  );
}
