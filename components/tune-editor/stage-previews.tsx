"use client";
// Every stage of the plan side by side, from the skeleton to the full setting.
import type { Stage } from "@/lib/abc/types";
import type { StageView } from "@/lib/tunes/api-types";
import { StageCard } from "./stage-card";

export interface StagePreviewsProps {
  stages: readonly Stage[];
  saved: readonly StageView[];
  tuneId: string | null;
  dirty: boolean;
  sourceDirty: boolean;
}

export function StagePreviews({ stages, saved, tuneId, dirty, sourceDirty }: StagePreviewsProps) {
  return (
    <div className="overflow-x-auto pb-2" role="region" aria-label="Stages side by side" tabIndex={0}>
      <div className="grid auto-cols-[minmax(20rem,1fr)] grid-flow-col gap-3">
        {stages.map((s, i) => (
          <StageCard
            key={s.index}
            index={s.index}
            name={s.name}
            adds={s.adds}
            merged={s.merged}
            repeats={s.repeats}
            liveAbc={s.abc}
            saved={saved.find((x) => x.index === s.index) ?? null}
            isLast={i === stages.length - 1}
            tuneId={tuneId}
            dirty={dirty}
            sourceDirty={sourceDirty}
          />
        ))}
      </div>
    </div>
  );
}
