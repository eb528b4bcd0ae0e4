"use client";
// One check-in waiting for review: the recording with the listening aid's bar strip, the stage's notation,
// feedback and the two outcomes (the aid suggests; the sign-off is the teacher's).
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import { Notation } from "@/components/notation";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { Field } from "@/components/ui/field";
import { Textarea } from "@/components/ui/input";
import { ApiError, errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import { UNDO_MINUTES } from "@/lib/teaching/state-machine";
import type { ReviewItem } from "@/lib/teaching/teach-api-types";
import { REVIEW_KEY, ROSTER_KEY } from "./query-keys";
import { ListeningPanel } from "@/components/listening/listening-panel";

type Outcome = "signed_off" | "needs_more_time";
type Result = { openedStage: number | null };

/** What the queue shows after a review; a "needs more time" can be taken back for a while. */
export type Reviewed = { words: string; undo?: { checkInId: string; student: string; until: number } };

export function ReviewCard({ item, onReviewed }: { item: ReviewItem; onReviewed: (r: Reviewed) => void }) {
  const qc = useQueryClient();
  const id = useId();
  const [feedback, setFeedback] = useState("");
  const review = useMutation({
    mutationFn: (outcome: Outcome) =>
      fetchJson<Result>(`/api/teach/review/${item.checkInId}`, {
        method: "POST",
        body: { outcome, feedback },
      }),
    onSuccess: async (r, outcome) => {
      const who = item.student.name;
      onReviewed(
        outcome === "signed_off"
          ? {
              words: `Signed off ${item.stage.name} for ${who}.${r.openedStage ? ` Stage ${r.openedStage} is open for ${who}.` : ""}`,
            }
          : {
              words: `Sent back to ${who} with more time on ${item.stage.name}. Your note goes to ${who} in ${UNDO_MINUTES} minutes.`,
              undo: { checkInId: item.checkInId, student: who, until: Date.now() + UNDO_MINUTES * 60_000 },
            },
      );
      await qc.invalidateQueries({ queryKey: REVIEW_KEY });
      await qc.invalidateQueries({ queryKey: ROSTER_KEY });
    },
    // Someone else (another tab, an admin) reviewed it first: the queue is out of date.
    onError: (e) => {
      if (e instanceof ApiError && e.status === 409) void qc.invalidateQueries({ queryKey: REVIEW_KEY });
    },
  });
  const when = new Date(item.createdAt).toLocaleString("en-GB", {
    dateStyle: "medium",
    timeStyle: "short",
  });
  const title = `${item.student.name}: ${item.tune.title}, stage ${item.stage.index} of ${item.stage.count}`;
  const where = item.courseTitle ? ` · on the course “${item.courseTitle}”` : "";
  return (
    <Card as="li" aria-label={title} className="flex flex-col gap-4">
      <div>
        <CardTitle level={2}>{title}</CardTitle>
        <p className="text-small text-bark">
          {item.stage.name} · checked in {when} · self-rating {item.selfRating} of 5 ·{" "}
          {item.fromMemory ? "played from memory" : "played from the music"}
          {where}
        </p>
      </div>
      {item.uploadId ? (
        <ListeningPanel
          listening={item.listening}
          uploadId={item.uploadId}
          abc={item.stage.abc}
          recordingLabel={`Recording by ${item.student.name}`}
          musicLabel={`${item.tune.title}, ${item.stage.name}`}
          audience="teacher"
        />
      ) : (
        <>
          <p className="text-small text-bark">No recording with this check-in.</p>
          {item.stage.abc ? (
            <Notation
              abc={item.stage.abc}
              label={`${item.tune.title}, ${item.stage.name}`}
              className="rounded-knot border border-line p-2"
            />
          ) : null}
        </>
      )}
      <Field
        id={`${id}-feedback`}
        label="Feedback"
        hint="The student reads this in their e-mail and on their page. “Needs more time” asks for a sentence on what to work on."
        error={review.error instanceof ApiError ? review.error.fieldErrors.feedback : undefined}
      >
        {(c) => (
          <Textarea {...c} rows={3} value={feedback} maxLength={4000} onChange={(e) => setFeedback(e.target.value)} />
        )}
      </Field>
      {review.isError ? (
        <Alert tone="error" live>
          {errorWords(review.error)}
        </Alert>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button disabled={review.isPending} onClick={() => review.mutate("signed_off")}>
          Sign off
        </Button>
        <Button variant="secondary" disabled={review.isPending} onClick={() => review.mutate("needs_more_time")}>
          Needs more time
        </Button>
      </div>
    </Card>
  );
}
