// Pure helpers for playback: the ABC of one phrase for looping it, and the count-in's clicks.
// Looping a phrase plays a small tune made of exactly its bars (with the tune's header), which
// is simpler and more reliable than seeking inside the whole tune's audio at bar boundaries.
import type { BarSpan } from "./loaders";

const FIELD_LINE = /^\s*[A-Za-z]:/;
// A bar line with its repeat dots and ending number (ABC 2.1 §4.8, §4.9): ":|", "|]", "||", ":|2" …
const TRAILING_BAR = /\s*[:|[\]]*[|\]][:|\]]*(?:\s*\[?\d+(?:[,-]\d+)*)?\s*$/;

function keptFields(body: string): string[] {
  const last = new Map<string, string>();
  for (const line of body.split("\n")) {
    const m = /^\s*([KMLQ]):/.exec(line);
    if (m) last.set(m[1], line.trim());
  }
  return [...last.values()];
}

// A key, meter, unit or tempo line inside the bars stays, as an inline field (ABC 2.1 §3.1 and §3.2);
// other field lines (parts, words, notes) do not affect the sound and are dropped.
const asInline = (line: string): string => {
  const m = /^\s*([KMLQ]):(.*)$/.exec(line);
  return m ? `[${m[1]}:${m[2].trim()}]` : FIELD_LINE.test(line) ? "" : line;
};

function barText(raw: string): string {
  const music = raw
    .split("\n")
    .map((line) => asInline(line.replace(/(^|[^\\])%.*$/, "$1")))
    .join(" ")
    .replace(/\\\s*/g, " ")
    .replace(TRAILING_BAR, "")
    .trim();
  return music;
}

/**
 * A tune made of the given bars only, in the order given, with the header up to K: and any key,
 * meter, unit or tempo change met before the first of them. Repeat signs become plain bar lines
 * so the phrase plays once; the caller repeats it.
 */
export function phraseAbc(abc: string, spans: BarSpan[], barNumbers: readonly number[]): string {
  const key = /^K:.*$/m.exec(abc);
  const headerEnd = key ? key.index + key[0].length : 0;
  const chosen = barNumbers
    .map((n) => spans.find((s) => s.number === n && s.startChar >= headerEnd))
    .filter((s): s is BarSpan => s !== undefined);
  if (chosen.length === 0) return abc;
  const header = abc.slice(0, headerEnd).replace(/^P:.*\n?/gm, "");
  const fields = keptFields(abc.slice(headerEnd, chosen[0].startChar));
  const bars = chosen.map((s) => barText(abc.slice(s.startChar, s.endChar))).filter((t) => t.length > 0);
  return [header.trimEnd(), ...fields, `${bars.join(" | ")} |]`, ""].join("\n");
}

export interface Meter {
  num: number;
  den: number;
}

export interface Click {
  start: number; // whole notes from the start of the count-in bar
  accent: boolean;
}

/**
 * One bar of clicks on the beat: 6/8, 9/8 and 12/8 count in dotted quarters, other meters in
 * their written unit (common practice). Clicks that would fall after the first note (a pickup
 * starts inside the count-in bar) are left out.
 */
export function countInClicks(meter: Meter, pickup = 0): Click[] {
  const compound = meter.den === 8 && meter.num % 3 === 0 && meter.num > 3;
  const beats = compound ? meter.num / 3 : meter.num;
  const beat = compound ? 3 / 8 : 1 / meter.den;
  const bar = meter.num / meter.den;
  const clicks: Click[] = [];
  for (let i = 0; i < beats; i++) {
    const start = i * beat;
    if (start < bar - pickup - 1e-9) clicks.push({ start, accent: i === 0 });
  }
  return clicks;
}

/** Beats per minute when the tune gives no Q: field: a steady practice pace (common practice). */
export function practiceBeatsPerMinute(meter: Meter): number {
  return meter.den === 8 && meter.num % 3 === 0 && meter.num > 3 ? 80 : 100;
}
