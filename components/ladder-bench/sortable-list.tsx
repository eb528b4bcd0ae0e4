"use client";
// A vertical list reordered by dragging (pointer or keyboard, through dnd-kit), reporting the
// move as indexes; the caller decides what a move means and sends it to the server.
import {
  closestCenter,
  DndContext,
  KeyboardSensor,
  PointerSensor,
  useSensor,
  useSensors,
  type Announcements,
  type DragEndEvent,
} from "@dnd-kit/core";
import { SortableContext, sortableKeyboardCoordinates, verticalListSortingStrategy } from "@dnd-kit/sortable";
import type { ReactNode } from "react";

export interface SortableListProps {
  ids: string[];
  /** Words for an item in announcements, e.g. its tune title. */
  nameOf: (id: string) => string;
  onMove: (from: number, to: number) => void;
  children: ReactNode;
}

export function SortableList({ ids, nameOf, onMove, children }: SortableListProps) {
  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 4 } }),
    useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }),
  );
  const place = (id: string | number | undefined): string =>
    id === undefined ? "" : `place ${ids.indexOf(String(id)) + 1} of ${ids.length}`;
  const announcements: Announcements = {
    onDragStart: ({ active }) =>
      `Picked up ${nameOf(String(active.id))}. Use the arrow keys to move it, Space to drop it, Escape to cancel.`,
    onDragOver: ({ active, over }) => (over ? `${nameOf(String(active.id))} is over ${place(over.id)}.` : undefined),
    onDragEnd: ({ active, over }) =>
      over ? `${nameOf(String(active.id))} dropped at ${place(over.id)}.` : `${nameOf(String(active.id))} dropped.`,
    onDragCancel: ({ active }) => `Moving ${nameOf(String(active.id))} was cancelled.`,
  };
  const end = ({ active, over }: DragEndEvent): void => {
    if (!over || active.id === over.id) return;
    const from = ids.indexOf(String(active.id));
    const to = ids.indexOf(String(over.id));
    if (from >= 0 && to >= 0) onMove(from, to);
  };
  return (
    <DndContext
      sensors={sensors}
      collisionDetection={closestCenter}
      onDragEnd={end}
      accessibility={{
        announcements,
        screenReaderInstructions: {
          draggable:
            "To move this, press Space, then the arrow keys, then Space again to drop it. The Move up and Move down buttons do the same one step at a time.",
        },
      }}
    >
      <SortableContext items={ids} strategy={verticalListSortingStrategy}>
        {children}
      </SortableContext>
    </DndContext>
  );
}
