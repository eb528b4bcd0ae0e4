"use client";
// Twin swaps for the learning version: each near twin may be played exactly like its model while
// the tune is learnt. The teacher previews each one and accepts the ones to use.
import { useState } from "react";
import { Notation } from "@/components/notation";
import { Button } from "@/components/ui/button";
import type { PhraseMap } from "@/lib/abc/phrase-types";
import { useLearning } from "./use-learning";

export interface SwapPanelProps {
  abc: string;
  map: PhraseMap;
  accepted: readonly string[];
  onChange: (accepted: string[]) => void;
}

export function SwapPanel({ abc, map, accepted, onChange }: SwapPanelProps) {
  const [preview, setPreview] = useState<string | null>(null);
  const previewVersion = useLearning(abc, map, preview ? [preview] : null);
  const learning = useLearning(abc, map, accepted);
  const toggle = (id: string, on: boolean): void =>
    onChange(
      on
        ? map.swaps.map((s) => s.phrase).filter((p) => p === id || accepted.includes(p))
        : accepted.filter((p) => p !== id),
    );

  if (map.swaps.length === 0)
    return <p className="text-small text-bark">No near twins: there is nothing to swap in this tune.</p>;
  return (
    <div className="flex flex-col gap-4">
      <ul className="flex flex-col gap-2">
        {map.swaps.map((s) => {
          const skipped = learning?.skipped.find((k) => k.swap.phrase === s.phrase);
          return (
            <li key={s.phrase} className="flex flex-col gap-2 rounded-knot border border-line bg-paper p-3">
              <div className="flex flex-wrap items-center justify-between gap-2">
                <label className="flex items-center gap-2">
                  <input
                    type="checkbox"
                    className="size-5 accent-cedar"
                    checked={accepted.includes(s.phrase)}
                    onChange={(e) => toggle(s.phrase, e.target.checked)}
                  />
                  <span>
                    Play <strong>{s.phrase}</strong> like <strong>{s.model}</strong> while learning ({s.differingNotes}{" "}
                    note{s.differingNotes === 1 ? "" : "s"} change)
                  </span>
                </label>
                <Button
                  size="sm"
                  variant="quiet"
                  aria-expanded={preview === s.phrase}
                  onClick={() => setPreview(preview === s.phrase ? null : s.phrase)}
                >
                  {preview === s.phrase ? `Hide preview of ${s.phrase}` : `Preview ${s.phrase} swapped`}
                </Button>
              </div>
              {skipped ? <p className="text-caption text-berry">This swap cannot be made: {skipped.reason}.</p> : null}
              {preview === s.phrase && previewVersion ? (
                <Notation
                  abc={previewVersion.abc}
                  phraseMap={map}
                  highlightPhrase={s.phrase}
                  label={`Preview: ${s.phrase} played like ${s.model}`}
                />
              ) : null}
            </li>
          );
        })}
      </ul>
      <section aria-labelledby="learning-heading" className="flex flex-col gap-2">
        <h4 id="learning-heading" className="font-semibold">
          Learning version (
          {accepted.length
            ? `${accepted.length} swap${accepted.length === 1 ? "" : "s"} accepted`
            : "no swaps accepted: same as the full setting"}
          )
        </h4>
        {learning ? <Notation abc={learning.abc} phraseMap={map} label="Learning version" /> : null}
      </section>
    </div>
  );
}
