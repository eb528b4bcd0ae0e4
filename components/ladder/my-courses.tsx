"use client";
// The student's courses with how far they have come and where to carry on.
import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { Card, CardTitle } from "@/components/ui/card";
import { LinkButton } from "@/components/ui/link-button";
import type { MyCourse, SuggestedCourse } from "@/lib/catalogue/api-types";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";

const RELATION: Record<MyCourse["relation"], string> = {
  active: "Enrolled",
  paused: "Enrolment paused",
  ended: "Enrolment ended",
  teaching: "You teach this course",
};

export function MyCourses() {
  const mine = useQuery({
    queryKey: ["courses", "mine"],
    queryFn: () => fetchJson<{ courses: MyCourse[]; suggestions: SuggestedCourse[] }>("/api/courses/mine"),
  });
  if (mine.isPending)
    return (
      <p role="status" className="text-bark">
        Loading your courses…
      </p>
    );
  if (mine.isError)
    return (
      <Alert tone="error" title="Your courses could not be loaded">
        {errorWords(mine.error)}
      </Alert>
    );
  const { courses, suggestions } = mine.data;
  return (
    <div className="flex flex-col gap-8">
      {courses.length === 0 ? (
        <Card tone="warm" className="flex max-w-prose flex-col gap-3">
          <CardTitle level={2}>You are not enrolled in a course yet</CardTitle>
          <p className="text-bark">
            Choose a course below (or in the catalogue), open its page and start it: its teacher follows you from then
            on.
          </p>
          <div>
            <LinkButton href="/catalogue" variant="secondary">
              Browse the catalogue
            </LinkButton>
          </div>
        </Card>
      ) : (
        <Enrolled courses={courses} />
      )}
      {suggestions.length ? <Suggestions list={suggestions} /> : null}
    </div>
  );
}

function Suggestions({ list }: { list: SuggestedCourse[] }) {
  return (
    <section aria-labelledby="next-courses" className="flex flex-col gap-3">
      <h2 id="next-courses" className="font-serif text-h3 font-semibold">
        Courses to start next
      </h2>
      <ul className="grid gap-4 md:grid-cols-2">
        {list.map((c) => (
          <Card as="li" key={c.id} className="flex min-w-0 flex-col gap-2">
            <CardTitle level={3}>
              <Link href={`/catalogue/courses/${encodeURIComponent(c.slug)}`} className="break-words">
                {c.title}
              </Link>
            </CardTitle>
            <p className="text-small text-bark">{`Led by ${c.teacherName} · ${c.grades} grades · ${c.tunes} tunes`}</p>
            <p className="text-bark">{c.summary}</p>
          </Card>
        ))}
      </ul>
    </section>
  );
}

function Enrolled({ courses }: { courses: MyCourse[] }) {
  return (
    <ul className="grid gap-4 md:grid-cols-2">
      {courses.map((c) => (
        <Card as="li" key={c.id} className="flex flex-col gap-3">
          <CardTitle level={2}>
            <Link href={`/learn/courses/${c.id}`}>{c.title}</Link>
          </CardTitle>
          <p className="text-small text-bark">{`${RELATION[c.relation]} · taught by ${c.teacherName}`}</p>
          <div className="flex flex-col gap-1">
            <p className="text-small font-semibold">{`${c.done} of ${c.rungs} rungs done`}</p>
            <progress
              max={c.rungs}
              value={c.done}
              className="h-2 w-full accent-spruce"
              aria-label={`${c.title}: ${c.done} of ${c.rungs} rungs done`}
            />
          </div>
          {c.next ? (
            <p>
              {"Next: "}
              <Link href={`/learn/tunes/${c.next.tuneId}`}>{c.next.tuneTitle}</Link>
            </p>
          ) : null}
          <div>
            <LinkButton
              href={`/learn/courses/${c.id}`}
              variant="secondary"
              size="sm"
            >{`Open the ladder of ${c.title}`}</LinkButton>
          </div>
        </Card>
      ))}
    </ul>
  );
}
