"use client";
// Choose which stage of the tune to see and play. A locked stage stays in the list, closed, with
// the reason it is locked, so the student can see what comes next and how to open it.
import { useId } from "react";
import { cx } from "@/components/ui/cx";

export interface StageChoice {
  index: number; // 1-based, as in the tune engine
  name: string;
  locked: boolean;
  /** Why it is locked, e.g. "Opens when your teacher signs off stage 2". */
  reason?: string;
}

export interface StageSelectorProps {
  stages: readonly StageChoice[];
  value: number;
  onChange: (index: number) => void;
  className?: string;
}

export function StageSelector({ stages, value, onChange, className }: StageSelectorProps) {
  const name = useId();
  return (
    <fieldset className={cx("flex flex-col gap-2", className)}>
      <legend className="mb-1 font-semibold">Stage</legend>
      <div className="flex flex-wrap gap-2">
        {stages.map((s) => {
          const id = `${name}-${s.index}`;
          const reasonId = `${id}-why`;
          const chosen = s.index === value;
          return (
            <div key={s.index} className="flex flex-col">
              <input
                type="radio"
                id={id}
                name={name}
                value={s.index}
                checked={chosen}
                disabled={s.locked}
                aria-describedby={s.locked ? reasonId : undefined}
                onChange={() => onChange(s.index)}
                className="peer sr-only"
              />
              <label
                htmlFor={id}
                className={cx(
                  "flex min-h-11 cursor-pointer items-center gap-2 rounded-knot border-2 px-3 py-1 text-small",
                  "peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-cedar",
                  chosen ? "border-cedar bg-cedar font-semibold text-paper" : "border-line bg-paper text-ink",
                  s.locked && "cursor-not-allowed border-dashed bg-sawdust text-bark",
                )}
              >
                <span>{`${s.index}. ${s.name}`}</span>
                {chosen ? <span className="sr-only">(showing)</span> : null}
                {s.locked ? (
                  <span className="inline-flex items-center gap-1 rounded-sm border border-grain px-1 text-caption">
                    <LockIcon />
                    Locked
                  </span>
                ) : null}
              </label>
              {s.locked ? (
                <span id={reasonId} className="mt-1 max-w-48 text-caption text-bark">
                  {s.reason ?? "Not open yet."}
                </span>
              ) : null}
            </div>
          );
        })}
      </div>
    </fieldset>
  );
}

function LockIcon() {
  return (
    <svg aria-hidden="true" viewBox="0 0 12 14" className="size-3" fill="none" stroke="currentColor" strokeWidth="1.5">
      <path d="M3 6V4a3 3 0 0 1 6 0v2" />
      <rect x="1.5" y="6" width="9" height="7" rx="1.5" fill="currentColor" stroke="none" />
    </svg>
  );
}
