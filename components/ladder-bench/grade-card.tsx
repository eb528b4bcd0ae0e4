"use client";
// One grade: its title, its rungs in order (drag, or Move up / Move down), and a form to add one.
import { useSortable } from "@dnd-kit/sortable";
import { CSS } from "@dnd-kit/utilities";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { inlineControl } from "./inline-control";
import type { GradeView } from "@/lib/courses/api-types";
import { AddRungForm, type AddRungFormProps } from "./add-rung-form";
import { DragHandle } from "./drag-handle";
import { RungRow } from "./rung-row";
import { SortableList } from "./sortable-list";

export interface GradeCardProps {
  courseId: string;
  grade: GradeView;
  /** 1-based number of the first rung of this grade on the whole ladder. */
  firstNumber: number;
  isFirst: boolean;
  isLast: boolean;
  /** The ladder's last rung id, and first: a rung moves across grades at their edges. */
  ladderEnds: { first: string | null; last: string | null };
  usedTunes: ReadonlySet<string>;
  busy: boolean;
  onMoveGrade: (step: -1 | 1) => void;
  onRename: (title: string) => void;
  onRemove: () => void;
  onMoveRung: (rungId: string, step: -1 | 1) => void;
  onDropRung: (from: number, to: number) => void;
  onPatchRung: (rungId: string, set: { requiredStage?: number; isTaster?: boolean }) => void;
  onRemoveRung: (rungId: string) => void;
  onAddRung: AddRungFormProps["onAdd"];
}

export function GradeCard(p: GradeCardProps) {
  const { grade } = p;
  const { attributes, listeners, setNodeRef, transform, transition, isDragging } = useSortable({ id: grade.id });
  const [title, setTitle] = useState(grade.title);
  const rename = (e: FormEvent): void => {
    e.preventDefault();
    if (title.trim() && title.trim() !== grade.title) p.onRename(title.trim());
  };
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      className={cx(
        "flex flex-col gap-3 rounded-knot border-2 border-line bg-sawdust p-4",
        isDragging && "z-10 shadow-lg",
      )}
      aria-label={grade.title}
    >
      <div className="flex flex-wrap items-center gap-2">
        <DragHandle label={`Drag ${grade.title}`} attributes={attributes} listeners={listeners} />
        <form onSubmit={rename} className="flex flex-1 flex-wrap items-center gap-2">
          <label htmlFor={`grade-title-${grade.id}`} className="sr-only">
            Title of {grade.title}
          </label>
          <input
            id={`grade-title-${grade.id}`}
            value={title}
            onChange={(e) => setTitle(e.target.value)}
            className={cx(inlineControl, "min-w-48 flex-1 font-serif text-h4 font-semibold")}
          />
          {title.trim() !== grade.title ? (
            <Button type="submit" needsScript size="sm" variant="secondary" disabled={p.busy}>
              Rename
            </Button>
          ) : null}
        </form>
        <Button size="sm" variant="quiet" disabled={p.isFirst || p.busy} onClick={() => p.onMoveGrade(-1)}>
          Move<span className="sr-only"> {grade.title}</span> up
        </Button>
        <Button size="sm" variant="quiet" disabled={p.isLast || p.busy} onClick={() => p.onMoveGrade(1)}>
          Move<span className="sr-only"> {grade.title}</span> down
        </Button>
        <Button
          size="sm"
          variant="quiet"
          disabled={p.busy}
          onClick={p.onRemove}
          aria-label={`Remove ${grade.title} and its rungs`}
        >
          Remove grade
        </Button>
      </div>
      {grade.rungs.length ? (
        <SortableList
          ids={grade.rungs.map((r) => r.id)}
          nameOf={(id) => grade.rungs.find((r) => r.id === id)?.tuneTitle ?? "the rung"}
          onMove={p.onDropRung}
        >
          <ol className="flex flex-col gap-2" aria-label={`Rungs of ${grade.title}`}>
            {grade.rungs.map((r, i) => (
              <RungRow
                key={r.id}
                rung={r}
                position={p.firstNumber + i}
                canMoveUp={r.id !== p.ladderEnds.first}
                canMoveDown={r.id !== p.ladderEnds.last}
                busy={p.busy}
                onMove={(step) => p.onMoveRung(r.id, step)}
                onPatch={(set) => p.onPatchRung(r.id, set)}
                onRemove={() => p.onRemoveRung(r.id)}
              />
            ))}
          </ol>
        </SortableList>
      ) : (
        <p className="text-small text-bark">No rungs in this grade yet.</p>
      )}
      <AddRungForm
        courseId={p.courseId}
        gradeId={grade.id}
        gradeTitle={grade.title}
        usedTunes={p.usedTunes}
        busy={p.busy}
        onAdd={p.onAddRung}
      />
    </li>
  );
}
