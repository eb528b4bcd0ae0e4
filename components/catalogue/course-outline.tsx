// One course of the public catalogue: its grades and tune titles; the taster rungs are links that
// anyone can open and play. A server component: the catalogue ships no JavaScript of its own.
import Link from "next/link";
import type { CatalogueCourse } from "@/lib/catalogue/api-types";
import { Card } from "@/components/ui/card";
import { tuneWords } from "@/lib/catalogue/tune-words";

export function CourseOutline({ course }: { course: CatalogueCourse }) {
  const tunes = course.grades.reduce((n, g) => n + g.rungs.length, 0);
  return (
    <Card as="article" aria-labelledby={`course-${course.slug}`} className="flex flex-col gap-4">
      <header className="flex flex-col gap-1">
        <h2 id={`course-${course.slug}`} className="font-serif text-h3 font-semibold">
          <Link href={`/catalogue/courses/${encodeURIComponent(course.slug)}`}>{course.title}</Link>
        </h2>
        <p className="text-small text-bark">{`Taught by ${course.teacherName} · ${course.grades.length} grades · ${tunes} tunes`}</p>
      </header>
      <p className="max-w-prose text-bark">{course.summary}</p>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {course.grades.map((g) => (
          <section
            key={g.title}
            aria-label={`${course.title}, ${g.title}`}
            className="rounded-knot border border-line bg-sawdust p-4"
          >
            <h3 className="mb-2 font-semibold">{g.title}</h3>
            <ol className="flex flex-col gap-2">
              {g.rungs.map((r) => (
                <li key={r.tuneId} className="flex flex-col">
                  {r.isTaster ? (
                    <Link href={`/catalogue/tunes/${r.tuneId}`} className="font-semibold">
                      {r.tuneTitle}
                      <span className="ml-2 inline-block rounded-sm border border-spruce px-1 text-caption font-semibold text-spruce no-underline">
                        Free taster: play it now
                      </span>
                    </Link>
                  ) : (
                    <span>{r.tuneTitle}</span>
                  )}
                  <span className="text-caption text-bark">{tuneWords(r)}</span>
                </li>
              ))}
            </ol>
          </section>
        ))}
      </div>
    </Card>
  );
}
