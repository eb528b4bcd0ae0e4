// How a part's bars are grouped into phrases (issue 3 §5, PRODUCT.md §4.5).

export interface Grouping {
  /** Bars in each phrase, in order; they add up to the part's counted bars. */
  phraseBars: number[];
  /** Plain-English statement of the grouping and why it was chosen. */
  reason: string;
}

const plural = (n: number, word: string): string => `${n} ${word}${n === 1 ? "" : "s"}`;

/**
 * Four phrases per part when its bars divide by four (the rule of issue 3 §5); otherwise the
 * grouping closest to four phrases whose phrases are 2, 4 or 8 bars long (phrases of a power of
 * two bars are the norm in dance tunes: common practice). Bars left over form a shorter last
 * phrase when there are at least two, or lengthen the last phrase when there is one. A phrase of
 * a single bar is never made (a 4-bar part is two 2-bar phrases): one bar is a motif, not a
 * phrase a student would loop.
 */
export function groupBars(n: number): Grouping {
  if (n <= 0) return { phraseBars: [], reason: "the part has no counted bars" };
  if (n % 4 === 0 && n >= 8) {
    const size = n / 4;
    return {
      phraseBars: [size, size, size, size],
      reason: `${plural(n, "bar")}: four phrases of ${plural(size, "bar")}`,
    };
  }
  if (n <= 3) return { phraseBars: [n], reason: `${plural(n, "bar")}: too short to split, one phrase` };
  let best: { sizes: number[]; score: number[] } | null = null;
  for (const size of [2, 4, 8]) {
    if (size > n) break;
    const whole = Math.floor(n / size);
    const rest = n % size;
    const sizes = Array<number>(whole).fill(size);
    if (rest >= 2) sizes.push(rest);
    else if (rest === 1) sizes[sizes.length - 1] += 1;
    // closest to four phrases, then equal phrases, then shorter phrases
    const score = [Math.abs(sizes.length - 4), rest === 0 ? 0 : 1, size];
    if (best === null || lexLess(score, best.score)) best = { sizes, score };
  }
  const sizes = best?.sizes ?? [n];
  const equal = sizes.every((s) => s === sizes[0]);
  const what = equal
    ? `${sizes.length} phrases of ${plural(sizes[0] ?? n, "bar")}`
    : `${sizes.length} phrases of ${sizes.join(", ")} bars`;
  return {
    phraseBars: sizes,
    reason: `${plural(n, "bar")} do not divide into four phrases of two or more bars: ${what}, the closest even grouping`,
  };
}

function lexLess(a: number[], b: number[]): boolean {
  for (let i = 0; i < a.length; i++) {
    const x = a[i] ?? 0;
    const y = b[i] ?? 0;
    if (x !== y) return x < y;
  }
  return false;
}
