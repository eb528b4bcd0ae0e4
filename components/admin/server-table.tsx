"use client";
// The admin money tables' one table: TanStack Table in manual mode — the route
// handler sorts, filters and pages; this draws what it answers. Filters, sort and page live in the
// URL query, so a reload, a shared link and "Export CSV" all carry the same view. The page and the
// number of matching rows are two requests: the count is asked once per set of filters (its query key
// leaves out page, size and order), so paging and re-sorting never wait for a recount.
import { useQuery } from "@tanstack/react-query";
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import { usePathname, useSearchParams } from "next/navigation";
import { useMemo, type ComponentProps, type MouseEvent } from "react";
import { Alert } from "@/components/ui/alert";
import { buttonClasses } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { TableShell, TBody, Td, Th, THead } from "@/components/ui/table";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import { FilterBar, type FilterDef } from "./filter-bar";

/** The query without its empty values. */
function withoutEmpty(params: URLSearchParams): URLSearchParams {
  const kept = new URLSearchParams();
  params.forEach((v, k) => {
    if (v.trim() !== "") kept.append(k, v);
  });
  return kept;
}

/** A pager link, or the same words shown as unavailable where there is no such page. */
function PagerLink({ enabled, children, ...link }: ComponentProps<"a"> & { enabled: boolean }) {
  const classes = buttonClasses("secondary", "sm");
  return enabled ? (
    <a className={classes} {...link}>
      {children}
    </a>
  ) : (
    <span className={cx(classes, "cursor-not-allowed opacity-60")} aria-disabled="true">
      {children}
    </span>
  );
}

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
  const pathname = usePathname() ?? "";
  // The filter form, sent before the page hydrates, writes its empty fields too: those mean "any".
  const params = withoutEmpty(useSearchParams() ?? new URLSearchParams());
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

  /** The address with a change; any change but the page itself starts again at page 1. */
  function hrefWith(change: Record<string, string | null>): string {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(change)) {
      if (v === null || v === "") next.delete(k);
      else next.set(k, v);
    }
    if (!("page" in change)) next.delete("page");
    return `${pathname}?${next.toString()}`;
  }

  /**
   * Sort headers and pager are links (and the filters a GET form), so they work before the page hydrates;
   * once it has, a click changes the address in place instead.
   */
  function go(change: Record<string, string | null>) {
    // The browser's own history, not router.replace: the server part of the page does not read the
    // query (the rows come from the route handlers), so a router navigation only cost a server round
    // trip per sort, page or filter, with useSearchParams holding the old query until it landed.
    // Next.js keeps useSearchParams in step with replaceState (Next.js docs, "Linking and
    // Navigating": using the native History API, 14.1+).
    window.history.replaceState(null, "", hrefWith(change));
  }
  const linkTo = (change: Record<string, string | null>) => ({
    href: hrefWith(change),
    onClick: (e: MouseEvent<HTMLAnchorElement>) => {
      if (e.metaKey || e.ctrlKey || e.shiftKey || e.button !== 0) return; // a new tab or window: the browser's
      e.preventDefault();
      go(change);
    },
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
