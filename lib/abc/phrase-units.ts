// Turning a part plan into phrases (and their other-ending variants) ready to compare.
import type { Bar } from "./types";
import type { PartPlan } from "./phrase-parts";
import type { Grouping } from "./phrase-group";

/** Something compared on the grid: a phrase as first played, or the same phrase with another ending. */
export interface Unit {
  id: string;
  part: number; // index of the part
  phrase: number; // 0-based index of the phrase in its part
  ending: string | null; // null for the phrase as first played
  bars: Bar[];
}

export interface PartPhrases {
  /** One entry per phrase: the main unit first, then its variants. */
  phrases: { main: Unit; variants: Unit[]; rangeBars: Bar[] }[];
  endings: string;
}

const nums = (bars: Bar[]): string => {
  const first = bars[0]?.number;
  const last = bars[bars.length - 1]?.number;
  return first === last ? `bar ${first}` : `bars ${first}–${last}`;
};

/**
 * The phrases run through the first ending. Each other ending is the same passage played with
 * different bars: a phrase holding first-ending bars gets a variant with the other ending's bars
 * in their place (bar for bar when the endings are equally long, otherwise the whole other ending
 * follows the bars before the first ending). The other ending's bars are counted in the range of
 * the phrase that holds the end of the first ending, so the ranges still cover the part once.
 */
export function unitsOf(plan: PartPlan, partIndex: number, grouping: Grouping): PartPhrases {
  const phrases: PartPhrases["phrases"] = [];
  let start = 0;
  const spans: [number, number][] = [];
  grouping.phraseBars.forEach((size, p) => {
    const bars = plan.main.slice(start, start + size);
    spans.push([start, start + size]);
    start += size;
    const main: Unit = { id: `${plan.label}${p + 1}`, part: partIndex, phrase: p, ending: null, bars };
    phrases.push({ main, variants: [], rangeBars: [...bars] });
  });
  const notes: string[] = [];
  for (const set of plan.endingSets) {
    const firstBars = plan.main.slice(set.start, set.start + set.length);
    const holderOfEnd = spans.findIndex(([s, e]) => set.start + set.length - 1 >= s && set.start + set.length - 1 < e);
    const made: string[] = [];
    for (const alt of set.alternatives) {
      phrases[holderOfEnd]?.rangeBars.push(...alt.bars);
      spans.forEach(([s, e], p) => {
        const entry = phrases[p];
        if (entry === undefined || e <= set.start || s >= set.start + set.length) return;
        let bars: Bar[];
        if (alt.bars.length === set.length) {
          bars = plan.main.slice(s, e).map((b, k) => {
            const i = s + k - set.start;
            return i >= 0 && i < set.length ? (alt.bars[i] as Bar) : b;
          });
        } else if (set.start >= s) {
          bars = [...plan.main.slice(s, set.start), ...alt.bars];
        } else return;
        const id = `${entry.main.id}/${alt.ending}`;
        entry.variants.push({ id, part: partIndex, phrase: p, ending: alt.ending, bars });
        made.push(id);
      });
    }
    const others = set.alternatives.map((a) => `ending ${a.ending} (${nums(a.bars)})`).join(", ");
    notes.push(
      `phrases run through the first ending (${nums(firstBars)}); ${others || "no other ending"}` +
        (made.length > 0 ? ` compared as ${made.join(", ")}` : ""),
    );
  }
  return { phrases, endings: notes.join("; ") };
}
