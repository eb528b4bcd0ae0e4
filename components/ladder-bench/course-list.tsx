"use client";
// The teacher's courses and a form to start a new one (an admin sees every teacher's).
import { useMutation, useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import type { CourseSummary } from "@/lib/courses/api-types";
import { courseInput } from "@/lib/courses/schemas";
import { errorWords, teachFetch } from "@/lib/tunes/client-fetch";

export function CourseList({ showTeacher }: { showTeacher: boolean }) {
  const router = useRouter();
  const query = useQuery({
    queryKey: ["teach-courses"],
    queryFn: () => teachFetch<{ courses: CourseSummary[] }>("/api/teach/courses"),
  });
  const [title, setTitle] = useState("");
  const [fieldError, setFieldError] = useState<string | undefined>();
  const create = useMutation({
    mutationFn: (v: { title: string; summary: string }) =>
      teachFetch<{ id: string }>("/api/teach/courses", { method: "POST", body: v }),
    onSuccess: ({ id }) => router.push(`/teach/courses/${id}`),
  });
  const submit = (e: FormEvent): void => {
    e.preventDefault();
    const parsed = courseInput.safeParse({ title });
    setFieldError(parsed.success ? undefined : parsed.error.issues[0]?.message);
    if (parsed.success) create.mutate(parsed.data);
  };
  return (
    <div className="flex flex-col gap-6">
      <form onSubmit={submit} className="flex flex-wrap items-end gap-3 rounded-knot border border-line bg-paper p-4">
        <TextField
          name="title"
          label="New course"
          placeholder="e.g. First steps in jigs"
          value={title}
          onChange={(e) => setTitle(e.target.value)}
          error={fieldError}
        />
        <Button type="submit" needsScript disabled={create.isPending}>
          {create.isPending ? "Starting…" : "Start a course"}
        </Button>
      </form>
      {create.error ? (
        <Alert tone="error" live>
          {errorWords(create.error)}
        </Alert>
      ) : null}
      {query.isPending ? <p className="text-bark">Loading your courses…</p> : null}
      {query.isError ? <Alert tone="error">{errorWords(query.error)}</Alert> : null}
      {query.data ? (
        query.data.courses.length ? (
          <ul className="grid gap-3 md:grid-cols-2">
            {query.data.courses.map((c) => (
              <li key={c.id} className="flex flex-col gap-1 rounded-knot border border-line bg-paper p-4">
                <Link href={`/teach/courses/${c.id}`} className="font-serif text-h4 font-semibold">
                  {c.title}
                </Link>
                <p className="text-small text-bark">
                  {c.published ? "Published" : "Not published"} · {c.gradeCount} grade{c.gradeCount === 1 ? "" : "s"} ·{" "}
                  {c.rungCount} rung{c.rungCount === 1 ? "" : "s"}
                  {showTeacher ? ` · ${c.teacherName}` : ""}
                </p>
                {c.summary ? <p className="text-small">{c.summary}</p> : null}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-bark">No courses yet: start one above.</p>
        )
      ) : null}
    </div>
  );
}
