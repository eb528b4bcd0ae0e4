// The patterns teachers look for across a tune (PRODUCT.md §4.5): phrase 1 = phrase 3 of a part,
// last phrase of one part = last phrase of an earlier one, second half of one part = second half of
// an earlier one.
import type { Pattern } from "./phrase-types";
import type { Unit } from "./phrase-units";
import type { Comparison } from "./phrase-grid";

type Comparer = (a: Unit, b: Unit) => Comparison | null;
interface PartPhrases {
  label: string;
  phrases: { main: Unit; variants: Unit[] }[];
}

const kindOf = (n: number): "exact" | "near" => (n === 0 ? "exact" : "near");
const says = (n: number): string => (n === 0 ? "exactly" : `but for ${n} note${n === 1 ? "" : "s"}`);

/** The closest pairing of two phrases, trying every ending of each (a part may share its last phrase through its second ending). */
function best(
  a: { main: Unit; variants: Unit[] },
  b: { main: Unit; variants: Unit[] },
  compare: Comparer,
): { a: Unit; b: Unit; n: number } | null {
  let out: { a: Unit; b: Unit; n: number } | null = null;
  for (const x of [a.main, ...a.variants]) {
    for (const y of [b.main, ...b.variants]) {
      const c = compare(x, y);
      if (c !== null && (out === null || c.differingNotes < out.n)) out = { a: x, b: y, n: c.differingNotes };
    }
  }
  return out;
}

export function findPatterns(parts: PartPhrases[], compare: Comparer, maxNotes: number): Pattern[] {
  const out: Pattern[] = [];
  for (const part of parts) {
    const p1 = part.phrases[0];
    const p3 = part.phrases[2];
    if (p1 === undefined || p3 === undefined) continue;
    const c = compare(p1.main, p3.main);
    if (c === null || c.differingNotes > maxNotes) continue;
    out.push({
      pattern: "phrase1=phrase3",
      parts: [part.label],
      first: [p1.main.id],
      second: [p3.main.id],
      kind: kindOf(c.differingNotes),
      differingNotes: c.differingNotes,
      description: `phrase 1 of part ${part.label} comes back as phrase 3, ${says(c.differingNotes)}`,
    });
  }
  // Each part is paired with the first earlier part that shares the pattern: a long tune that
  // repeats its parts would otherwise list every pair of repeats.
  for (let j = 1; j < parts.length; j++) {
    const b = parts[j] as PartPhrases;
    const lastB = b.phrases[b.phrases.length - 1];
    let lastFound = false;
    let halfFound = false;
    for (let i = 0; i < j && !(lastFound && halfFound); i++) {
      const a = parts[i] as PartPhrases;
      const lastA = a.phrases[a.phrases.length - 1];
      if (!lastFound && lastA !== undefined && lastB !== undefined && a.phrases.length >= 2 && b.phrases.length >= 2) {
        const last = best(lastA, lastB, compare);
        if (last !== null && last.n <= maxNotes) {
          lastFound = true;
          out.push({
            pattern: "lastPhraseShared",
            parts: [a.label, b.label],
            first: [last.a.id],
            second: [last.b.id],
            kind: kindOf(last.n),
            differingNotes: last.n,
            description: `parts ${a.label} and ${b.label} end with the same phrase, ${says(last.n)}`,
          });
        }
      }
      const half = halfFound ? null : secondHalf(a, b, compare);
      if (half !== null && half.n <= maxNotes) {
        halfFound = true;
        out.push({
          pattern: "secondHalfShared",
          parts: [a.label, b.label],
          first: half.first,
          second: half.second,
          kind: kindOf(half.n),
          differingNotes: half.n,
          description: `the second half of part ${a.label} is the second half of part ${b.label}, ${says(half.n)}`,
        });
      }
    }
  }
  return out;
}

/** Only parts with the same number of phrases (at least four) have halves that can match. */
function secondHalf(
  a: PartPhrases,
  b: PartPhrases,
  compare: Comparer,
): { first: string[]; second: string[]; n: number } | null {
  const count = a.phrases.length;
  if (count !== b.phrases.length || count < 4) return null;
  const first: string[] = [];
  const second: string[] = [];
  let n = 0;
  for (let k = count - Math.floor(count / 2); k < count; k++) {
    const x = a.phrases[k];
    const y = b.phrases[k];
    if (x === undefined || y === undefined) return null;
    const m = k === count - 1 ? best(x, y, compare) : pair(x.main, y.main, compare);
    if (m === null) return null;
    first.push(m.a.id);
    second.push(m.b.id);
    n += m.n;
  }
  return { first, second, n };
}

function pair(a: Unit, b: Unit, compare: Comparer): { a: Unit; b: Unit; n: number } | null {
  const c = compare(a, b);
  return c === null ? null : { a, b, n: c.differingNotes };
}
