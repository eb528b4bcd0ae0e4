"use client";
// The review queue (issue 6 item 4): check-ins waiting on the teacher's assignments, oldest first.
import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Card } from "@/components/ui/card";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { ReviewItem } from "@/lib/teaching/teach-api-types";
import { REVIEW_KEY } from "./query-keys";
import { ReviewCard, type Reviewed } from "./review-card";
import { UndoReview } from "./undo-review";

export function ReviewQueue() {
  const [last, setLast] = useState<Reviewed | null>(null);
  const q = useQuery({
    queryKey: REVIEW_KEY,
    queryFn: () => fetchJson<{ checkIns: ReviewItem[]; waiting: number }>("/api/teach/review"),
    staleTime: 0,
    // While a recording is still being heard, ask again now and then so its strip appears by itself.
    refetchInterval: (query) =>
      query.state.data?.checkIns.some((c) => c.listening?.state === "listening") ? 4000 : false,
  });
  return (
    <div className="flex flex-col gap-4">
      {last ? (
        <Alert tone="success" live>
          {last.words}
          {last.undo ? <UndoReview undo={last.undo} onUndone={(words) => setLast({ words })} /> : null}
        </Alert>
      ) : null}
      {q.isPending ? <p className="text-bark">Loading the check-ins…</p> : null}
      {q.isError ? <Alert tone="error">{errorWords(q.error)}</Alert> : null}
      {q.data && !q.data.checkIns.length ? (
        <Card tone="warm" className="max-w-prose">
          <p>Nothing waiting: every check-in has been reviewed.</p>
        </Card>
      ) : null}
      {q.data && q.data.waiting > q.data.checkIns.length ? (
        <p className="text-small text-bark" data-testid="review-waiting">
          {`The ${q.data.checkIns.length} oldest of ${q.data.waiting} check-ins waiting; each one you review brings the next.`}
        </p>
      ) : null}
      {q.data?.checkIns.length ? (
        <ul className="flex flex-col gap-4" aria-label="Check-ins waiting">
          {q.data.checkIns.map((item) => (
            <ReviewCard key={item.checkInId} item={item} onReviewed={setLast} />
          ))}
        </ul>
      ) : null}
    </div>
  );
}
