// What the pages get of the listening aid's hearing of one check-in: still listening, could not hear
// it (and why), or the result. Plain data for the review queue and the student's self-check.
import type { ListenResult } from "./types";

export type ListeningView =
  { state: "listening" } | { state: "failed"; reason: string } | { state: "done"; result: ListenResult };

function isResult(v: unknown): v is ListenResult {
  return (
    typeof v === "object" &&
    v !== null &&
    Array.isArray((v as { bars?: unknown }).bars) &&
    typeof (v as { summary?: unknown }).summary === "string"
  );
}

/** From the stored row (none yet: still listening); null when the check-in has no recording to hear. */
export function listeningView(
  hasRecording: boolean,
  row: { status: "done" | "failed"; result: unknown; error: string | null } | undefined,
): ListeningView | null {
  if (!hasRecording) return null;
  if (!row) return { state: "listening" };
  if (row.status === "done" && isResult(row.result)) return { state: "done", result: row.result };
  return { state: "failed", reason: row.error ?? "The recording could not be heard." };
}
