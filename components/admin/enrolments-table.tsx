"use client";
import type { ColumnDef } from "@tanstack/react-table";
import { day, words } from "./format";
import { statusAndPlanFilters } from "./filter-bar";
import { ServerTable } from "./server-table";
import type { Choice, EnrolmentJson } from "./types";

const columns: ColumnDef<EnrolmentJson, unknown>[] = [
  { id: "date", accessorFn: (r) => r.enrolledAt, header: "Enrolled", cell: ({ row }) => day(row.original.enrolledAt) },
  {
    id: "name",
    accessorFn: (r) => r.name,
    header: "Student",
    cell: ({ row }) => (
      <span className="flex flex-col">
        <span className="font-semibold">{row.original.name}</span>
        <span className="text-bark">{row.original.email}</span>
      </span>
    ),
  },
  { id: "course", accessorFn: (r) => r.course, header: "Course", cell: ({ row }) => row.original.course },
  { id: "status", accessorFn: (r) => r.status, header: "Enrolment", cell: ({ row }) => words(row.original.status) },
  {
    id: "membership",
    header: "Membership",
    enableSorting: false,
    cell: ({ row }) =>
      row.original.membership
        ? `${words(row.original.membership)}${row.original.plan ? ` (${row.original.plan})` : ""}`
        : "none",
  },
];

export function EnrolmentsTable({ plans, courses }: { plans: Choice[]; courses: Choice[] }) {
  return (
    <ServerTable<EnrolmentJson>
      caption="Enrolments"
      endpoint="/api/admin/enrolments"
      columns={columns}
      defaultSort="date"
      getRowId={(r) => r.id}
      filters={[
        ...statusAndPlanFilters(["active", "paused", "ended"], plans, { status: "Enrolment", plan: "Member's plan" }),
        { name: "course", label: "Course", options: courses.map((c) => ({ value: c.id, label: c.name })) },
      ]}
    />
  );
}
