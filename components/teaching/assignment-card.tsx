"use client";
// One assignment in the teacher's list: its students' progress, and the edit and withdraw forms.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { AssignmentView } from "@/lib/teaching/teach-api-types";
import { AssignmentEdit } from "./assignment-edit";
import { ASSIGNMENTS_KEY } from "./query-keys";

function dueWords(a: AssignmentView): string {
  const when = new Intl.DateTimeFormat("en-GB", {
    timeZone: a.dueZone,
    weekday: "short",
    day: "numeric",
    month: "short",
    year: "numeric",
    hour: "2-digit",
    minute: "2-digit",
    hourCycle: "h23",
  }).format(new Date(a.dueAt));
  return `${when} (${a.dueZone})`;
}

export function AssignmentCard({ a }: { a: AssignmentView }) {
  const qc = useQueryClient();
  const [editing, setEditing] = useState(false);
  const withdraw = useMutation({
    mutationFn: () =>
      fetchJson<AssignmentView>(`/api/teach/assignments/${a.id}`, {
        method: "DELETE",
      }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ASSIGNMENTS_KEY }),
  });
  const withdrawn = a.status === "withdrawn";
  return (
    <Card as="li" className={withdrawn ? "opacity-75" : undefined} aria-label={`${a.tune.title}, due ${dueWords(a)}`}>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <CardTitle level={2}>{a.tune.title}</CardTitle>
          <p className="text-small text-bark">
            Due {dueWords(a)}
            {a.overdue ? <strong className="ml-2 text-berry">Overdue</strong> : null}
            {withdrawn ? <strong className="ml-2 text-bark">Withdrawn</strong> : null}
          </p>
          <p className="text-small text-bark">
            {a.unlockRule === "teacher_sign_off"
              ? "You sign off each stage."
              : `Self check-in after ${a.unlockMinutes ?? 0} practice minutes.`}
            {a.stagePlan ? " Stage plan changed for this assignment." : ""}
          </p>
        </div>
        {withdrawn ? null : (
          <div className="flex flex-wrap gap-2">
            <Button variant="secondary" size="sm" onClick={() => setEditing((v) => !v)} aria-expanded={editing}>
              {editing ? "Close editing" : "Edit"}
            </Button>
            <Button
              variant="danger"
              size="sm"
              disabled={withdraw.isPending}
              onClick={() => {
                if (
                  window.confirm(
                    `Withdraw “${a.tune.title}” from ${a.students.length} student(s)? Their stages stop changing.`,
                  )
                )
                  withdraw.mutate();
              }}
            >
              Withdraw
            </Button>
          </div>
        )}
      </div>
      {a.note ? <p className="mt-2 whitespace-pre-line">{a.note}</p> : null}
      <ul className="mt-3 flex flex-col gap-1 text-small" aria-label="Students">
        {a.students.map((s) => (
          <li key={s.assignmentStudentId}>
            <span className="font-semibold">{s.name}</span>: {s.signedOff} of {s.stages} stages signed off
            {s.waiting ? <span className="ml-1 text-cedar">· check-in waiting</span> : null}
          </li>
        ))}
      </ul>
      {withdraw.isError ? (
        <Alert tone="error" live className="mt-3">
          {errorWords(withdraw.error)}
        </Alert>
      ) : null}
      {editing && !withdrawn ? <AssignmentEdit a={a} onDone={() => setEditing(false)} /> : null}
    </Card>
  );
}
