"use client";
// The roster (issue 6 item 4): student, last practice, open and overdue assignments, with sorting on
// every column, a name filter and "only with overdue" (TanStack Table, headless).
import { useQuery } from "@tanstack/react-query";
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type SortingState,
} from "@tanstack/react-table";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/input";
import { TableShell, TBody, Td, Th, THead } from "@/components/ui/table";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { RosterRow } from "@/lib/teaching/teach-api-types";
import { ROSTER_KEY } from "./query-keys";
import { rosterColumns } from "./roster-columns";

const ARROWS = { asc: " ▲", desc: " ▼" } as const;
const ARIA = { asc: "ascending", desc: "descending" } as const;

export function RosterTable() {
  const q = useQuery({
    queryKey: ROSTER_KEY,
    queryFn: () => fetchJson<{ students: RosterRow[] }>("/api/teach/roster"),
  });
  const [sorting, setSorting] = useState<SortingState>([{ id: "name", desc: false }]);
  const [filters, setFilters] = useState<ColumnFiltersState>([]);
  const table = useReactTable({
    data: q.data?.students ?? [],
    columns: rosterColumns,
    state: { sorting, columnFilters: filters },
    onSortingChange: setSorting,
    onColumnFiltersChange: setFilters,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    // 25 to a page: an admin's roster is every student of the school.
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageIndex: 0, pageSize: 25 } },
  });
  if (q.isPending) return <p className="text-bark">Loading your students…</p>;
  if (q.isError) return <Alert tone="error">{errorWords(q.error)}</Alert>;
  const total = q.data.students.length;
  const shown = table.getRowModel().rows;
  const matching = table.getFilteredRowModel().rows.length;
  const name = table.getColumn("name");
  const overdue = table.getColumn("overdueAssignments");
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-4">
        <label className="flex flex-col gap-1.5 font-semibold">
          Filter by name
          <Input
            type="search"
            value={(name?.getFilterValue() as string) ?? ""}
            onChange={(e) => name?.setFilterValue(e.target.value || undefined)}
            className="w-64 max-w-full"
          />
        </label>
        <label className="flex min-h-11 items-center gap-2">
          <input
            type="checkbox"
            className="size-5 accent-cedar"
            checked={Boolean(overdue?.getFilterValue())}
            onChange={(e) => overdue?.setFilterValue(e.target.checked || undefined)}
          />
          Only students with overdue assignments
        </label>
      </div>
      <TableShell caption={`${matching} of ${total} student${total === 1 ? "" : "s"}`}>
        <THead>
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers.map((h) => {
                const dir = h.column.getIsSorted();
                return (
                  <Th key={h.id} aria-sort={dir ? ARIA[dir] : "none"}>
                    <button
                      type="button"
                      onClick={h.column.getToggleSortingHandler()}
                      className="font-semibold underline-offset-2 hover:underline"
                    >
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      {dir ? ARROWS[dir] : ""}
                    </button>
                  </Th>
                );
              })}
            </tr>
          ))}
        </THead>
        <TBody>
          {shown.map((r) => (
            <tr key={r.id}>
              {r.getVisibleCells().map((c) => (
                <Td key={c.id}>{flexRender(c.column.columnDef.cell, c.getContext())}</Td>
              ))}
            </tr>
          ))}
          {!shown.length ? (
            <tr>
              <Td colSpan={4} className="text-bark">
                No student matches the filters.
              </Td>
            </tr>
          ) : null}
        </TBody>
      </TableShell>
      {table.getPageCount() > 1 ? (
        <nav aria-label="Roster pages" className="flex flex-wrap items-center gap-3 text-small">
          <Button
            variant="secondary"
            size="sm"
            disabled={!table.getCanPreviousPage()}
            onClick={() => table.previousPage()}
          >
            Previous
          </Button>
          <span>{`Page ${table.getState().pagination.pageIndex + 1} of ${table.getPageCount()}`}</span>
          <Button variant="secondary" size="sm" disabled={!table.getCanNextPage()} onClick={() => table.nextPage()}>
            Next
          </Button>
        </nav>
      ) : null}
    </div>
  );
}
