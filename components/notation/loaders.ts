// abcjs and the tune engine (which parses with abcjs) are loaded only when a component that draws
// or plays music mounts, so pages without music never download them (issue 5, performance).
import type AbcjsDefault from "abcjs";
import type { Bar } from "@/lib/abc/types";

export type Abcjs = typeof AbcjsDefault;

let abcjsPromise: Promise<Abcjs> | null = null;

export function loadAbcjs(): Promise<Abcjs> {
  abcjsPromise ??= import("abcjs").then((m) => m.default);
  return abcjsPromise;
}

/** Where each bar of this ABC text sits, numbered as the phrase map numbers them (pickup = 0). */
export type BarSpan = Pick<Bar, "number" | "startChar" | "endChar">;

export async function loadBarSpans(abc: string): Promise<BarSpan[]> {
  const { buildModel } = await import("@/lib/abc");
  const model = buildModel(abc);
  if (!model.ok) return [];
  return model.value.bars.map(({ number, startChar, endChar }) => ({ number, startChar, endChar }));
}

/** The bar (by its number) that holds a character of the ABC text; null outside the music. */
export function barAt(spans: BarSpan[], char: number): number | null {
  for (const span of spans) if (char >= span.startChar && char < span.endChar) return span.number;
  return null;
}
