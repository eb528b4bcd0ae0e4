"use client";
// The grip a rung or grade is dragged by. dnd-kit's keyboard sensor also works on it: Space to
// lift, arrow keys to move, Space to drop, Escape to cancel.
import type { DraggableAttributes, DraggableSyntheticListeners } from "@dnd-kit/core";

export function DragHandle({
  label,
  attributes,
  listeners,
}: {
  label: string;
  attributes: DraggableAttributes;
  listeners: DraggableSyntheticListeners;
}) {
  return (
    <button
      type="button"
      aria-label={label}
      className="flex min-h-11 min-w-11 cursor-grab touch-none items-center justify-center rounded-knot border border-line bg-sawdust text-bark active:cursor-grabbing"
      {...attributes}
      {...listeners}
    >
      <svg aria-hidden="true" viewBox="0 0 10 16" className="h-4 w-3" fill="currentColor">
        {[2, 8, 14].flatMap((y) => [
          <circle key={`a${y}`} cx="2.5" cy={y} r="1.5" />,
          <circle key={`b${y}`} cx="7.5" cy={y} r="1.5" />,
        ])}
      </svg>
    </button>
  );
}
