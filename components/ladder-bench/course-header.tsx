"use client";
// The course's title, summary and publish state, with what stands in the way of publishing.
import { useState, type FormEvent } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import type { CourseView } from "@/lib/courses/api-types";
import { courseInput } from "@/lib/courses/schemas";

export interface CourseHeaderProps {
  course: CourseView;
  busy: boolean;
  onSave: (v: { title: string; summary: string }) => void;
  onPublish: (published: boolean) => void;
}

export function CourseHeader({ course, busy, onSave, onPublish }: CourseHeaderProps) {
  const [title, setTitle] = useState(course.title);
  const [summary, setSummary] = useState(course.summary);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const changed = title !== course.title || summary !== course.summary;
  const submit = (e: FormEvent): void => {
    e.preventDefault();
    const parsed = courseInput.safeParse({ title, summary });
    if (!parsed.success)
      return setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
    setErrors({});
    onSave(parsed.data);
  };
  return (
    <header className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Ladder bench</p>
        <span
          className={
            course.published
              ? "rounded-sm bg-spruce-tint px-2 text-small font-semibold text-spruce"
              : "rounded-sm bg-sawdust px-2 text-small font-semibold text-bark"
          }
          data-testid="publish-state"
        >
          {course.published ? "Published" : "Not published"}
        </span>
      </div>
      <form onSubmit={submit} className="grid gap-3 md:grid-cols-[1fr_2fr_auto] md:items-end">
        <TextField
          name="title"
          label="Course title"
          value={title}
          onChange={(e) => setTitle(e.target.value)}
          error={errors.title}
        />
        <TextField
          name="summary"
          label="Summary"
          value={summary}
          onChange={(e) => setSummary(e.target.value)}
          error={errors.summary}
        />
        <Button type="submit" needsScript variant="secondary" disabled={!changed || busy}>
          Save title and summary
        </Button>
      </form>
      <div className="flex flex-wrap items-center gap-3">
        {course.published ? (
          <Button variant="secondary" onClick={() => onPublish(false)} disabled={busy}>
            Unpublish
          </Button>
        ) : (
          <Button onClick={() => onPublish(true)} disabled={busy || course.problems.length > 0}>
            Publish the course
          </Button>
        )}
        <span className="text-small text-bark">
          {course.published
            ? "Students and visitors can see it in the catalogue."
            : "Only you can see it until it is published."}
        </span>
      </div>
      {course.problems.length ? (
        <Alert tone="warning" title={course.published ? "Fix these" : "Before it can be published"}>
          <ul className="list-disc pl-5" data-testid="course-problems">
            {course.problems.map((p) => (
              <li key={p.message}>{p.message}</li>
            ))}
          </ul>
        </Alert>
      ) : null}
      {course.hints.length ? (
        <Alert tone="info" title="Worth knowing">
          <ul className="list-disc pl-5">
            {course.hints.map((h) => (
              <li key={h}>{h}</li>
            ))}
          </ul>
        </Alert>
      ) : null}
    </header>
  );
}
