// The lists of the Today page: open assignments by due date, the next rung of each course and the
// teacher's latest feedback. Server-rendered: no state of their own.
import Link from "next/link";
import type { ReactNode } from "react";
import { Card, CardTitle } from "@/components/ui/card";
import type { TodayData } from "@/lib/teaching/today";

export function AssignmentList({ items }: { items: TodayData["assignments"] }) {
  if (items.length === 0)
    return <p className="text-bark">No assignments. When your teacher gives you a tune, it appears here.</p>;
  return (
    <ul className="flex flex-col gap-3" aria-label="Assignments">
      {items.map((a) => (
        <Card as="li" key={a.assignmentStudentId} className={a.overdue ? "border-l-4 border-l-berry" : undefined}>
          <p className="font-semibold">
            <Link href={`/learn/assignments/${a.assignmentStudentId}`}>{a.tuneTitle}</Link>
            {a.overdue ? (
              <span className="ml-2 rounded-knot bg-berry-tint px-2 py-0.5 text-small font-semibold text-berry">
                Overdue
              </span>
            ) : null}
            {a.stageCount > 0 && a.signedOff === a.stageCount ? (
              <span className="ml-2 rounded-knot bg-spruce-tint px-2 py-0.5 text-small font-semibold text-spruce">
                Done
              </span>
            ) : null}
          </p>
          <p className="text-small text-bark">{`Due ${a.dueLocal} · from ${a.teacherName}`}</p>
          <p className="text-small">
            {`${a.signedOff} of ${a.stageCount} stages signed off`}
            {a.current ? ` · stage ${a.current.index} ${a.current.waiting ? "waits for your teacher" : "is open"}` : ""}
          </p>
        </Card>
      ))}
    </ul>
  );
}

export function NextRungs({ items }: { items: TodayData["nextRungs"] }) {
  if (items.length === 0)
    return (
      <p className="text-bark">
        No course in progress. <Link href="/learn/courses">See your courses</Link>.
      </p>
    );
  return (
    <ul className="flex flex-col gap-2" aria-label="Next rung on each course">
      {items.map((r) => (
        <li key={r.courseId}>
          <Link href={`/learn/tunes/${r.tuneId}`} className="font-semibold">
            {r.tuneTitle}
          </Link>
          <span className="text-small text-bark">{` — ${r.courseTitle}, ${r.gradeTitle}, rung ${r.position}`}</span>
        </li>
      ))}
    </ul>
  );
}

export function RecentFeedback({ items }: { items: TodayData["feedback"] }) {
  if (items.length === 0)
    return <p className="text-bark">No feedback yet. After you check in, your teacher&apos;s words appear here.</p>;
  return (
    <ul className="flex flex-col gap-3" aria-label="Recent feedback">
      {items.map((f) => (
        <li key={f.checkInId} className="border-l-4 border-line pl-3">
          <p className="text-small text-bark">
            <Link href={`/learn/assignments/${f.assignmentStudentId}`}>{`${f.tuneTitle}, stage ${f.stageIndex}`}</Link>
            {` · ${f.outcome === "signed_off" ? "signed off" : "needs more time"} · ${f.reviewerName}`}
          </p>
          <blockquote className="mt-1 whitespace-pre-line">{f.feedback}</blockquote>
        </li>
      ))}
    </ul>
  );
}

export function CardSection({ title, children }: { title: string; children: ReactNode }) {
  return (
    <Card as="section" className="flex flex-col gap-3">
      <CardTitle level={2}>{title}</CardTitle>
      {children}
    </Card>
  );
}
