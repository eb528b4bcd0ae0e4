// The phrase map the tune page lays over the music. It is found on the skeleton (PRODUCT.md §4.5),
// which is stage 1 and open whenever the tune is, so it never reveals a locked stage.
import { phraseMap, skeletonOf, type PhraseMap } from "@/lib/abc";

export function phraseMapOf(stageOneAbc: string): PhraseMap | null {
  const shape = skeletonOf(stageOneAbc);
  if (!shape.ok) return null;
  return phraseMap(shape.value.bars, shape.value.meter, shape.value.unit);
}
