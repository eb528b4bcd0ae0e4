// A course's grades and rungs on its catalogue page: each tune, how far a student takes it before the
// next rung opens, and the taster as a link anyone can open.
import Link from "next/link";
import type { CoursePage } from "@/lib/catalogue/course-page";
import { tuneWords } from "@/lib/catalogue/tune-words";

export function CourseRungs({ page }: { page: CoursePage }) {
  return (
    <section aria-labelledby="ladder-title" className="flex flex-col gap-4">
      <h2 id="ladder-title" className="font-serif text-h3 font-semibold">
        The ladder
      </h2>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {page.grades.map((g) => (
          <section
            key={g.title}
            aria-label={`${page.title}, ${g.title}`}
            className="min-w-0 rounded-knot border border-line bg-sawdust p-4"
          >
            <h3 className="mb-2 font-semibold">{g.title}</h3>
            <ol className="flex flex-col gap-3">
              {g.rungs.map((r) => (
                <li key={r.tuneId} className="flex min-w-0 flex-col">
                  <span className="font-semibold break-words">
                    {`Rung ${r.position}: `}
                    {r.isTaster ? (
                      <Link href={`/catalogue/tunes/${r.tuneId}`}>{`${r.tuneTitle} (free taster)`}</Link>
                    ) : (
                      r.tuneTitle
                    )}
                  </span>
                  <span className="text-caption text-bark">{`${tuneWords(r)} · ${r.stageCount} stages`}</span>
                  <span className="text-caption text-bark">
                    {`Reach stage ${r.requiredStage}${r.requiredStageName ? ` (${r.requiredStageName})` : ""} to open the next rung.`}
                  </span>
                </li>
              ))}
            </ol>
          </section>
        ))}
      </div>
    </section>
  );
}
