"use client";
import type { ColumnDef } from "@tanstack/react-table";
import { day, money, words } from "./format";
import { statusAndPlanFilters } from "./filter-bar";
import { ServerTable } from "./server-table";
import type { Choice, MembershipJson } from "./types";

const STATUSES = ["active", "past_due", "canceled", "unpaid", "incomplete", "incomplete_expired", "trialing", "paused"];

const member = (r: MembershipJson) => (
  <span className="flex flex-col">
    <span className="font-semibold">{r.name}</span>
    <span className="text-bark">{r.email}</span>
  </span>
);

const columns: ColumnDef<MembershipJson, unknown>[] = [
  { id: "date", accessorFn: (r) => r.startedAt, header: "Started", cell: ({ row }) => day(row.original.startedAt) },
  { id: "name", accessorFn: (r) => r.name, header: "Member", cell: ({ row }) => member(row.original) },
  {
    id: "plan",
    header: "Plan",
    enableSorting: false,
    cell: ({ row }) =>
      `${row.original.plan} (${money(row.original.amount, row.original.currency)} a ${row.original.interval})`,
  },
  {
    id: "status",
    accessorFn: (r) => r.status,
    header: "Status",
    cell: ({ row }) => {
      const r = row.original;
      if (r.status === "past_due" && r.graceUntil) return `past due — grace until ${day(r.graceUntil)}`;
      if (r.cancelAtPeriodEnd && r.status === "active") return "active — ends at period end";
      return words(r.status);
    },
  },
  {
    id: "renews",
    accessorFn: (r) => r.currentPeriodEnd,
    header: "Renews or ends",
    cell: ({ row }) =>
      row.original.endedAt ? `ended ${day(row.original.endedAt)}` : day(row.original.currentPeriodEnd),
  },
];

export function MembershipsTable({ plans }: { plans: Choice[] }) {
  return (
    <ServerTable<MembershipJson>
      caption="Memberships"
      endpoint="/api/admin/memberships"
      columns={columns}
      defaultSort="date"
      getRowId={(r) => r.id}
      filters={statusAndPlanFilters(STATUSES, plans)}
    />
  );
}
