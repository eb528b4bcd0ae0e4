// Where a bar's own music is in the ABC text, and which fields are in force there: what the twin
// swap needs to copy one bar's text over another's safely.
import type { Bar } from "./types";

/**
 * The bar's music without the bar lines around it: from its first symbol (after any line break,
 * field line or ending number that precedes it) to just before its closing bar line. Chord
 * symbols, decorations and a slur closed after the last note stay inside; the closing bar line
 * (with any repeat dots or the next ending's number) stays outside.
 */
export function barContent(abc: string, bar: Bar): [number, number] {
  const first = bar.notes[0]?.startChar ?? bar.startChar;
  let start = bar.startChar;
  // a line break before the first note leaves field lines (P:, K: …) and the break outside
  for (let i = first - 1; i >= start; i--) {
    if (abc.charCodeAt(i) === 10) {
      start = i + 1;
      break;
    }
  }
  while (start < first && /\s/.test(abc.charAt(start))) start++;
  let end = start;
  for (const n of bar.notes) if (n.endChar > end) end = n.endChar;
  end = Math.min(end, bar.endChar);
  // walk past what may follow the last note (")", "!fermata!", "[K:G]", a chord symbol) up to the bar line
  let i = end;
  while (i < bar.endChar) {
    const c = abc.charAt(i);
    if (c === "|" || (c === ":" && /[|:]/.test(abc.charAt(i + 1)))) break;
    if (c === "[" && /[|\d]/.test(abc.charAt(i + 1))) break;
    if (c === "\n" || c === "\\") break; // a line break or continuation belongs to the layout, not the bar
    const close = c === '"' ? '"' : c === "!" ? "!" : c === "[" ? "]" : c === "{" ? "}" : "";
    if (close !== "") {
      let j = i + 1;
      while (j < bar.endChar && abc.charAt(j) !== close) j++;
      i = j >= bar.endChar ? i + 1 : j + 1;
    } else i++;
    if (!/\s/.test(c)) end = i;
  }
  // abcjs may count spaces or a line continuation after the last note as part of it
  while (end > start && /[\s\\]/.test(abc.charAt(end - 1))) end--;
  return [start, end];
}

/**
 * The K:, L:, M: and V: fields in force at each position (header and body, inline or on their own
 * line), read once. Copying a bar's text is only safe where the same fields are in force, or its
 * notes would sound or last differently.
 */
export function fieldsIndex(abc: string): (at: number) => string {
  const offsets: number[] = [];
  const states: string[] = [];
  const found: Record<string, string> = {};
  const re = /(?:^|\[)([KLMV]):([^\]\n%]*)/gm;
  for (let m = re.exec(abc); m !== null; m = re.exec(abc)) {
    found[m[1] as string] = (m[2] ?? "").trim();
    offsets.push(m.index);
    states.push(["K", "L", "M", "V"].map((k) => `${k}:${found[k] ?? ""}`).join("|"));
  }
  const none = "K:|L:|M:|V:";
  return (at) => {
    // the last field that starts before `at`
    let lo = 0;
    let hi = offsets.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((offsets[mid] as number) < at) lo = mid + 1;
      else hi = mid;
    }
    return lo === 0 ? none : (states[lo - 1] as string);
  };
}
