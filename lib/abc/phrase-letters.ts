// Form letters (a, b, a′ …) in order of first appearance, and which phrase is each near twin's model.
import type { Unit } from "./phrase-units";
import type { ContentIndex } from "./phrase-index";

const PRIMES = ["", "′", "″", "‴", "⁗"];
const primes = (n: number): string => PRIMES[n] ?? "′".repeat(n);
const letterName = (i: number): string =>
  String.fromCharCode(97 + (i % 26)) + (i >= 26 ? String(Math.floor(i / 26) + 1) : "");

interface Rep {
  unit: Unit;
  order: number; // place among the reps
  letter: string;
  base: number; // index of the base letter
}

/**
 * A phrase takes the letter of the first earlier phrase it equals exactly. Otherwise, if it is a
 * near twin of the first phrase of an earlier letter (its model: the first occurrence, never a
 * variant), it takes that letter with one more prime. Otherwise it gets the next new letter.
 * Comparing near twins only against the unprimed model keeps every a′, a″ … within two notes of a,
 * so swapping each to its model is always a near-twin swap. Only the contents the index found
 * within `maxNotes` of a phrase's own are looked at, so a long tune costs no more per phrase.
 * A phrase is never swapped to another ending of itself: a first and a second ending differ on
 * purpose (common practice), so such a phrase keeps its primed letter but no swap is offered.
 */
export function assignLetters(
  units: Unit[],
  cidOf: (u: Unit) => number,
  index: ContentIndex,
  maxNotes: number,
): { letters: Map<Unit, string>; swaps: [Unit, Unit][] } {
  const letters = new Map<Unit, string>();
  const repOf = new Map<number, Rep>(); // the first rep with each content
  const modelOf = new Map<number, number>(); // content of each model → its base index
  const models: Unit[] = []; // by base index
  const variantsOf: number[] = []; // primes used so far, by base index
  const swaps: [Unit, Unit][] = [];
  let reps = 0;
  const differing = (a: number, b: number): number =>
    a === b ? 0 : (index.near[a]?.find((n) => n.c === b)?.cmp.differingNotes ?? Infinity);
  const offer = (u: Unit, model: Unit): void => {
    if (!(model.part === u.part && model.phrase === u.phrase)) swaps.push([u, model]);
  };
  for (const u of units) {
    const c = cidOf(u);
    const near = index.near[c] ?? [];
    let exact = repOf.get(c);
    for (const n of near) {
      if (n.cmp.differingNotes !== 0) continue;
      const r = repOf.get(n.c);
      if (r !== undefined && (exact === undefined || r.order < exact.order)) exact = r;
    }
    if (exact !== undefined) {
      letters.set(u, exact.letter);
      const model = models[exact.base];
      // compared over a shorter stretch, "exact" need not carry over to the model: check it
      if (exact.letter !== letterName(exact.base) && model !== undefined && differing(cidOf(model), c) <= maxNotes) {
        offer(u, model);
      }
      continue;
    }
    let best = -1;
    let bestNotes = Infinity;
    for (const n of near) {
      const b = modelOf.get(n.c);
      const d = n.cmp.differingNotes;
      if (b !== undefined && d <= maxNotes && (d < bestNotes || (d === bestNotes && b < best))) {
        best = b;
        bestNotes = d;
      }
    }
    const model = models[best];
    const rep = (letter: string, base: number): void => {
      const r: Rep = { unit: u, order: reps++, letter, base };
      if (!repOf.has(c)) repOf.set(c, r);
      letters.set(u, letter);
    };
    if (model !== undefined) {
      variantsOf[best] = (variantsOf[best] ?? 0) + 1;
      rep(letterName(best) + primes(variantsOf[best] ?? 1), best);
      offer(u, model);
      continue;
    }
    const base = models.length;
    models.push(u);
    variantsOf.push(0);
    if (!modelOf.has(c)) modelOf.set(c, base);
    rep(letterName(base), base);
  }
  return { letters, swaps };
}
