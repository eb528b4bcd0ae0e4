"use client";
// A course's ladder for the signed-in student (issue 5 item 5), fetched from the ladder route.
import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import type { LadderJson } from "@/lib/catalogue/api-types";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import { PACE_NAME, paceWords } from "@/lib/teaching/climb-words";
import { RungItem } from "./rung-item";

export function LadderView({ courseId }: { courseId: string }) {
  const ladder = useQuery({
    queryKey: ["ladder", courseId],
    queryFn: () => fetchJson<LadderJson>(`/api/courses/${encodeURIComponent(courseId)}/ladder`),
  });
  if (ladder.isPending)
    return (
      <p role="status" className="text-bark">
        Loading the ladder…
      </p>
    );
  if (ladder.isError) {
    return (
      <Alert tone="error" title="The ladder could not be shown">
        <p>{errorWords(ladder.error)}</p>
        <p className="mt-2">
          <Link href="/learn/courses">Back to my courses</Link>
        </p>
      </Alert>
    );
  }
  const { course, standing, grades } = ladder.data;
  const all = grades.flatMap((g) => g.rungs);
  const done = all.filter((r) => r.state === "done").length;
  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-2">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Course ladder</p>
        <h1 className="text-h2 font-semibold">{course.title}</h1>
        <p className="text-bark">{`Taught by ${course.teacherName} · ${done} of ${all.length} rungs done`}</p>
        <p className="max-w-prose text-bark">{course.summary}</p>
        <p className="max-w-prose" data-testid="ladder-pace">
          <span className="font-semibold">{`${PACE_NAME[course.pace]} course. `}</span>
          {paceWords(course.pace, course.teacherName)}
        </p>
      </header>
      {standing.pathway === "taster" ? <Alert tone="warning">{standing.why}</Alert> : null}
      {grades.map((g) => (
        <section key={g.id} aria-labelledby={`grade-${g.id}`} className="flex flex-col gap-3">
          <h2 id={`grade-${g.id}`} className="font-serif text-h3 font-semibold">
            {g.title}
          </h2>
          {g.rungs.length === 0 ? <p className="text-bark">No tunes in this grade yet.</p> : null}
          <ol className="flex flex-col gap-3">
            {g.rungs.map((r) => (
              <RungItem
                key={r.rungId}
                rung={r}
                last={r.rungId === all[all.length - 1]?.rungId}
                climbing={standing.pathway === "ladder"}
              />
            ))}
          </ol>
        </section>
      ))}
    </div>
  );
}
