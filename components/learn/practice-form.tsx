"use client";
// Adding or changing one practice entry: minutes, the day (in the student's own zone, not in the
// future), an optional tune and a note. The server checks again and names the wrong field.
import { useState, type FormEvent } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, TextField } from "@/components/ui/field";
import { Select, Textarea } from "@/components/ui/input";
import { ApiError, fetchJson } from "@/lib/catalogue/fetch-json";

export type PracticeEntry = {
  id: string;
  tuneId: string | null;
  tuneTitle: string | null;
  practisedOn: string;
  minutes: number;
  note: string;
};

export type PracticeFormProps = {
  today: string;
  tunes: { id: string; title: string }[];
  /** The entry being changed, or null for a new one. */
  editing: PracticeEntry | null;
  onSaved: () => void;
  onCancel: () => void;
};

export function PracticeForm({ today, tunes, editing, onSaved, onCancel }: PracticeFormProps) {
  const [error, setError] = useState<{ message: string; fields: Record<string, string> } | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const data = new FormData(form);
    const body = {
      minutes: String(data.get("minutes") ?? ""),
      practisedOn: String(data.get("practisedOn") ?? ""),
      tuneId: String(data.get("tuneId") ?? ""),
      note: String(data.get("note") ?? ""),
    };
    setBusy(true);
    setError(null);
    try {
      if (editing) await fetchJson(`/api/learn/practice/${editing.id}`, { method: "PATCH", body });
      else await fetchJson("/api/learn/practice", { method: "POST", body });
      if (!editing) form.reset();
      onSaved();
    } catch (err) {
      setError({
        message: err instanceof Error ? err.message : "Something went wrong.",
        fields: err instanceof ApiError ? err.fieldErrors : {},
      });
    } finally {
      setBusy(false);
    }
  }

  const f = error?.fields ?? {};
  return (
    <form
      key={editing?.id ?? "new"}
      onSubmit={(e) => void submit(e)}
      className="flex flex-col gap-4"
      aria-label={editing ? "Change practice entry" : "Log practice"}
      noValidate
    >
      <TextField
        name="minutes"
        label="Minutes"
        type="number"
        inputMode="numeric"
        min={1}
        max={600}
        required
        defaultValue={editing?.minutes ?? ""}
        hint="1 to 600 minutes."
        error={f.minutes}
      />
      <TextField
        name="practisedOn"
        label="Date"
        type="date"
        max={today}
        required
        defaultValue={editing?.practisedOn ?? today}
        error={f.practisedOn}
      />
      <Field id="tuneId" label="Tune" hint="Optional: a tune you can open or have been given." error={f.tuneId}>
        {(control) => (
          <Select name="tuneId" defaultValue={editing?.tuneId ?? ""} {...control}>
            <option value="">No particular tune</option>
            {tunes.map((t) => (
              <option key={t.id} value={t.id}>
                {t.title}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <Field id="note" label="Note" hint="Optional: what you worked on." error={f.note}>
        {(control) => (
          <Textarea name="note" rows={3} maxLength={1000} defaultValue={editing?.note ?? ""} {...control} />
        )}
      </Field>
      {error ? (
        <Alert tone="error" live>
          {error.message}
        </Alert>
      ) : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" needsScript disabled={busy}>
          {editing ? "Save changes" : "Log practice"}
        </Button>
        {editing ? (
          <Button variant="quiet" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
