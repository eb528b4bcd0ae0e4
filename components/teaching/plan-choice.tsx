"use client";
// The stage plan of an assignment: the tune's own, or changed for this assignment with the tune
// editor's plan grid (components/tune-editor/plan-editor.tsx) and the engine's plan check.
import { PlanEditor } from "@/components/tune-editor/plan-editor";
import { validatePlan } from "@/lib/abc/stages";
import type { StagePlan } from "@/lib/abc/types";

export type PlanChoiceProps = {
  tunePlan: StagePlan;
  changed: boolean;
  plan: StagePlan;
  onChanged: (on: boolean) => void;
  onPlan: (plan: StagePlan) => void;
  error?: string;
};

/** The engine's reasons against the plan, when it is changed; none for the tune's own. */
export function planReasons(changed: boolean, plan: StagePlan): string[] {
  if (!changed) return [];
  const check = validatePlan(plan);
  return check.ok ? [] : check.reasons;
}

export function PlanChoice({ tunePlan, changed, plan, onChanged, onPlan, error }: PlanChoiceProps) {
  return (
    <fieldset className="flex min-w-0 flex-col gap-3">
      <legend className="font-semibold text-ink">Stage plan</legend>
      <label className="flex items-center gap-3">
        <input
          type="checkbox"
          className="size-5 accent-cedar"
          checked={changed}
          onChange={(e) => onChanged(e.target.checked)}
        />
        <span>
          Change the stage plan for this assignment (otherwise the tune&apos;s own {tunePlan.stages.length} stages)
        </span>
      </label>
      {changed ? (
        <PlanEditor
          plan={plan}
          onChange={onPlan}
          onReset={() => onPlan(tunePlan)}
          reasons={planReasons(changed, plan)}
          isDefault={JSON.stringify(plan) === JSON.stringify(tunePlan)}
        />
      ) : null}
      {error ? <p className="text-small font-semibold text-berry">{error}</p> : null}
    </fieldset>
  );
}
