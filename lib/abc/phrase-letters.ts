// Form letters (a, b, a′ …) in order of first appearance, and which phrase is each near twin's model.
import type { Unit } from "./phrase-units";
import type { Comparison } from "./phrase-grid";

type Comparer = (a: Unit, b: Unit) => Comparison | null;

const PRIMES = ["", "′", "″", "‴", "⁗"];
const primes = (n: number): string => PRIMES[n] ?? "′".repeat(n);
const letterName = (i: number): string =>
  String.fromCharCode(97 + (i % 26)) + (i >= 26 ? String(Math.floor(i / 26) + 1) : "");

interface Rep {
  unit: Unit;
  letter: string;
  base: number; // index of the base letter
}

/**
 * A phrase takes the letter of the first earlier phrase it equals exactly. Otherwise, if it is a
 * near twin of the first phrase of an earlier letter (its model: the first occurrence, never a
 * variant), it takes that letter with one more prime. Otherwise it gets the next new letter.
 * Comparing near twins only against the unprimed model keeps every a′, a″ … within two notes of a,
 * so swapping each to its model is always a near-twin swap.
 */
export function assignLetters(
  units: Unit[],
  compare: Comparer,
  maxNotes: number,
): { letters: Map<Unit, string>; swaps: [Unit, Unit][] } {
  const letters = new Map<Unit, string>();
  const reps: Rep[] = [];
  const models: Unit[] = []; // by base index
  const variantsOf: number[] = []; // primes used so far, by base index
  const swaps: [Unit, Unit][] = [];
  for (const u of units) {
    const exact = reps.find((r) => compare(r.unit, u)?.differingNotes === 0);
    if (exact !== undefined) {
      letters.set(u, exact.letter);
      const model = models[exact.base];
      // compared over a shorter stretch, "exact" need not carry over to the model: check it
      const toModel = model === undefined ? null : compare(model, u);
      if (
        exact.letter !== letterName(exact.base) &&
        model !== undefined &&
        toModel !== null &&
        toModel.differingNotes <= maxNotes
      ) {
        swaps.push([u, model]);
      }
      continue;
    }
    let best = -1;
    let bestNotes = Infinity;
    models.forEach((m, i) => {
      const c = compare(m, u);
      if (c !== null && c.differingNotes <= maxNotes && c.differingNotes < bestNotes) {
        best = i;
        bestNotes = c.differingNotes;
      }
    });
    const model = models[best];
    if (model !== undefined) {
      variantsOf[best] = (variantsOf[best] ?? 0) + 1;
      const letter = letterName(best) + primes(variantsOf[best] ?? 1);
      reps.push({ unit: u, letter, base: best });
      letters.set(u, letter);
      swaps.push([u, model]);
      continue;
    }
    const base = models.length;
    models.push(u);
    variantsOf.push(0);
    const letter = letterName(base);
    reps.push({ unit: u, letter, base });
    letters.set(u, letter);
  }
  return { letters, swaps };
}
