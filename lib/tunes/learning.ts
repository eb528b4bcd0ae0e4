// The learning version of a tune with only the swaps the teacher accepted (PRODUCT.md §4.6), and
// what each swap would do on its own, for the editor's previews. Pure: runs in the browser.
import { buildModel } from "@/lib/abc/skeleton";
import type { PhraseMap, Swap } from "@/lib/abc/phrase-types";
import { applyEdits, planSwaps } from "@/lib/abc/twin-swap";

export interface LearningVersion {
  abc: string;
  made: Swap[];
  /** Accepted swaps the engine could not make on this text, with the reason. */
  skipped: { swap: Swap; reason: string }[];
}

/** `abc` is the full setting whose phrase map is `map` (the map comes from its skeleton, same bar numbers). */
export function learningVersion(abc: string, map: PhraseMap, accepted: readonly string[]): LearningVersion {
  const model = buildModel(abc);
  if (!model.ok) return { abc, made: [], skipped: [] };
  const plan = planSwaps(abc, model.value.bars, map, [...accepted]);
  return { abc: applyEdits(abc, plan.edits), made: plan.made, skipped: plan.skipped };
}

/** Accepted ids that the current phrase map still offers, in the map's order; the rest are stale. */
export function offeredSwaps(map: PhraseMap, accepted: readonly string[]): { kept: string[]; dropped: string[] } {
  const offered = map.swaps.map((s) => s.phrase);
  return {
    kept: offered.filter((id) => accepted.includes(id)),
    dropped: accepted.filter((id) => !offered.includes(id)),
  };
}
