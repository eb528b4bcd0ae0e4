"use client";
// Every stage of the plan side by side, from the skeleton to the full setting.
import type { StopChoice, Voice } from "@/lib/abc/double-stops";
import type { Stage } from "@/lib/abc/types";
import type { StageView } from "@/lib/tunes/api-types";
import { DoubleStopList } from "./double-stop-list";
import { StageCard } from "./stage-card";

export interface StagePreviewsProps {
  stages: readonly Stage[];
  /** The melody's double stops and the note each stage before double stops keeps. */
  doubleStops: readonly StopChoice[];
  turned: Readonly<Record<string, Voice>>;
  onTurn: (barIndex: number, voice: Voice | null) => void;
  saved: readonly StageView[];
  tuneId: string | null;
  dirty: boolean;
  sourceDirty: boolean;
}

export function StagePreviews({
  stages,
  doubleStops,
  turned,
  onTurn,
  saved,
  tuneId,
  dirty,
  sourceDirty,
}: StagePreviewsProps) {
  return (
    <div className="overflow-x-auto pb-2" role="region" aria-label="Stages side by side" tabIndex={0}>
      <div className="grid auto-cols-[minmax(20rem,1fr)] grid-flow-col gap-3">
        {stages.map((s, i) => {
          const reduced = doubleStops.length > 0 && !s.kinds.includes("doubleStops");
          const first = reduced && stages.findIndex((x) => !x.kinds.includes("doubleStops")) === i;
          return (
            <StageCard
              key={s.index}
              index={s.index}
              name={s.name}
              adds={s.adds}
              doubleStops={
                first ? (
                  <DoubleStopList choices={doubleStops} turned={turned} onTurn={onTurn} />
                ) : reduced ? (
                  <p className="text-caption text-bark">
                    Double stops keep the notes listed under stage{" "}
                    {stages.findIndex((x) => !x.kinds.includes("doubleStops")) + 1}.
                  </p>
                ) : null
              }
              merged={s.merged}
              repeats={s.repeats}
              liveAbc={s.abc}
              saved={saved.find((x) => x.index === s.index) ?? null}
              isLast={i === stages.length - 1}
              tuneId={tuneId}
              dirty={dirty}
              sourceDirty={sourceDirty}
            />
          );
        })}
      </div>
    </div>
  );
}
