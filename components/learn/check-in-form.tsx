"use client";
// The check-in of the open stage: a stored recording (components/recording), a self-rating 1–5 and
// "Played from memory". The server decides; its refusal's words are shown as they come.
import { useState, type FormEvent } from "react";
import { RecordingPicker } from "@/components/recording/recording-picker";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ApiError, fetchJson } from "@/lib/catalogue/fetch-json";

export type CheckInFormProps = {
  assignmentStudentId: string;
  stageIndex: number;
  stageName: string;
  onDone: () => void;
};

const RATINGS = [1, 2, 3, 4, 5] as const;
const RATING_WORDS: Record<number, string> = {
  1: "1 — not yet",
  2: "2",
  3: "3 — getting there",
  4: "4",
  5: "5 — as I want it",
};

export function CheckInForm({ assignmentStudentId, stageIndex, stageName, onDone }: CheckInFormProps) {
  const [uploadId, setUploadId] = useState<string | null>(null);
  const [rating, setRating] = useState<number | null>(null);
  const [fromMemory, setFromMemory] = useState(false);
  const [sending, setSending] = useState(false);
  const [error, setError] = useState<{ message: string; fields: Record<string, string> } | null>(null);

  async function submit(e: FormEvent) {
    e.preventDefault();
    if (!uploadId || rating === null) {
      setError({
        message: "Please check the highlighted fields.",
        fields: {
          ...(uploadId ? {} : { uploadId: "Add a recording first." }),
          ...(rating === null ? { selfRating: "Rate how it went, from 1 to 5." } : {}),
        },
      });
      return;
    }
    setSending(true);
    setError(null);
    try {
      await fetchJson(`/api/learn/assignments/${assignmentStudentId}/check-ins`, {
        method: "POST",
        body: { stageIndex, uploadId, selfRating: rating, fromMemory },
      });
      onDone();
    } catch (err) {
      setError({
        message: err instanceof Error ? err.message : "Something went wrong.",
        fields: err instanceof ApiError ? err.fieldErrors : {},
      });
    } finally {
      setSending(false);
    }
  }

  return (
    <form onSubmit={(e) => void submit(e)} className="flex flex-col gap-5" aria-label={`Check in stage ${stageIndex}`}>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">{`Your recording of stage ${stageIndex} (${stageName})`}</legend>
        <RecordingPicker assignmentStudentId={assignmentStudentId} stageIndex={stageIndex} onStored={setUploadId} />
        {error?.fields.uploadId ? <p className="text-small font-semibold text-berry">{error.fields.uploadId}</p> : null}
      </fieldset>
      <fieldset
        className="flex flex-col gap-2"
        aria-describedby={error?.fields.selfRating ? "rating-error" : undefined}
      >
        <legend className="mb-1 font-semibold">How did it go?</legend>
        <div className="flex flex-wrap gap-3">
          {RATINGS.map((r) => (
            <label key={r} className="flex min-h-11 items-center gap-2 rounded-knot border-2 border-grain px-3">
              <input type="radio" name="selfRating" value={r} checked={rating === r} onChange={() => setRating(r)} />
              {RATING_WORDS[r]}
            </label>
          ))}
        </div>
        {error?.fields.selfRating ? (
          <p id="rating-error" className="text-small font-semibold text-berry">
            {error.fields.selfRating}
          </p>
        ) : null}
      </fieldset>
      <label className="flex min-h-11 items-center gap-2">
        <input
          type="checkbox"
          name="fromMemory"
          checked={fromMemory}
          onChange={(e) => setFromMemory(e.target.checked)}
        />
        Played from memory
      </label>
      {error ? (
        <Alert tone="error" live>
          {error.message}
        </Alert>
      ) : null}
      <div>
        <Button type="submit" needsScript disabled={sending || !uploadId}>
          {sending ? "Checking in…" : "Check in"}
        </Button>
      </div>
    </form>
  );
}
