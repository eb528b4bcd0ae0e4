// The phrase map (issue 3 §5): parts, phrases, form letters, twins, cross-part patterns and the
// learning load, computed from the skeleton's bars in one pass over the notes (no parsing).
import type { Bar, Fraction } from "./types";
import type { PartMap, PhraseMap, Swap, Twin } from "./phrase-types";
import { beatNumber, fullBarLength, gridStep, pitchName } from "./phrase-time";
import { cellsOf, compareCells, NO_CELLS, sampleBars, type Comparison } from "./phrase-grid";
import { indexContents } from "./phrase-index";
import { findParts } from "./phrase-parts";
import { groupBars } from "./phrase-group";
import { unitsOf, type Unit } from "./phrase-units";
import { findPatterns } from "./phrase-patterns";
import { assignLetters } from "./phrase-letters";

export type { PhraseMap } from "./phrase-types";

/** Twins differ in at most this many notes (PRODUCT.md §3: "only one or two notes"). */
export const NEAR_TWIN_NOTES = 2;

export type Comparer = (a: Unit, b: Unit) => Comparison | null;

const SAME: Comparison = { differingNotes: 0, notes: 0, differences: [], partial: false };
/** Further apart than a near twin: the exact count is not kept. */
const FAR: Comparison = { differingNotes: NEAR_TWIN_NOTES + 1, notes: 0, differences: [], partial: false };

export function phraseMap(bars: Bar[], meter: Fraction, unit: Fraction): PhraseMap {
  return phraseMapWithParts(bars, meter, unit).map;
}

/** The phrase map and the part label it gives each bar (for listings that name the part). */
export function phraseMapWithParts(
  bars: Bar[],
  meter: Fraction,
  unit: Fraction,
): { map: PhraseMap; partOf: Map<Bar, string> } {
  const step = gridStep(bars, unit);
  const grids = sampleBars(bars, step);
  const plans = findParts(bars, fullBarLength(bars, meter));
  const partOf = new Map<Bar, string>();
  for (const plan of plans) for (const b of plan.bars) partOf.set(b, plan.label);

  const perPart = plans.map((plan, i) => {
    const grouping = groupBars(plan.main.length);
    return { plan, grouping, pp: unitsOf(plan, i, grouping) };
  });
  // Letters go to the phrases as first played, in order, and only then to other endings: a second
  // ending unlike anything else gets a letter of its own without shifting the letters of the parts.
  const mains = perPart.flatMap((p) => p.pp.phrases.map((x) => x.main));
  const units: Unit[] = [...mains, ...perPart.flatMap((p) => p.pp.phrases.flatMap((x) => x.variants))];

  const order = new Map(units.map((u, i) => [u, i]));
  const cells = units.map((u) => cellsOf(u.bars, grids, step));
  // a twin keeps most of its notes: two of three notes changed is another phrase, not a near twin
  const keep = (c: Comparison): boolean =>
    !(c.differingNotes > 0 && c.differingNotes <= NEAR_TWIN_NOTES && c.notes - c.differingNotes <= c.differingNotes);
  const index = indexContents(
    cells,
    units.map((u) => u.bars.length),
    NEAR_TWIN_NOTES,
    keep,
  );
  const cidOf = (u: Unit): number => index.cid[order.get(u) ?? 0] ?? 0;
  const compare: Comparer = (a, b) => {
    const ca = cidOf(a);
    const cb = cidOf(b);
    if (ca === cb) return SAME;
    if (a.bars.length !== b.bars.length) return null;
    return index.near[ca]?.find((n) => n.c === cb)?.cmp ?? FAR;
  };

  const { letters, swaps: swapPairs } = assignLetters(units, cidOf, index, NEAR_TWIN_NOTES);

  // Twins: each phrase with the first phrase of the same notes, the first phrases of near contents
  // with each other, and each swap's pair; listing every pair of a long tune's repeats would grow
  // with the square of its length and say nothing more.
  const pairs = new Map<string, [Unit, Unit, Comparison]>();
  const add = (a: Unit, b: Unit, c: Comparison): void => {
    const [x, y] = (order.get(a) ?? 0) < (order.get(b) ?? 0) ? [a, b] : [b, a];
    const key = `${x.id} ${y.id}`;
    if (!pairs.has(key)) pairs.set(key, [x, y, c]);
  };
  units.forEach((u, i) => {
    const firstOfContent = index.first[index.cid[i] ?? 0] ?? i;
    if (firstOfContent !== i) add(units[firstOfContent] as Unit, u, SAME);
  });
  index.near.forEach((list, c) => {
    for (const n of list)
      if (n.c > c) add(units[index.first[c] ?? 0] as Unit, units[index.first[n.c] ?? 0] as Unit, n.cmp);
  });
  for (const [u, model] of swapPairs) {
    const i = order.get(model) ?? 0;
    const j = order.get(u) ?? 0;
    if (!pairs.has(`${model.id} ${u.id}`) && !pairs.has(`${u.id} ${model.id}`))
      add(
        model,
        u,
        compareCells(cells[Math.min(i, j)] ?? NO_CELLS, cells[Math.max(i, j)] ?? NO_CELLS, NEAR_TWIN_NOTES),
      );
  }
  const twins: Twin[] = [...pairs.values()]
    .sort(([a, b], [c, d]) => (order.get(a) ?? 0) - (order.get(c) ?? 0) || (order.get(b) ?? 0) - (order.get(d) ?? 0))
    .map(([a, b, c]) => {
      // a comparison of two other phrases with the same notes counts the same, but names their bars
      const own =
        c === SAME || (index.first[cidOf(a)] === order.get(a) && index.first[cidOf(b)] === order.get(b))
          ? c
          : compareCells(cells[order.get(a) ?? 0] ?? NO_CELLS, cells[order.get(b) ?? 0] ?? NO_CELLS, NEAR_TWIN_NOTES);
      return {
        first: a.id,
        second: b.id,
        kind: own.differingNotes === 0 ? ("exact" as const) : ("near" as const),
        differingNotes: own.differingNotes,
        differences: own.differences.map((d) => ({
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
        partial: own.partial,
      };
    });

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

  const map: PhraseMap = {
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
  return { map, partOf };
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
