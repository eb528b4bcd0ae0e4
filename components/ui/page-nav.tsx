import type { ReactNode } from "react";

/**
 * Previous / "Page 2 of 3 · 45 assignments" / Next under a paged list. The two controls come from
 * the caller: links on a server-rendered page, buttons where a client list keeps its own page.
 */
export function PageNav({
  label,
  page,
  pages,
  total,
  noun,
  previous,
  next,
}: {
  label: string;
  page: number;
  pages: number;
  total: number;
  noun: string;
  previous: ReactNode;
  next: ReactNode;
}) {
  return (
    <nav aria-label={label} className="flex flex-wrap items-center gap-3 text-small">
      {previous}
      <span>{`Page ${page} of ${pages} · ${total.toLocaleString("en-GB")} ${noun}`}</span>
      {next}
    </nav>
  );
}
