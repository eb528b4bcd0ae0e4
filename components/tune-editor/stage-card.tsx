"use client";
// One stage in the side-by-side previews: its music, what it adds, and hand editing. A stage
// written by hand is kept as written; when the source changes afterwards it carries a flag and
// can be rebuilt from the source.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState, type ReactNode } from "react";
import { Notation } from "@/components/notation";
import { Button } from "@/components/ui/button";
import { controlClasses } from "@/components/ui/input";
import { cx } from "@/components/ui/cx";
import type { Kind } from "@/lib/abc/types";
import type { StageView } from "@/lib/tunes/api-types";
import { errorWords, ProblemsError, teachFetch } from "@/lib/tunes/client-fetch";
import { KIND_SHORT } from "./kind-words";

export interface StageCardProps {
  index: number;
  name: string;
  adds: readonly Kind[];
  /** Stages of the default plan taken into this one (the tune has none of their kinds). */
  merged: readonly string[];
  /** In a teacher's own plan: the earlier stage whose music this one repeats. */
  repeats: number | null;
  /** The list of double stops and the note each keeps, on the first stage without them; a pointer to it on the rest. */
  doubleStops: ReactNode;
  /** The engine's version of this stage for the text in the editor. */
  liveAbc: string;
  saved: StageView | null;
  isLast: boolean;
  tuneId: string | null;
  /** The editor holds changes not saved yet: hand edits wait until they are. */
  dirty: boolean;
  /** The ABC in the editor differs from the saved source: a save would flag a hand-written stage. */
  sourceDirty: boolean;
}

export function StageCard({
  index,
  name,
  adds,
  merged,
  repeats,
  doubleStops,
  liveAbc,
  saved,
  isLast,
  tuneId,
  dirty,
  sourceDirty,
}: StageCardProps) {
  const client = useQueryClient();
  const [draft, setDraft] = useState<string | null>(null);
  const hand = saved?.handEdited === true && !isLast;
  const abc = hand && saved ? saved.abc : liveAbc;
  const url = `/api/teach/tunes/${tuneId}/stages/${index}`;
  const done = () => client.invalidateQueries({ queryKey: ["teach-tune", tuneId] });
  const keep = useMutation({
    mutationFn: (text: string) => teachFetch(url, { method: "PUT", body: { abc: text } }),
    onSuccess: async () => {
      await done();
      setDraft(null);
    },
  });
  const rebuild = useMutation({ mutationFn: () => teachFetch(url, { method: "DELETE" }), onSuccess: done });
  const flagged = hand && (saved?.sourceChanged || sourceDirty);
  const editable = tuneId !== null && !dirty && !isLast;

  return (
    <article
      className={cx(
        "flex min-w-72 flex-col gap-2 rounded-knot border bg-paper p-3",
        flagged ? "border-2 border-cedar" : "border-line",
      )}
      aria-labelledby={`stage-${index}-title`}
      data-stage={index}
    >
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h4 id={`stage-${index}-title`} className="font-semibold">
          Stage {index}: {name}
        </h4>
        {hand ? (
          <span className="rounded-sm border border-slate px-1.5 text-caption text-slate">Written by hand</span>
        ) : null}
      </header>
      <p className="text-caption text-bark">
        {index === 1
          ? "The skeleton: the core melody alone."
          : adds.length
            ? `Adds back: ${adds.map((k) => KIND_SHORT[k]).join(", ")}.`
            : "Adds nothing new."}
      </p>
      {merged.length ? (
        <p className="text-caption text-bark" data-testid={`stage-${index}-merged`}>
          {mergedWords(index, merged)}
        </p>
      ) : null}
      {repeats !== null ? (
        <p
          className="rounded-knot bg-rosin-tint px-2 py-1 text-caption text-cedar"
          data-testid={`stage-${index}-repeats`}
        >
          The same music as stage {repeats}: this tune has none of the kinds this stage adds, so a student would check
          in the same music twice. Your plan is kept as you made it.
        </p>
      ) : null}
      {doubleStops}
      {flagged ? (
        <p
          className="rounded-knot bg-rosin-tint px-2 py-1 text-caption font-semibold text-cedar"
          data-testid={`stage-${index}-flag`}
        >
          {saved?.sourceChanged
            ? "The tune's source changed after this stage was written by hand: check it, or rebuild it from the source."
            : "Saving your changes will flag this hand-written stage for checking."}
        </p>
      ) : null}
      {draft === null ? (
        <Notation abc={abc} label={`Stage ${index}, ${name}`} className="p-2" />
      ) : (
        <label className="flex flex-col gap-1 text-small">
          <span className="font-semibold">ABC of stage {index}</span>
          <textarea
            value={draft}
            onChange={(e) => setDraft(e.target.value)}
            rows={12}
            spellCheck={false}
            className={cx(controlClasses, "font-mono text-caption")}
          />
        </label>
      )}
      {keep.error instanceof ProblemsError ? (
        <ul className="text-caption text-berry" role="alert">
          {keep.error.problems.map((p, i) => (
            <li key={i}>{`Line ${p.line}, column ${p.column}: ${p.message}`}</li>
          ))}
        </ul>
      ) : null}
      {(keep.error && !(keep.error instanceof ProblemsError)) || rebuild.error ? (
        <p role="alert" className="text-caption text-berry">
          {errorWords(keep.error ?? rebuild.error)}
        </p>
      ) : null}
      <div className="mt-auto flex flex-wrap gap-2">
        {draft === null ? (
          <Button
            size="sm"
            variant="secondary"
            disabled={!editable}
            onClick={() => setDraft(abc)}
            title={editable ? undefined : "Save the tune first"}
          >
            Edit stage {index} by hand
          </Button>
        ) : (
          <>
            <Button size="sm" onClick={() => keep.mutate(draft)} disabled={keep.isPending}>
              {keep.isPending ? "Keeping…" : "Keep this version"}
            </Button>
            <Button size="sm" variant="quiet" onClick={() => setDraft(null)}>
              Cancel
            </Button>
          </>
        )}
        {hand && draft === null ? (
          <Button size="sm" variant="quiet" disabled={!editable || rebuild.isPending} onClick={() => rebuild.mutate()}>
            Rebuild stage {index} from source
          </Button>
        ) : null}
      </div>
      {isLast ? (
        <p className="text-caption text-bark">The last stage is the full setting: edit the ABC above to change it.</p>
      ) : null}
      {!isLast && tuneId !== null && dirty ? (
        <p className="text-caption text-bark">Save the tune before editing a stage by hand.</p>
      ) : null}
    </article>
  );
}

const quoted = (names: readonly string[]): string => names.map((n) => `“${n}”`).join(" and ");

/** Why the default plan has fewer stages for this tune. */
function mergedWords(index: number, merged: readonly string[]): string {
  const stages = `The default plan's ${quoted(merged)} stage${merged.length === 1 ? " is" : "s are"}`;
  return index === 1
    ? `${stages} taken into this one: this tune has no embellishments, so its skeleton is its full setting.`
    : `${stages} taken into this one: this tune has none of ${merged.length === 1 ? "its" : "their"} kinds, so ${merged.length === 1 ? "it" : "they"} would repeat the music before.`;
}
