"use client";
// The teacher's assignments (issue 6 item 1): due dates, each student's progress, edit and withdraw.
import { useQuery } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { Card } from "@/components/ui/card";
import { LinkButton } from "@/components/ui/link-button";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { AssignmentView } from "@/lib/teaching/teach-api-types";
import { AssignmentCard } from "./assignment-card";
import { ASSIGNMENTS_KEY } from "./query-keys";

export function AssignmentList() {
  const q = useQuery({
    queryKey: ASSIGNMENTS_KEY,
    queryFn: () => fetchJson<{ assignments: AssignmentView[] }>("/api/teach/assignments"),
  });
  if (q.isPending) return <p className="text-bark">Loading your assignments…</p>;
  if (q.isError) return <Alert tone="error">{errorWords(q.error)}</Alert>;
  const list = q.data.assignments;
  if (!list.length) {
    return (
      <Card tone="warm" className="max-w-prose">
        <p className="mb-3">No assignments yet.</p>
        <LinkButton href="/teach/assign">Assign a tune</LinkButton>
      </Card>
    );
  }
  return (
    <ul className="flex flex-col gap-4" aria-label="Assignments">
      {list.map((a) => (
        <AssignmentCard key={a.id} a={a} />
      ))}
    </ul>
  );
}
