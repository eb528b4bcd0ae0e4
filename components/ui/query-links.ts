"use client";
// A list's sort, filters and page kept in the address's query: its controls are real links (and GET
// forms), so they work before the page hydrates, a reload or a shared address shows the same view, and
// Back steps through the views. Once hydrated, a click goes through the router without scrolling. Not the
// bare History API: Next.js 16 let a second pushState/replaceState on a page change the address while
// useSearchParams kept the first one's query (seen with a browser probe on the roster).
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import type { MouseEvent } from "react";

export type QueryChange = Record<string, string | null>;

/** The query without its empty values (a form sent before hydration writes its empty fields too: they mean "any"). */
function withoutEmpty(params: URLSearchParams): URLSearchParams {
  const kept = new URLSearchParams();
  params.forEach((v, k) => {
    if (v.trim() !== "") kept.append(k, v);
  });
  return kept;
}

export function useQueryLinks() {
  const pathname = usePathname() ?? "";
  const router = useRouter();
  const params = withoutEmpty(useSearchParams() ?? new URLSearchParams());

  /** The address with a change; any change but the page itself starts again at page 1. */
  function hrefWith(change: QueryChange): string {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(change)) {
      if (v === null || v === "") next.delete(k);
      else next.set(k, v);
    }
    if (!("page" in change)) next.delete("page");
    const query = next.toString();
    return query ? `${pathname}?${query}` : pathname;
  }

  /** Goes to the changed address; `replace` for a change made while typing, so Back skips each letter. */
  function go(change: QueryChange, { replace = false } = {}) {
    if (replace) router.replace(hrefWith(change), { scroll: false });
    else router.push(hrefWith(change), { scroll: false });
  }

  /** A link's href and a click handler that leaves new tabs and windows to the browser. */
  const linkTo = (change: QueryChange) => ({
    href: hrefWith(change),
    onClick: (e: MouseEvent<HTMLAnchorElement>) => {
      if (e.metaKey || e.ctrlKey || e.shiftKey || e.altKey || e.button !== 0) return;
      e.preventDefault();
      go(change);
    },
  });

  /** A whole number from the query, at least 1 (a page number). */
  const pageOf = (key = "page") => Math.max(1, Math.floor(Number(params.get(key) ?? "1")) || 1);

  return { pathname, params, hrefWith, go, linkTo, pageOf };
}
