"use client";
// The teacher's assignments (issue 6 item 1): due dates, each student's progress, edit and withdraw,
// a page of them at a time (the server pages: an admin sees every teacher's).
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useEffect } from "react";
import { Alert } from "@/components/ui/alert";
import { Card } from "@/components/ui/card";
import { LinkButton } from "@/components/ui/link-button";
import { PagerLink } from "@/components/ui/pager-link";
import { useQueryLinks } from "@/components/ui/query-links";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { AssignmentView } from "@/lib/teaching/teach-api-types";
import { AssignmentCard } from "./assignment-card";
import { AssignmentPageNav } from "./assignment-page-nav";
import { ASSIGNMENTS_KEY } from "./query-keys";

type Page = { assignments: AssignmentView[]; total: number; page: number; pageSize: number };

export function AssignmentList() {
  // The page is in the address (?page=2), so the pager's links work before hydration and Back returns.
  const { linkTo, go, pageOf } = useQueryLinks();
  const page = pageOf();
  const q = useQuery({
    queryKey: [...ASSIGNMENTS_KEY, page],
    queryFn: () => fetchJson<Page>(`/api/teach/assignments?page=${page}`),
    placeholderData: keepPreviousData,
  });
  const last = q.data ? Math.max(1, Math.ceil(q.data.total / q.data.pageSize)) : page;
  // A withdrawal elsewhere can leave this page past the end: show the last one.
  useEffect(() => {
    if (page > last) go({ page: String(last) }, { replace: true });
  }, [page, last, go]);
  if (q.isPending) return <p className="text-bark">Loading your assignments…</p>;
  if (q.isError) return <Alert tone="error">{errorWords(q.error)}</Alert>;
  const { assignments: list, total, pageSize } = q.data;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  if (page > pages) return null;
  if (!list.length) {
    return (
      <Card tone="warm" className="max-w-prose">
        <p className="mb-3">No assignments yet.</p>
        <LinkButton href="/teach/assign">Assign a tune</LinkButton>
      </Card>
    );
  }
  return (
    <div className="flex flex-col gap-4">
      <ul className="flex flex-col gap-4" aria-label="Assignments" aria-busy={q.isPlaceholderData}>
        {list.map((a) => (
          <AssignmentCard key={a.id} a={a} />
        ))}
      </ul>
      {pages > 1 ? (
        <AssignmentPageNav
          page={page}
          pages={pages}
          total={total}
          previous={
            <PagerLink enabled={page > 1} {...linkTo({ page: String(page - 1) })}>
              Previous
            </PagerLink>
          }
          next={
            <PagerLink enabled={page < pages && !q.isPlaceholderData} {...linkTo({ page: String(page + 1) })}>
              Next
            </PagerLink>
          }
        />
      ) : null}
    </div>
  );
}
