"use client";
import type { ColumnDef } from "@tanstack/react-table";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { day, money, words } from "./format";
import { RefundDialog } from "./refund-dialog";
import { statusAndPlanFilters } from "./filter-bar";
import { ServerTable } from "./server-table";
import type { Choice, PaymentJson } from "./types";

const STATUSES = ["paid", "failed", "refunded", "partially_refunded"];

export function PaymentsTable({ plans }: { plans: Choice[] }) {
  const [refunding, setRefunding] = useState<PaymentJson | null>(null);
  const columns: ColumnDef<PaymentJson, unknown>[] = [
    { id: "date", accessorFn: (r) => r.createdAt, header: "Date", cell: ({ row }) => day(row.original.createdAt) },
    {
      id: "name",
      accessorFn: (r) => r.name,
      header: "Member",
      cell: ({ row }) => (
        <span className="flex flex-col">
          <span className="font-semibold">{row.original.name}</span>
          <span className="text-bark">{row.original.email}</span>
        </span>
      ),
    },
    { id: "plan", header: "Plan", enableSorting: false, cell: ({ row }) => row.original.plan ?? "—" },
    { id: "kind", header: "Kind", enableSorting: false, cell: ({ row }) => words(row.original.kind) },
    {
      id: "amount",
      accessorFn: (r) => r.amount,
      header: "Amount",
      cell: ({ row }) => money(row.original.amount, row.original.currency),
    },
    {
      id: "refunded",
      header: "Refunded",
      enableSorting: false,
      cell: ({ row }) =>
        row.original.refundedAmount > 0 ? money(row.original.refundedAmount, row.original.currency) : "—",
    },
    {
      id: "status",
      accessorFn: (r) => r.status,
      header: "Status",
      cell: ({ row }) => (
        <span title={row.original.failureMessage ?? undefined}>
          {words(row.original.status)}
          {row.original.failureMessage ? <span className="block text-bark">{row.original.failureMessage}</span> : null}
        </span>
      ),
    },
    { id: "receipt", header: "Receipt", enableSorting: false, cell: ({ row }) => row.original.receiptNumber ?? "—" },
    {
      id: "actions",
      header: () => <span className="sr-only">Actions</span>,
      enableSorting: false,
      cell: ({ row }) => {
        const p = row.original;
        if (p.status === "failed" || p.refundedAmount >= p.amount) return null;
        return (
          <Button
            size="sm"
            variant="secondary"
            onClick={() => setRefunding(p)}
            aria-label={`Refund ${p.name}, ${day(p.createdAt)}`}
          >
            Refund
          </Button>
        );
      },
    },
  ];
  return (
    <>
      <ServerTable<PaymentJson>
        caption="Payments"
        endpoint="/api/admin/payments"
        columns={columns}
        defaultSort="date"
        getRowId={(r) => r.id}
        filters={statusAndPlanFilters(STATUSES, plans)}
      />
      {refunding ? <RefundDialog payment={refunding} onClose={() => setRefunding(null)} /> : null}
    </>
  );
}
