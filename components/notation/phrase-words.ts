// Plain words for the phrase map laid over the music: the overlay never relies on colour alone,
// so every phrase carries its id, its form letter and, for a twin, what it repeats.
import type { Phrase, PhraseMap } from "@/lib/abc/phrase-types";

/** Every phrase of the tune in playing order (parts in order, phrases in order). */
export function phraseList(map: PhraseMap): Phrase[] {
  return map.parts.flatMap((part) => part.phrases);
}

/** "A1 · a": the phrase id and its form letter. */
export function phraseLabel(phrase: Pick<Phrase, "id" | "letter">): string {
  return `${phrase.id} · ${phrase.letter}`;
}

const notes = (n: number): string => `${n} ${n === 1 ? "note" : "notes"}`;

/**
 * What a phrase repeats, in words: "same as A1" for an exact twin, "like A1 but 2 notes" for a
 * near twin; null when the phrase is the first of its kind. An exact twin wins over a near one,
 * and among equals the earliest phrase is named, since that is the one the student learnt first.
 */
export function twinWords(map: PhraseMap, id: string): string | null {
  const order = new Map(phraseList(map).map((p, i) => [p.id, i]));
  const earlier = map.twins
    .filter((t) => t.second === id && t.first !== id)
    .sort(
      (a, b) =>
        Number(a.kind !== "exact") - Number(b.kind !== "exact") ||
        (order.get(a.first) ?? 0) - (order.get(b.first) ?? 0),
    );
  const twin = earlier[0];
  if (!twin) return null;
  return twin.kind === "exact" ? `same as ${twin.first}` : `like ${twin.first} but ${notes(twin.differingNotes)}`;
}

/** The short form used when the full words do not fit above the phrase: "= A1", "≈ A1". */
export function twinMark(map: PhraseMap, id: string): string | null {
  const words = twinWords(map, id);
  if (!words) return null;
  const [, kind, first] = /^(same as|like) (\S+)/.exec(words) ?? [];
  return kind === "same as" ? `= ${first}` : `≈ ${first}`;
}

/** Which phrase each bar belongs to; a phrase's range also covers the bars of its other endings. */
export function phraseOfBar(map: PhraseMap): Map<number, string> {
  const byBar = new Map<number, string>();
  for (const phrase of phraseList(map)) {
    for (let bar = phrase.bars[0]; bar <= phrase.bars[1]; bar++) byBar.set(bar, phrase.id);
  }
  return byBar;
}

/** "bars 3–4" or "bar 5", for select options and screen-reader text. */
export function barsText(phrase: Pick<Phrase, "bars">): string {
  const [a, b] = phrase.bars;
  return a === b ? `bar ${a}` : `bars ${a}–${b}`;
}
