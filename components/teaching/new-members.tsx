"use client";
// The roster's "new this week": members who came to this teacher (by starting one of their courses,
// or handed over by the admin), each with a welcome note to send once.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Textarea } from "@/components/ui/input";
import { ApiError, errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { NewMember } from "@/lib/courses/members";

const NEW_MEMBERS_KEY = ["teach", "new-members"] as const;

const since = (iso: string) =>
  new Date(iso).toLocaleDateString("en-GB", { weekday: "long", day: "numeric", month: "long" });

export function NewMembers() {
  const q = useQuery({
    queryKey: NEW_MEMBERS_KEY,
    queryFn: () => fetchJson<{ members: NewMember[] }>("/api/teach/new-members"),
  });
  if (!q.data) return q.isError ? <Alert tone="error">{errorWords(q.error)}</Alert> : null;
  return (
    <section aria-labelledby="new-members" className="flex flex-col gap-3">
      <h2 id="new-members" className="font-serif text-h3 font-semibold">
        New this week
      </h2>
      {q.data.members.length === 0 ? (
        <p className="text-bark">No new members this week.</p>
      ) : (
        <ul className="grid gap-3 md:grid-cols-2" aria-label="New members this week">
          {q.data.members.map((m) => (
            <MemberCard key={m.enrolmentId} member={m} />
          ))}
        </ul>
      )}
    </section>
  );
}

function MemberCard({ member }: { member: NewMember }) {
  const qc = useQueryClient();
  const id = useId();
  const [note, setNote] = useState("");
  const send = useMutation({
    mutationFn: () =>
      fetchJson(`/api/teach/new-members/${member.enrolmentId}/welcome`, { method: "POST", body: { note } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: NEW_MEMBERS_KEY }),
  });
  return (
    <li
      className="flex min-w-0 flex-col gap-2 rounded-knot border border-line bg-paper p-4"
      aria-label={`${member.student.name}, new on ${member.course.title}`}
    >
      <p className="font-semibold break-words">{member.student.name}</p>
      <p className="text-small break-words text-bark">{`${member.course.title} · since ${since(member.since)}`}</p>
      {member.welcomedAt ? (
        <p className="text-small font-semibold text-spruce">{`Welcome note sent ${since(member.welcomedAt)}.`}</p>
      ) : (
        <form
          className="flex flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            send.mutate();
          }}
        >
          <Field
            id={`${id}-note`}
            label={`Welcome note to ${member.student.name}`}
            error={send.error instanceof ApiError ? send.error.fieldErrors.note : undefined}
          >
            {(c) => (
              <Textarea {...c} rows={2} value={note} maxLength={2000} onChange={(e) => setNote(e.target.value)} />
            )}
          </Field>
          {send.isError && !(send.error instanceof ApiError && send.error.fieldErrors.note) ? (
            <Alert tone="error" live>
              {errorWords(send.error)}
            </Alert>
          ) : null}
          <div>
            <Button type="submit" variant="secondary" size="sm" disabled={send.isPending}>
              Send the welcome note
            </Button>
          </div>
        </form>
      )}
    </li>
  );
}
