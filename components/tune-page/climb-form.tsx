"use client";
// A check-in of a course's stage: a recording, or "played from memory", with a self-rating 1–5.
// The server decides; its refusal's words are shown as they come.
import { useState, type FormEvent } from "react";
import { RecordingPicker } from "@/components/recording/recording-picker";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ApiError, fetchJson } from "@/lib/catalogue/fetch-json";

const RATINGS = [1, 2, 3, 4, 5] as const;
const RATING_WORDS: Record<number, string> = { 1: "1 — not yet", 3: "3 — getting there", 5: "5 — as I want it" };

type Result = { checkIn: { openedStage: number | null } };

export function ClimbForm({
  tuneId,
  stage,
  onDone,
}: {
  tuneId: string;
  stage: { index: number; name: string };
  onDone: (openedStage: number | null) => void;
}) {
  const [uploadId, setUploadId] = useState<string | null>(null);
  const [rating, setRating] = useState<number | null>(null);
  const [fromMemory, setFromMemory] = useState(false);
  const [sending, setSending] = useState(false);
  const [error, setError] = useState<{ message: string; fields: Record<string, string> } | null>(null);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setSending(true);
    setError(null);
    try {
      const r = await fetchJson<Result>(`/api/learn/tunes/${encodeURIComponent(tuneId)}/check-ins`, {
        method: "POST",
        body: { stageIndex: stage.index, uploadId, selfRating: rating, fromMemory },
      });
      onDone(r.checkIn.openedStage);
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
    <form onSubmit={(e) => void submit(e)} className="flex flex-col gap-4" aria-label={`Check in stage ${stage.index}`}>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">How did it go?</legend>
        <div className="flex flex-wrap gap-3">
          {RATINGS.map((r) => (
            <label key={r} className="flex min-h-11 items-center gap-2 rounded-knot border-2 border-grain px-3">
              <input type="radio" name="selfRating" value={r} checked={rating === r} onChange={() => setRating(r)} />
              {RATING_WORDS[r] ?? String(r)}
            </label>
          ))}
        </div>
        {error?.fields.selfRating ? (
          <p className="text-small font-semibold text-berry">{error.fields.selfRating}</p>
        ) : null}
      </fieldset>
      <label className="flex min-h-11 items-center gap-2">
        <input type="checkbox" checked={fromMemory} onChange={(e) => setFromMemory(e.target.checked)} />
        Played from memory
      </label>
      <details className="flex flex-col gap-2">
        <summary className="min-h-11 cursor-pointer font-semibold">
          Add a recording (needed unless you played it from memory)
        </summary>
        <RecordingPicker tuneId={tuneId} stageIndex={stage.index} onStored={setUploadId} />
      </details>
      {error?.fields.uploadId ? <p className="text-small font-semibold text-berry">{error.fields.uploadId}</p> : null}
      {error ? (
        <Alert tone="error" live>
          {error.message}
        </Alert>
      ) : null}
      <div>
        <Button type="submit" disabled={sending}>
          {sending ? "Checking in…" : `Check in stage ${stage.index}`}
        </Button>
      </div>
    </form>
  );
}
