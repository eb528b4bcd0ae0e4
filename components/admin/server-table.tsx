"use client";
// The admin money tables' one table: TanStack Table in manual mode — the route
// handler sorts, filters and pages; this draws what it answers. Filters, sort and page live in the
// URL query, so a reload, a shared link and "Export CSV" all carry the same view. The page and the
// number of matching rows are two requests: the count is asked once per set of filters (its query key
// leaves out page, size and order), so paging and re-sorting never wait for a recount.
import { useQuery } from "@tanstack/react-query";
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import { useMemo } from "react";
import { Alert } from "@/components/ui/alert";
import { PagerLink } from "@/components/ui/pager-link";
import { useQueryLinks } from "@/components/ui/query-links";
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
  const { pathname, params, go, linkTo, pageOf } = useQueryLinks();
  const query = params.toString();
  const sort = params.get("sort") ?? defaultSort;
  const dir = params.get("dir") === "asc" ? "asc" : "desc";
  const page = pageOf();
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
  });

  const exportQuery = new URLSearchParams(params);
  exportQuery.delete("page");
  exportQuery.delete("pageSize");

  return (
    <div className="flex flex-col gap-4">
      <FilterBar filters={filters} values={params} action={pathname} onApply={go} />
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
                      <a
                        className="inline-flex items-center gap-1 font-semibold text-ink no-underline underline-offset-2 hover:underline"
                        {...linkTo({ sort: h.column.id, dir: h.column.getNextSortingOrder() || "desc" })}
                      >
                        {label}
                        <span aria-hidden="true">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                      </a>
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
        <PagerLink enabled={page > 1} {...linkTo({ page: String(page - 1) })}>
          Previous
        </PagerLink>
        <span>{total === undefined ? `Page ${page}` : `Page ${page} of ${pageCount}`}</span>
        <PagerLink enabled={hasMore} {...linkTo({ page: String(page + 1) })}>
          Next
        </PagerLink>
      </nav>
    </div>
  );
}
