"use client";
// The ladder bench (issue 5 item 1): grades and rungs, reordered by drag or by Move up/down,
// each rung with the stage that opens the next; publish and unpublish; the rules' messages.
import { useState, type FormEvent } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { moved, moveGrade, moveRung, orderOf, type LadderOrder } from "@/lib/courses/rules";
import { errorWords } from "@/lib/tunes/client-fetch";
import { CourseHeader } from "./course-header";
import { CourseSettings } from "./course-settings";
import { GradeCard } from "./grade-card";
import { SortableList } from "./sortable-list";
import { useCourse, useCourseAction, useReorder } from "./use-course";

export function LadderBench({ courseId }: { courseId: string }) {
  const query = useCourse(courseId);
  const action = useCourseAction(courseId);
  const reorder = useReorder(courseId);
  const [gradeTitle, setGradeTitle] = useState("");
  if (query.isPending) return <p className="text-bark">Loading the course…</p>;
  if (query.isError) return <Alert tone="error">{errorWords(query.error)}</Alert>;
  const course = query.data;
  const busy = action.isPending || reorder.isPending;
  const order = orderOf(course.grades);
  const send = (next: LadderOrder | null): void => {
    if (next) reorder.mutate(next);
  };
  const allRungs = course.grades.flatMap((g) => g.rungs);
  const usedTunes = new Set(allRungs.map((r) => r.tuneId));
  const ends = { first: allRungs[0]?.id ?? null, last: allRungs[allRungs.length - 1]?.id ?? null };
  const error = action.error ?? reorder.error;
  const addGrade = (e: FormEvent): void => {
    e.preventDefault();
    action.mutate(
      { path: "/grades", method: "POST", body: { title: gradeTitle || `Grade ${course.grades.length + 1}` } },
      { onSuccess: () => setGradeTitle("") },
    );
  };
  let number = 1;

  return (
    <div className="flex flex-col gap-6">
      <CourseHeader
        key={`${course.title}|${course.summary}`}
        course={course}
        busy={busy}
        onSave={(v) => action.mutate({ path: "", method: "PATCH", body: v })}
        onPublish={(published) => action.mutate({ path: "", method: "PATCH", body: { published } })}
      />
      <CourseSettings
        key={`${course.leadTeacherId}|${course.pace}`}
        course={course}
        busy={busy}
        onSave={(v) => action.mutate({ path: "", method: "PATCH", body: v })}
      />
      {error ? (
        <Alert tone="error" live title="Not changed">
          {errorWords(error)}
        </Alert>
      ) : null}
      <section aria-labelledby="ladder-heading" className="flex flex-col gap-3">
        <h2 id="ladder-heading" className="font-serif text-h3 font-semibold">
          Ladder
        </h2>
        <p className="text-small text-bark">
          Students climb from the top. Drag a rung or grade by its grip, or use Move up and Move down; a rung moves into
          the next grade at a grade&apos;s edge.
        </p>
        <SortableList
          ids={course.grades.map((g) => g.id)}
          nameOf={(id) => course.grades.find((g) => g.id === id)?.title ?? "the grade"}
          onMove={(from, to) => send({ grades: moved(order.grades, from, to) })}
        >
          <ol className="flex flex-col gap-4">
            {course.grades.map((g, gi) => {
              const first = number;
              number += g.rungs.length;
              return (
                <GradeCard
                  key={`${g.id}|${g.title}`}
                  courseId={courseId}
                  grade={g}
                  firstNumber={first}
                  isFirst={gi === 0}
                  isLast={gi === course.grades.length - 1}
                  ladderEnds={ends}
                  usedTunes={usedTunes}
                  busy={busy}
                  onMoveGrade={(step) => send(moveGrade(order, g.id, step))}
                  onRename={(title) => action.mutate({ path: `/grades/${g.id}`, method: "PATCH", body: { title } })}
                  onRemove={() => {
                    if (g.rungs.length === 0 || window.confirm(`Remove ${g.title} and its ${g.rungs.length} rung(s)?`))
                      action.mutate({ path: `/grades/${g.id}`, method: "DELETE" });
                  }}
                  onMoveRung={(rungId, step) => send(moveRung(order, rungId, step))}
                  onDropRung={(from, to) =>
                    send({
                      grades: order.grades.map((o) =>
                        o.id === g.id ? { id: o.id, rungs: moved(o.rungs, from, to) } : o,
                      ),
                    })
                  }
                  onPatchRung={(rungId, set) => action.mutate({ path: `/rungs/${rungId}`, method: "PATCH", body: set })}
                  onRemoveRung={(rungId) => action.mutate({ path: `/rungs/${rungId}`, method: "DELETE" })}
                  onAddRung={(v) => action.mutate({ path: "/rungs", method: "POST", body: v })}
                />
              );
            })}
          </ol>
        </SortableList>
        <form onSubmit={addGrade} className="flex flex-wrap items-end gap-3">
          <TextField
            name="gradeTitle"
            label="New grade"
            placeholder={`Grade ${course.grades.length + 1}`}
            value={gradeTitle}
            onChange={(e) => setGradeTitle(e.target.value)}
          />
          <Button type="submit" needsScript variant="secondary" disabled={busy}>
            Add a grade
          </Button>
        </form>
      </section>
    </div>
  );
}
