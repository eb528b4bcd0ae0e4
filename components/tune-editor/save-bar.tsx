"use client";
// Saving, and what the server said: saved, or refused with the problems at line and column.
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { errorWords, ProblemsError } from "@/lib/tunes/client-fetch";

export interface SaveBarProps {
  onSave: () => void;
  saving: boolean;
  dirty: boolean;
  isNew: boolean;
  error: unknown;
  /** Words after a successful save (dropped swaps, flagged stages), or null. */
  savedNote: string | null;
}

export function SaveBar({ onSave, saving, dirty, isNew, error, savedNote }: SaveBarProps) {
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={onSave} disabled={saving || (!dirty && !isNew)}>
          {saving ? "Saving…" : isNew ? "Save the new tune" : "Save changes"}
        </Button>
        <span className="text-small text-bark" role="status">
          {saving ? "" : dirty ? "Changes not saved yet." : isNew ? "" : "All changes saved."}
        </span>
      </div>
      {error instanceof ProblemsError ? (
        <Alert tone="error" live title="Not saved" className="max-w-prose">
          <p>{error.message}</p>
          <ul className="mt-1 list-disc pl-5 text-small" data-testid="save-problems">
            {error.problems.map((p, i) => (
              <li key={i}>{`Line ${p.line}, column ${p.column}: ${p.message}`}</li>
            ))}
            {error.planReasons.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
        </Alert>
      ) : error ? (
        <Alert tone="error" live title="Not saved" className="max-w-prose">
          {errorWords(error)}
        </Alert>
      ) : null}
      {savedNote ? (
        <Alert tone="success" live className="max-w-prose">
          {savedNote}
        </Alert>
      ) : null}
    </div>
  );
}
