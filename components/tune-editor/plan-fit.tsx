// What the plan makes of this tune: the default plan merges a stage that would repeat the music
// before it; a teacher's own plan is kept as made, and the stages that repeat are named.
import type { Stage } from "@/lib/abc/types";

export function PlanFit({ stages, isDefault }: { stages: readonly Stage[]; isDefault: boolean }) {
  const merged = stages.flatMap((s) => s.merged);
  const repeating = stages.filter((s) => s.repeats !== null);
  if (isDefault && merged.length)
    return (
      <p className="text-small text-bark" data-testid="plan-fit">
        For this tune the default plan makes {stages.length} stage{stages.length === 1 ? "" : "s"} (
        {stages.map((s) => s.name).join(", ")}): {merged.map((n) => `“${n}”`).join(", ")} would repeat the music before,
        since the tune has none of {merged.length === 1 ? "its" : "their"} kinds, and{" "}
        {merged.length === 1 ? "is" : "are"} merged into the next stage.
      </p>
    );
  if (!isDefault && repeating.length)
    return (
      <p className="text-small text-cedar" data-testid="plan-fit">
        {repeating.map((s) => `Stage ${s.index} repeats stage ${s.repeats}`).join("; ")}: this tune has none of the
        kinds {repeating.length === 1 ? "it adds" : "they add"}. Your plan is kept as you made it; a student would check
        in the same music twice.
      </p>
    );
  return null;
}
