// The roster table's columns (TanStack Table): every one sorts; the name column also filters.
import { createColumnHelper, type FilterFn } from "@tanstack/react-table";
import Link from "next/link";
import type { RosterRow } from "@/lib/teaching/teach-api-types";

const col = createColumnHelper<RosterRow>();

/** "Only with overdue" rides on the overdue column's filter value. */
export const onlyOverdue: FilterFn<RosterRow> = (row, id, on: boolean) => !on || (row.getValue<number>(id) ?? 0) > 0;

const dayWords = (day: string) =>
  new Date(`${day}T12:00:00Z`).toLocaleDateString("en-GB", {
    day: "numeric",
    month: "short",
    year: "numeric",
    timeZone: "UTC",
  });

export const rosterColumns = [
  col.accessor("name", {
    header: "Student",
    filterFn: "includesString",
    cell: (c) => (
      <div className="flex flex-col">
        <span className="font-semibold">{c.getValue()}</span>
        <span className="text-bark">{c.row.original.email}</span>
        <Link href={`/teach/assign?student=${c.row.original.studentId}`} className="text-small">
          Assign a tune
        </Link>
      </div>
    ),
  }),
  col.accessor("lastPractice", {
    header: "Last practice",
    // Days without any practice sort as the oldest.
    sortingFn: (a, b) => (a.original.lastPractice ?? "").localeCompare(b.original.lastPractice ?? ""),
    cell: (c) => (c.getValue() ? dayWords(c.getValue() as string) : <span className="text-bark">None logged</span>),
  }),
  col.accessor("openAssignments", {
    header: "Open assignments",
    cell: (c) => c.getValue(),
  }),
  col.accessor("overdueAssignments", {
    header: "Overdue",
    filterFn: onlyOverdue,
    cell: (c) =>
      c.getValue() > 0 ? (
        <strong className="text-berry">{c.getValue()} overdue</strong>
      ) : (
        <span className="text-bark">0</span>
      ),
  }),
];
