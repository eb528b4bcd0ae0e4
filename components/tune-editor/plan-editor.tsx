"use client";
// The stage plan: which kinds each stage adds back. A grid of kinds against stages; stage 1 is
// always the skeleton. The engine's own plan check (validatePlan) speaks for itself underneath.
import { Button } from "@/components/ui/button";
import { controlClasses } from "@/components/ui/input";
import { cx } from "@/components/ui/cx";
import { KINDS, type Kind, type StagePlan } from "@/lib/abc/types";
import { MAX_STAGES } from "@/lib/tunes/schemas";
import { KIND_WORDS } from "./kind-words";

export interface PlanEditorProps {
  plan: StagePlan;
  onChange: (plan: StagePlan) => void;
  onReset: () => void;
  reasons: readonly string[];
  isDefault: boolean;
}

function setKind(plan: StagePlan, kind: Kind, stage: number, on: boolean): StagePlan {
  return {
    stages: plan.stages.map((s, i) => {
      const adds = s.adds.filter((k) => k !== kind);
      return {
        ...s,
        adds: on && i === stage ? [...adds, kind].sort((a, b) => KINDS.indexOf(a) - KINDS.indexOf(b)) : adds,
      };
    }),
  };
}

export function PlanEditor({ plan, onChange, onReset, reasons, isDefault }: PlanEditorProps) {
  const rename = (i: number, name: string): void =>
    onChange({ stages: plan.stages.map((s, j) => (j === i ? { ...s, name } : s)) });
  const addStage = (): void =>
    onChange({ stages: [...plan.stages, { name: `Stage ${plan.stages.length + 1}`, adds: [] }] });
  const removeStage = (i: number): void => {
    // Its kinds move to the stage before, so nothing drops out of the plan by removing a column.
    const moved = plan.stages[i]?.adds ?? [];
    const stages = plan.stages
      .filter((_, j) => j !== i)
      .map((s, j) => (j === i - 1 ? { ...s, adds: [...s.adds, ...moved] } : s));
    onChange({ stages: i === 1 && stages[0] ? [{ ...stages[0], adds: [] }, ...stages.slice(1)] : stages });
  };
  return (
    <div className="flex flex-col gap-3">
      <div
        className="overflow-x-auto rounded-knot border border-line bg-paper"
        role="region"
        aria-label="Stage plan"
        tabIndex={0}
      >
        <table className="w-full border-collapse text-small">
          <thead className="bg-sawdust">
            <tr>
              <th scope="col" className="px-3 py-2 text-left">
                Kind added back
              </th>
              {plan.stages.map((s, i) => (
                <th key={i} scope="col" className="px-2 py-2 align-bottom">
                  <label className="flex flex-col gap-1 text-left font-normal">
                    <span className="text-caption font-semibold">Stage {i + 1}</span>
                    <input
                      value={s.name}
                      onChange={(e) => rename(i, e.target.value)}
                      aria-label={`Name of stage ${i + 1}`}
                      className={cx(controlClasses, "min-w-32 py-1 text-small")}
                    />
                  </label>
                  {i > 0 ? (
                    <button
                      type="button"
                      onClick={() => removeStage(i)}
                      className="mt-1 text-caption text-berry underline"
                    >
                      Remove stage {i + 1}
                    </button>
                  ) : null}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-line">
            {KINDS.map((kind) => (
              <tr key={kind}>
                <th scope="row" className="px-3 py-2 text-left font-normal">
                  {KIND_WORDS[kind]}
                </th>
                {plan.stages.map((s, i) => (
                  <td key={i} className="px-2 py-2 text-center">
                    <input
                      type="checkbox"
                      className="size-5 accent-cedar"
                      checked={s.adds.includes(kind)}
                      disabled={i === 0}
                      aria-label={`${KIND_WORDS[kind]} added back at stage ${i + 1}`}
                      onChange={(e) => onChange(setKind(plan, kind, i, e.target.checked))}
                    />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" size="sm" onClick={addStage} disabled={plan.stages.length >= MAX_STAGES}>
          Add a stage
        </Button>
        <Button variant="quiet" size="sm" onClick={onReset} disabled={isDefault}>
          Back to the usual plan
        </Button>
      </div>
      <div role="status" aria-live="polite">
        {reasons.length ? (
          <ul
            className="flex flex-col gap-1 rounded-knot border-l-4 border-berry bg-berry-tint px-4 py-2 text-small"
            data-testid="plan-reasons"
          >
            {reasons.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
        ) : (
          <p className="text-small text-spruce">
            The plan adds every kind back once; the last stage is the full setting.
          </p>
        )}
      </div>
    </div>
  );
}
