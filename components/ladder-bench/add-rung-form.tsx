"use client";
// Put one of your tunes at the bottom of a grade. Tunes already on this ladder are not offered
// (a tune appears once in a course); the server checks the same rule.
import { useQuery } from "@tanstack/react-query";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { inlineControl } from "./inline-control";
import { rungInput } from "@/lib/courses/schemas";
import type { TuneSummary } from "@/lib/tunes/api-types";
import { teachFetch } from "@/lib/tunes/client-fetch";

export interface AddRungFormProps {
  courseId: string;
  gradeId: string;
  gradeTitle: string;
  usedTunes: ReadonlySet<string>;
  busy: boolean;
  onAdd: (v: { gradeId: string; tuneId: string; requiredStage: number; isTaster: boolean }) => void;
}

export function AddRungForm({ courseId, gradeId, gradeTitle, usedTunes, busy, onAdd }: AddRungFormProps) {
  const tunes = useQuery({
    queryKey: ["teach-tunes"],
    queryFn: () => teachFetch<{ tunes: TuneSummary[] }>("/api/teach/tunes"),
  });
  const [tuneId, setTuneId] = useState("");
  const [stage, setStage] = useState(1);
  const [taster, setTaster] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const free = (tunes.data?.tunes ?? []).filter((t) => !usedTunes.has(t.id));
  const chosen = free.find((t) => t.id === tuneId);
  const ids = { tune: `add-tune-${gradeId}`, stage: `add-stage-${gradeId}` };

  const submit = (e: FormEvent): void => {
    e.preventDefault();
    const parsed = rungInput.safeParse({ courseId, gradeId, tuneId, requiredStage: stage, isTaster: taster });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? "Check the rung.");
    setError(null);
    onAdd({
      gradeId,
      tuneId: parsed.data.tuneId,
      requiredStage: parsed.data.requiredStage,
      isTaster: parsed.data.isTaster,
    });
    setTuneId("");
    setStage(1);
    setTaster(false);
  };

  return (
    <form
      onSubmit={submit}
      className="flex flex-wrap items-end gap-3 rounded-knot border border-dashed border-grain p-3"
      aria-label={`Add a rung to ${gradeTitle}`}
    >
      <div className="flex flex-col gap-1">
        <label htmlFor={ids.tune} className="text-small font-semibold">
          Tune
        </label>
        <select
          id={ids.tune}
          className={cx(inlineControl, "min-w-56")}
          value={tuneId}
          onChange={(e) => {
            setTuneId(e.target.value);
            setStage(1);
          }}
          disabled={busy || tunes.isPending}
        >
          <option value="">
            {tunes.isPending
              ? "Loading your tunes…"
              : free.length
                ? "Choose a tune"
                : "All your tunes are on this ladder"}
          </option>
          {free.map((t) => (
            <option key={t.id} value={t.id}>
              {`${t.title} (${t.tuneType}, ${t.key})`}
            </option>
          ))}
        </select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={ids.stage} className="text-small font-semibold">
          Stage that opens the next rung
        </label>
        <select
          id={ids.stage}
          className={inlineControl}
          value={stage}
          onChange={(e) => setStage(Number(e.target.value))}
          disabled={busy || !chosen}
        >
          {Array.from({ length: chosen?.stageCount ?? 1 }, (_, i) => (
            <option key={i} value={i + 1}>{`stage ${i + 1}`}</option>
          ))}
        </select>
      </div>
      <label className="flex min-h-11 items-center gap-1 text-small">
        <input
          type="checkbox"
          className="size-5 accent-cedar"
          checked={taster}
          onChange={(e) => setTaster(e.target.checked)}
          disabled={busy}
        />
        Taster
      </label>
      <Button type="submit" needsScript size="sm" disabled={busy}>
        Add to {gradeTitle}
      </Button>
      {error ? (
        <p role="alert" className="w-full text-small font-semibold text-berry">
          {error}
        </p>
      ) : null}
      {tunes.isError ? <p className="w-full text-small text-berry">Your tunes could not be loaded.</p> : null}
    </form>
  );
}
