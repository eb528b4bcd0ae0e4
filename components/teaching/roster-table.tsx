"use client";
// The roster (issue 6 item 4): student, last practice, open and overdue assignments, with sorting on
// every column, a name filter and "only with overdue" (TanStack Table, headless), 25 to a page.
import { useQuery } from "@tanstack/react-query";
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type SortingState,
} from "@tanstack/react-table";
import { useMemo } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/input";
import { PagerLink } from "@/components/ui/pager-link";
import { useQueryLinks } from "@/components/ui/query-links";
import { TableShell, TBody, Td, Th, THead } from "@/components/ui/table";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { RosterRow } from "@/lib/teaching/teach-api-types";
import { ROSTER_KEY } from "./query-keys";
import { rosterColumns } from "./roster-columns";

const ARROWS = { asc: " ▲", desc: " ▼" } as const;
const ARIA = { asc: "ascending", desc: "descending" } as const;

const COLUMNS = new Set(["name", "lastPractice", "openAssignments", "overdueAssignments"]);
const PAGE_SIZE = 25; // an admin's roster is every student of the school

export function RosterTable() {
  const q = useQuery({
    queryKey: ROSTER_KEY,
    queryFn: () => fetchJson<{ students: RosterRow[] }>("/api/teach/roster"),
  });
  // Sort, filters and page live in the address (?sort=lastPractice&dir=desc&q=ann&overdue=1&page=2):
  // the headers and pager are links and the filters a GET form, working before hydration.
  const { pathname, params, go, linkTo, pageOf } = useQueryLinks();
  const sortId = COLUMNS.has(params.get("sort") ?? "") ? (params.get("sort") as string) : "name";
  const desc = params.get("dir") === "desc";
  const nameFilter = params.get("q") ?? "";
  const onlyOverdue = params.get("overdue") === "1";
  // Kept the same object while the query is the same: a new one each render is a new state to TanStack Table,
  // which re-sorts and re-renders without end.
  const sorting: SortingState = useMemo(() => [{ id: sortId, desc }], [sortId, desc]);
  const filters: ColumnFiltersState = useMemo(
    () => [
      ...(nameFilter ? [{ id: "name", value: nameFilter }] : []),
      ...(onlyOverdue ? [{ id: "overdueAssignments", value: true }] : []),
    ],
    [nameFilter, onlyOverdue],
  );
  const table = useReactTable({
    data: q.data?.students ?? [],
    columns: rosterColumns,
    state: { sorting, columnFilters: filters },
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    autoResetPageIndex: false, // paged below, from the address
  });
  if (q.isPending) return <p className="text-bark">Loading your students…</p>;
  if (q.isError) return <Alert tone="error">{errorWords(q.error)}</Alert>;
  const total = q.data.students.length;
  const sorted = table.getRowModel().rows; // filtered and sorted; paged here, where a page past the end shows the last
  const matching = sorted.length;
  const pages = Math.max(1, Math.ceil(matching / PAGE_SIZE));
  const page = Math.min(pageOf(), pages);
  const shown = sorted.slice((page - 1) * PAGE_SIZE, page * PAGE_SIZE);
  return (
    <div className="flex flex-col gap-3">
      <form
        method="get"
        action={pathname}
        role="search"
        aria-label="Filter the roster"
        className="flex flex-wrap items-end gap-4"
        onSubmit={(e) => {
          e.preventDefault();
          const form = new FormData(e.currentTarget);
          go({ q: String(form.get("q") ?? "").trim() || null, overdue: form.get("overdue") ? "1" : null });
        }}
      >
        {params.get("sort") ? <input type="hidden" name="sort" value={sortId} /> : null}
        {params.get("dir") ? <input type="hidden" name="dir" value={desc ? "desc" : "asc"} /> : null}
        <label className="flex flex-col gap-1.5 font-semibold">
          Filter by name
          <Input
            type="search"
            name="q"
            maxLength={100}
            defaultValue={nameFilter}
            // Once hydrated the list narrows while typing; the address follows without a history entry per letter.
            onChange={(e) => go({ q: e.target.value.trim() || null }, { replace: true })}
            className="w-64 max-w-full"
          />
        </label>
        <label className="flex min-h-11 items-center gap-2">
          <input
            type="checkbox"
            name="overdue"
            value="1"
            className="size-5 accent-cedar"
            defaultChecked={onlyOverdue}
            onChange={(e) => go({ overdue: e.target.checked ? "1" : null })}
          />
          Only students with overdue assignments
        </label>
        <Button type="submit" variant="secondary" size="sm">
          Show
        </Button>
      </form>
      <TableShell caption={`${matching} of ${total} student${total === 1 ? "" : "s"}`}>
        <THead>
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers.map((h) => {
                const dir = h.column.getIsSorted();
                // A click sorts by this column; a second click turns the order round.
                const nextDir = dir === "asc" ? "desc" : "asc";
                return (
                  <Th key={h.id} aria-sort={dir ? ARIA[dir] : "none"}>
                    <a
                      {...linkTo({ sort: h.column.id, dir: nextDir })}
                      className="font-semibold text-ink no-underline underline-offset-2 hover:underline"
                    >
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      {dir ? ARROWS[dir] : ""}
                    </a>
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
      {pages > 1 ? (
        <nav aria-label="Roster pages" className="flex flex-wrap items-center gap-3 text-small">
          <PagerLink enabled={page > 1} {...linkTo({ page: String(page - 1) })}>
            Previous
          </PagerLink>
          <span>{`Page ${page} of ${pages}`}</span>
          <PagerLink enabled={page < pages} {...linkTo({ page: String(page + 1) })}>
            Next
          </PagerLink>
        </nav>
      ) : null}
    </div>
  );
}
