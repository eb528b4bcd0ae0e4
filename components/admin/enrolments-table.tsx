"use client";
import type { ColumnDef } from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { day, words } from "./format";
import { statusAndPlanFilters } from "./filter-bar";
import { ReassignBar } from "./reassign-bar";
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
  {
    id: "teacher",
    header: "Teacher",
    enableSorting: false,
    cell: ({ row }) => <span data-testid="enrolment-teacher">{row.original.teacher}</span>,
  },
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

export function EnrolmentsTable({
  plans,
  courses,
  teachers,
}: {
  plans: Choice[];
  courses: Choice[];
  teachers: Choice[];
}) {
  // The enrolments ticked for "hand to another teacher", across pages and sorts until reassigned.
  const [chosen, setChosen] = useState<Set<string>>(new Set());
  const withChoice = useMemo<ColumnDef<EnrolmentJson, unknown>[]>(
    () => [
      {
        id: "choose",
        header: "Choose",
        enableSorting: false,
        cell: ({ row }) => (
          <input
            type="checkbox"
            className="size-5"
            aria-label={`Choose ${row.original.name} on ${row.original.course}`}
            checked={chosen.has(row.original.id)}
            onChange={(e) => {
              const next = new Set(chosen);
              if (e.target.checked) next.add(row.original.id);
              else next.delete(row.original.id);
              setChosen(next);
            }}
          />
        ),
      },
      ...columns,
    ],
    [chosen],
  );
  return (
    <div className="flex flex-col gap-4">
      <ReassignBar chosen={[...chosen]} teachers={teachers} onDone={() => setChosen(new Set())} />
      <ServerTable<EnrolmentJson>
        caption="Enrolments"
        endpoint="/api/admin/enrolments"
        columns={withChoice}
        defaultSort="date"
        getRowId={(r) => r.id}
        filters={[
          ...statusAndPlanFilters(["active", "paused", "ended"], plans, { status: "Enrolment", plan: "Member's plan" }),
          { name: "course", label: "Course", options: courses.map((c) => ({ value: c.id, label: c.name })) },
        ]}
      />
    </div>
  );
}
