"use client";
// The admin money tables' one table: TanStack Table in manual mode — the route
// handler sorts, filters and pages; this draws what it answers. Filters, sort and page live in the
// URL query, so a reload, a shared link and "Export CSV" all carry the same view. The page and the
// number of matching rows are two requests: the count is asked once per set of filters (its query key
// leaves out page, size and order), so paging and re-sorting never wait for a recount.
import { useQuery } from "@tanstack/react-query";
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import { usePathname, useSearchParams } from "next/navigation";
import { useMemo } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TableShell, TBody, Td, Th, THead } from "@/components/ui/table";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import { FilterBar, type FilterDef } from "./filter-bar";

export type Page<R> = { rows: R[]; hasMore: boolean; page: number; pageSize: number };

/** What the count depends on: the filters, not the page, its size or the order. */
function filtersOf(params: URLSearchParams): string {
  const f = new URLSearchParams(params);
  for (const k of ["page", "pageSize", "sort", "dir"]) f.delete(k);
  f.sort();
  return f.toString();
}

export type ServerTableProps<R> = {
  caption: string;
  /** e.g. "/api/admin/payments"; the export is `${endpoint}/export`. */
  endpoint: string;
  columns: ColumnDef<R, unknown>[];
  filters: FilterDef[];
  defaultSort: string;
  getRowId: (row: R) => string;
};

export function ServerTable<R>({ caption, endpoint, columns, filters, defaultSort, getRowId }: ServerTableProps<R>) {
  const pathname = usePathname();
  const params = useSearchParams();
  const query = params.toString();
  const sort = params.get("sort") ?? defaultSort;
  const dir = params.get("dir") === "asc" ? "asc" : "desc";
  const page = Math.max(1, Number(params.get("page") ?? "1") || 1);
  const pageSize = Math.min(100, Math.max(1, Number(params.get("pageSize") ?? "25") || 25));

  const data = useQuery({
    queryKey: ["admin-table", endpoint, query],
    queryFn: () => fetchJson<Page<R>>(`${endpoint}?${query}`),
    placeholderData: (previous) => previous,
  });
  const filterKey = filtersOf(params);
  const count = useQuery({
    queryKey: ["admin-table", endpoint, "count", filterKey],
    queryFn: () => fetchJson<{ total: number }>(`${endpoint}/count?${filterKey}`),
  });

  /** Changes the URL (and so the query); any change but the page itself starts again at page 1. */
  function go(change: Record<string, string | null>) {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(change)) {
      if (v === null || v === "") next.delete(k);
      else next.set(k, v);
    }
    if (!("page" in change)) next.delete("page");
    // The browser's own history, not router.replace: the server part of the page does not read the
    // query (the rows come from the route handlers), so a router navigation only cost a server round
    // trip per sort, page or filter, with useSearchParams holding the old query until it landed.
    // Next.js keeps useSearchParams in step with replaceState (Next.js docs, "Linking and
    // Navigating": using the native History API, 14.1+).
    window.history.replaceState(null, "", `${pathname}?${next.toString()}`);
  }

  const total = count.data?.total;
  const hasMore = data.data?.hasMore ?? false;
  // Until the count arrives, the pager knows only whether a next page exists.
  const pageCount = total === undefined ? page + (hasMore ? 1 : 0) : Math.max(1, Math.ceil(total / pageSize));
  const sorting: SortingState = useMemo(() => [{ id: sort, desc: dir === "desc" }], [sort, dir]);
  const table = useReactTable({
    data: data.data?.rows ?? [],
    columns,
    getRowId,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualFiltering: true,
    manualPagination: true,
    enableSortingRemoval: false,
    pageCount,
    state: { sorting, pagination: { pageIndex: page - 1, pageSize } },
    onSortingChange: (updater) => {
      const next = typeof updater === "function" ? updater(sorting) : updater;
      const s = next[0];
      if (s) go({ sort: s.id, dir: s.desc ? "desc" : "asc" });
    },
  });

  const exportQuery = new URLSearchParams(params);
  exportQuery.delete("page");
  exportQuery.delete("pageSize");

  return (
    <div className="flex flex-col gap-4">
      <FilterBar filters={filters} values={params} onApply={go} />
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-small text-bark" aria-live="polite" data-testid="table-total">
          {total === undefined ? (count.error ? "" : "Counting…") : `${total} ${total === 1 ? "row" : "rows"} match`}
        </p>
        <a
          className="text-small font-semibold text-cedar underline"
          href={`${endpoint}/export?${exportQuery.toString()}`}
          download
        >
          Export CSV
        </a>
      </div>
      {data.error || count.error ? <Alert tone="error">{errorWords(data.error ?? count.error)}</Alert> : null}
      <TableShell caption={caption}>
        <THead>
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const sorted = h.column.getIsSorted();
                const label = flexRender(h.column.columnDef.header, h.getContext());
                return (
                  <Th
                    key={h.id}
                    aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
                  >
                    {h.column.getCanSort() ? (
                      <button
                        type="button"
                        className="inline-flex items-center gap-1 font-semibold underline-offset-2 hover:underline"
                        onClick={h.column.getToggleSortingHandler()}
                      >
                        {label}
                        <span aria-hidden="true">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                      </button>
                    ) : (
                      label
                    )}
                  </Th>
                );
              })}
            </tr>
          ))}
        </THead>
        <TBody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id}>
              {row.getVisibleCells().map((cell) => (
                <Td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</Td>
              ))}
            </tr>
          ))}
          {data.data && data.data.rows.length === 0 ? (
            <tr>
              <Td colSpan={columns.length} className="text-bark">
                Nothing matches these filters.
              </Td>
            </tr>
          ) : null}
        </TBody>
      </TableShell>
      <nav aria-label="Pages" className="flex flex-wrap items-center gap-3 text-small">
        <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => go({ page: String(page - 1) })}>
          Previous
        </Button>
        <span>{total === undefined ? `Page ${page}` : `Page ${page} of ${pageCount}`}</span>
        <Button variant="secondary" size="sm" disabled={!hasMore} onClick={() => go({ page: String(page + 1) })}>
          Next
        </Button>
      </nav>
    </div>
  );
}
