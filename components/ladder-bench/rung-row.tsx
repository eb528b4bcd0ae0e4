"use client";
// One rung: its tune, the stage that opens the next rung, whether it is a taster, and moving it.
import { useSortable } from "@dnd-kit/sortable";
import { CSS } from "@dnd-kit/utilities";
import Link from "next/link";
import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { inlineControl } from "./inline-control";
import type { RungView } from "@/lib/courses/api-types";
import { DragHandle } from "./drag-handle";

export interface RungRowProps {
  rung: RungView;
  position: number;
  canMoveUp: boolean;
  canMoveDown: boolean;
  busy: boolean;
  onMove: (step: -1 | 1) => void;
  onPatch: (set: { requiredStage?: number; isTaster?: boolean }) => void;
  onRemove: () => void;
}

export function RungRow({ rung, position, canMoveUp, canMoveDown, busy, onMove, onPatch, onRemove }: RungRowProps) {
  const { attributes, listeners, setNodeRef, transform, transition, isDragging } = useSortable({ id: rung.id });
  const stageId = `stage-${rung.id}`;
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      className={cx(
        "flex flex-wrap items-center gap-3 rounded-knot border border-line bg-paper p-2",
        isDragging && "z-10 shadow-lg",
      )}
      data-rung={rung.tuneTitle}
    >
      <DragHandle label={`Drag rung ${position}, ${rung.tuneTitle}`} attributes={attributes} listeners={listeners} />
      <span className="w-6 text-right font-mono text-bark">{position}</span>
      <Link href={`/teach/tunes/${rung.tuneId}`} className="min-w-40 flex-1 font-semibold">
        {rung.tuneTitle}
      </Link>
      <label htmlFor={stageId} className="text-small">
        Opens the next rung at
      </label>
      <select
        id={stageId}
        className={cx(inlineControl, "py-1 text-small")}
        value={rung.requiredStage}
        disabled={busy}
        onChange={(e) => onPatch({ requiredStage: Number(e.target.value) })}
      >
        {rung.stageNames.map((name, i) => (
          <option key={i} value={i + 1}>
            {`stage ${i + 1}: ${name}`}
          </option>
        ))}
      </select>
      <label className="flex items-center gap-1 text-small">
        <input
          type="checkbox"
          className="size-5 accent-cedar"
          checked={rung.isTaster}
          disabled={busy}
          onChange={(e) => onPatch({ isTaster: e.target.checked })}
        />
        Taster (open to everyone)
      </label>
      <div className="flex gap-1">
        <Button size="sm" variant="quiet" disabled={!canMoveUp || busy} onClick={() => onMove(-1)}>
          Move<span className="sr-only"> {rung.tuneTitle}</span> up
        </Button>
        <Button size="sm" variant="quiet" disabled={!canMoveDown || busy} onClick={() => onMove(1)}>
          Move<span className="sr-only"> {rung.tuneTitle}</span> down
        </Button>
        <Button
          size="sm"
          variant="quiet"
          disabled={busy}
          onClick={onRemove}
          aria-label={`Remove ${rung.tuneTitle} from the ladder`}
        >
          Remove
        </Button>
      </div>
    </li>
  );
}
