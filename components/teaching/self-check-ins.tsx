"use client";
// Check-ins that opened the next stage by themselves (self-paced courses), with the teacher's word.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import { RecordingPlayer } from "@/components/recording/recording-player";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { Field } from "@/components/ui/field";
import { Textarea } from "@/components/ui/input";
import { ApiError, errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { SelfCheckIn } from "@/lib/teaching/self-paced";

const KEY = ["teach", "self-check-ins"] as const;

export function SelfCheckIns() {
  const q = useQuery({ queryKey: KEY, queryFn: () => fetchJson<{ checkIns: SelfCheckIn[] }>("/api/teach/check-ins") });
  if (q.isPending) return <p className="text-bark">Loading the check-ins…</p>;
  if (q.isError) return <Alert tone="error">{errorWords(q.error)}</Alert>;
  if (!q.data.checkIns.length)
    return (
      <Card tone="warm" className="max-w-prose">
        <p>No check-ins on your self-paced courses in the last month.</p>
      </Card>
    );
  return (
    <ul className="flex flex-col gap-4" aria-label="Self-paced check-ins">
      {q.data.checkIns.map((c) => (
        <SelfCheckInCard key={c.checkInId} item={c} />
      ))}
    </ul>
  );
}

function SelfCheckInCard({ item }: { item: SelfCheckIn }) {
  const qc = useQueryClient();
  const id = useId();
  const [comment, setComment] = useState("");
  const send = useMutation({
    mutationFn: () =>
      fetchJson(`/api/teach/check-ins/${item.checkInId}/comment`, { method: "POST", body: { comment } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: KEY }),
  });
  const when = new Date(item.createdAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });
  const title = `${item.student.name}: ${item.tune.title}, stage ${item.stage.index} (${item.stage.name})`;
  return (
    <Card as="li" aria-label={title} className="flex min-w-0 flex-col gap-3">
      <div>
        <CardTitle level={2}>
          <span className="break-words">{title}</span>
        </CardTitle>
        <p className="text-small break-words text-bark">
          {`${item.courseTitle} · checked in ${when} · self-rating ${item.selfRating} of 5 · ${item.fromMemory ? "played from memory" : "played from the music"}`}
        </p>
      </div>
      {item.uploadId ? (
        <RecordingPlayer uploadId={item.uploadId} label={`Recording by ${item.student.name}`} />
      ) : (
        <p className="text-small text-bark">No recording with this check-in.</p>
      )}
      {item.comment ? (
        <p className="italic">{`Your word: “${item.comment}”`}</p>
      ) : (
        <form
          className="flex flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            send.mutate();
          }}
        >
          <Field
            id={`${id}-comment`}
            label="A word to the student"
            hint="They read it in an e-mail and on the tune page."
            error={send.error instanceof ApiError ? send.error.fieldErrors.comment : undefined}
          >
            {(c) => (
              <Textarea {...c} rows={2} value={comment} maxLength={4000} onChange={(e) => setComment(e.target.value)} />
            )}
          </Field>
          {send.isError && !(send.error instanceof ApiError && send.error.fieldErrors.comment) ? (
            <Alert tone="error" live>
              {errorWords(send.error)}
            </Alert>
          ) : null}
          <div>
            <Button type="submit" variant="secondary" size="sm" disabled={send.isPending}>
              Send my word
            </Button>
          </div>
        </form>
      )}
    </Card>
  );
}
