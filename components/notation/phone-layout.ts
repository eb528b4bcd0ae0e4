// On a phone the music is laid out again with a line break after each phrase (two bars at most
// to a line), so notes and phrase labels keep a readable size instead of a four-bar line being
// shrunk to the screen's width. abcjs's own `wrap` splits lines by spacing and cut phrases in two.
import type { PhraseMap } from "@/lib/abc/phrase-types";
import { barAt, type Abcjs, type BarSpan } from "./loaders";
import { phraseList } from "./phrase-words";

const MAX_BARS = 2;

/** Bar numbers after which a phone's line ends: phrase ends, and every second bar inside a long phrase. */
export function phoneLineEnds(spans: BarSpan[], map: PhraseMap | null | undefined): Set<number> {
  const ends = new Set<number>();
  const numbers = [...new Set(spans.map((s) => s.number).filter((n) => n > 0))].sort((a, b) => a - b);
  const last = numbers[numbers.length - 1];
  if (map) {
    for (const p of phraseList(map)) {
      for (let bar = p.bars[0] + MAX_BARS - 1; bar < p.bars[1]; bar += MAX_BARS) ends.add(bar);
      ends.add(p.bars[1]);
    }
  } else numbers.filter((n) => n % MAX_BARS === 0).forEach((n) => ends.add(n));
  ends.delete(last); // nothing follows the last bar
  return ends;
}

type Item = { el_type: string; startChar?: number };

/**
 * abcjs's `lineBreaks` option: for each section of music, the zero-based indexes, counted over
 * every bar-line element (node_modules/abcjs/src/parse/wrap_lines.js), of the bar lines that end a line.
 */
export function phoneLineBreaks(abcjs: Abcjs, abc: string, spans: BarSpan[], ends: Set<number>): number[][] {
  const [tune] = abcjs.parseOnly(abc);
  if (!tune) return [];
  const out: number[][] = [];
  for (const line of tune.deline()) {
    if (!line.staff) continue;
    const voice = (line.staff[0]?.voices?.[0] ?? []) as Item[];
    const breaks: number[] = [];
    let index = 0;
    for (const el of voice) {
      if (el.el_type !== "bar") continue;
      const bar = el.startChar === undefined ? null : barAt(spans, el.startChar);
      if (bar !== null && ends.has(bar)) breaks.push(index);
      index++;
    }
    out.push(breaks);
  }
  return out;
}
