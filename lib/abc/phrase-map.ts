// The phrase map (issue 3 §5): parts, phrases, form letters, twins, cross-part patterns and the
// learning load, computed from the skeleton's bars in one pass over the notes (no parsing).
import type { Bar, Fraction } from "./types";
import type { PartMap, PhraseMap, Swap, Twin } from "./phrase-types";
import { beatNumber, fullBarLength, gridStep, pitchName } from "./phrase-time";
import { cellsOf, compareCells, NO_CELLS, sampleBars, type Comparison } from "./phrase-grid";
import { findParts } from "./phrase-parts";
import { groupBars } from "./phrase-group";
import { unitsOf, type Unit } from "./phrase-units";
import { findPatterns } from "./phrase-patterns";
import { assignLetters } from "./phrase-letters";

export type { PhraseMap } from "./phrase-types";

/** Twins differ in at most this many notes (PRODUCT.md §3: "only one or two notes"). */
export const NEAR_TWIN_NOTES = 2;

export type Comparer = (a: Unit, b: Unit) => Comparison | null;

export function phraseMap(bars: Bar[], meter: Fraction, unit: Fraction): PhraseMap {
  const step = gridStep(bars, unit);
  const grids = sampleBars(bars, step);
  const plans = findParts(bars, fullBarLength(bars, meter));

  const perPart = plans.map((plan, i) => {
    const grouping = groupBars(plan.main.length);
    return { plan, grouping, pp: unitsOf(plan, i, grouping) };
  });
  // Letters go to the phrases as first played, in order, and only then to other endings: a second
  // ending unlike anything else gets a letter of its own without shifting the letters of the parts.
  const mains = perPart.flatMap((p) => p.pp.phrases.map((x) => x.main));
  const units: Unit[] = [...mains, ...perPart.flatMap((p) => p.pp.phrases.flatMap((x) => x.variants))];

  const index = new Map(units.map((u, i) => [u, i]));
  const cells = units.map((u) => cellsOf(u.bars, grids, step));
  const cache = new Map<number, Comparison | null>();
  const compare: Comparer = (a, b) => {
    const i = index.get(a) ?? 0;
    const j = index.get(b) ?? 0;
    const key = i < j ? i * units.length + j : j * units.length + i;
    let c = cache.get(key);
    if (c === undefined) {
      // phrases of different bar counts are never twins; the rest stop counting past a near twin
      c =
        a.bars.length !== b.bars.length
          ? null
          : compareCells(cells[i] ?? NO_CELLS, cells[j] ?? NO_CELLS, NEAR_TWIN_NOTES);
      // a twin keeps most of its notes: two of three notes changed is another phrase, not a near twin
      if (
        c !== null &&
        c.differingNotes > 0 &&
        c.differingNotes <= NEAR_TWIN_NOTES &&
        c.notes - c.differingNotes <= c.differingNotes
      ) {
        c = { ...c, differingNotes: NEAR_TWIN_NOTES + 1 };
      }
      cache.set(key, c);
    }
    return c;
  };

  const { letters, swaps: swapPairs } = assignLetters(units, compare, NEAR_TWIN_NOTES);

  const twins: Twin[] = [];
  for (let i = 0; i < units.length; i++) {
    for (let j = i + 1; j < units.length; j++) {
      const a = units[i] as Unit;
      const b = units[j] as Unit;
      const c = compare(a, b);
      if (c === null || c.differingNotes > NEAR_TWIN_NOTES) continue;
      twins.push({
        first: a.id,
        second: b.id,
        kind: c.differingNotes === 0 ? "exact" : "near",
        differingNotes: c.differingNotes,
        differences: c.differences.map((d) => ({
          firstBar: d.firstBar,
          secondBar: d.secondBar,
          lastFirstBar: d.lastFirstBar,
          lastSecondBar: d.lastSecondBar,
          beat: beatNumber(d.onset, meter),
          firstPitch: d.firstPitch,
          secondPitch: d.secondPitch,
          firstNote: pitchName(d.firstPitch),
          secondNote: pitchName(d.secondPitch),
          notes: d.notes,
        })),
        partial: c.partial,
      });
    }
  }

  const parts: PartMap[] = perPart.map(({ plan, grouping, pp }) => ({
    label: plan.label,
    foundBy: plan.foundBy,
    pickup: plan.pickups.map((b) => b.number),
    countedBars: plan.main.length,
    grouping,
    endings: pp.endings,
    phrases: pp.phrases.map((p) => ({
      id: p.main.id,
      bars: range(p.rangeBars),
      barNumbers: p.main.bars.map((b) => b.number),
      letter: letters.get(p.main) ?? "?",
      alternatives: p.variants.map((v) => ({
        id: v.id,
        ending: v.ending ?? "",
        bars: range(v.bars),
        barNumbers: v.bars.map((b) => b.number),
        letter: letters.get(v) ?? "?",
      })),
    })),
  }));

  const swaps: Swap[] = swapPairs.map(([u, model]) => ({
    phrase: u.id,
    model: model.id,
    differingNotes: compare(u, model)?.differingNotes ?? 0,
  }));
  const distinct = new Set(letters.values()).size;
  const swapped = new Set(swapPairs.map(([u]) => u));
  const afterSwaps = new Set(units.map((u) => (swapped.has(u) ? baseLetter(letters.get(u) ?? "") : letters.get(u))))
    .size;

  return {
    parts,
    twins,
    patterns: findPatterns(
      perPart.map((p) => ({ label: p.plan.label, phrases: p.pp.phrases })),
      compare,
      NEAR_TWIN_NOTES,
    ),
    swaps,
    learningLoad: { distinct, afterSwaps },
    grid: `${step.num}/${step.den}`,
  };
}

/** The letter without its primes: a′ → a. */
export const baseLetter = (letter: string): string => letter.replace(/[′″‴⁗]+$/u, "");

function range(bars: Bar[]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const b of bars) {
    lo = Math.min(lo, b.number);
    hi = Math.max(hi, b.number);
  }
  return bars.length === 0 ? [0, 0] : [lo, hi];
}
