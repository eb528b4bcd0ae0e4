// The learning load for a chosen set of swaps; no engine import, so the editor page can use it directly.
import type { PhraseMap } from "@/lib/abc/phrase-types";

/** Distinct phrases to learn when the given near twins are played like their models (as lib/abc/phrase-map counts them). */
export function learningLoadWith(map: PhraseMap, swapped: readonly string[]): number {
  const letters = map.parts.flatMap((part) =>
    part.phrases.flatMap((p) =>
      [p, ...p.alternatives].map((u) => (swapped.includes(u.id) ? u.letter.replace(/[′″‴'"]+$/u, "") : u.letter)),
    ),
  );
  return new Set(letters).size;
}
