"use client";
// The form for one margin note (new or edited), checked with the same zod schema as the route.
import { useId, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { Input, Textarea } from "@/components/ui/input";
import { ApiError } from "@/lib/catalogue/fetch-json";
import { MAX_BAR, NOTE_MAX } from "@/lib/catalogue/limits";
import type { NoteInput } from "@/lib/catalogue/schemas";

export interface NoteFormProps {
  bar: number | null;
  body?: string;
  submitLabel: string;
  busy: boolean;
  onSubmit: (v: NoteInput) => Promise<unknown>;
  onCancel?: () => void;
  onBarChange?: (bar: number | null) => void;
}

export function NoteForm({ bar, body = "", submitLabel, busy, onSubmit, onCancel, onBarChange }: NoteFormProps) {
  const id = useId();
  const [text, setText] = useState(body);
  const [errors, setErrors] = useState<Record<string, string>>({});

  const submit = async (e: FormEvent<HTMLFormElement>): Promise<void> => {
    e.preventDefault();
    const { fieldErrors, noteInput } = await import("@/lib/catalogue/schemas"); // zod loads on the first send
    const parsed = noteInput.safeParse({ bar: bar ?? "", body: text });
    if (!parsed.success) return setErrors(fieldErrors(parsed.error));
    setErrors({});
    try {
      await onSubmit(parsed.data);
      if (!onCancel) setText(""); // a new note's form is cleared for the next one
    } catch (err) {
      setErrors(
        err instanceof ApiError ? { form: err.message, ...err.fieldErrors } : { form: "The note could not be saved." },
      );
    }
  };

  const err = (k: string) =>
    errors[k] ? (
      <p id={`${id}-${k}-error`} className="text-small font-semibold text-berry">
        {errors[k]}
      </p>
    ) : null;
  return (
    <form onSubmit={(e) => void submit(e)} noValidate className="flex flex-col gap-3" aria-label={submitLabel}>
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex w-28 flex-col gap-1">
          <label htmlFor={`${id}-bar`} className="font-semibold">
            Bar
          </label>
          <Input
            id={`${id}-bar`}
            type="number"
            min={0}
            max={MAX_BAR}
            inputMode="numeric"
            value={bar ?? ""}
            aria-invalid={errors.bar ? true : undefined}
            aria-describedby={errors.bar ? `${id}-bar-error` : undefined}
            onChange={(e) => onBarChange?.(e.target.value === "" ? null : Number(e.target.value))}
          />
        </div>
        <p className="pb-2 text-small text-bark">Click a note in the music to pick its bar.</p>
      </div>
      {err("bar")}
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-body`} className="font-semibold">
          Note
        </label>
        <Textarea
          id={`${id}-body`}
          rows={2}
          maxLength={NOTE_MAX}
          value={text}
          onChange={(e) => setText(e.target.value)}
          aria-invalid={errors.body ? true : undefined}
          aria-describedby={errors.body ? `${id}-body-error` : undefined}
        />
      </div>
      {err("body")}
      {err("form")}
      <div className="flex gap-2">
        <Button type="submit" needsScript size="sm" disabled={busy}>
          {busy ? "Saving…" : submitLabel}
        </Button>
        {onCancel ? (
          <Button variant="quiet" size="sm" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
