// What abcjs reads without a warning but not as the teacher meant it (problems), and the slips a
// teacher makes often that leave the music readable (notes): both found on the model.
import { cmp, div, eq, toString as fractionText } from "./fraction";
import { valueAt } from "./header";
import type { Locator } from "./locate";
import type { TuneModel } from "./model";
import type { VBar } from "./bars";
import type { Tok } from "./lex";
import type { Fraction, Problem } from "./types";

/**
 * A "]" that closes nothing (abcjs takes it for an invisible bar line and splits the bar), and a
 * tuplet marker with no notes after it before the bar line (abcjs drops it silently).
 */
export function lintProblems(model: TuneModel, loc: Locator): Problem[] {
  const out: Problem[] = [];
  const { abc, edits } = model;
  for (const el of edits) {
    if (el.type === "note") {
      if (el.lex.odd) out.push(oddText(abc, el.lex.toks, el.lex.odd, loc));
      continue;
    }
    if (el.barType !== "bar_invisible") continue;
    const own = abc.slice(el.start, el.end).replace(/"[^"]*"|![^!]*!/g, "");
    // ABC 2.1's invisible bar line is [|]; a "]" with no "[" is abcjs's guess at a stray bracket
    if (own.includes("]") && !own.includes("["))
      out.push(
        loc.at(
          el.start + own.indexOf("]"),
          `This "]" closes nothing: no chord [ or inline field [K:… was opened before it`,
        ),
      );
  }
  for (const t of model.tuplets) {
    if (t.complete) continue;
    const first = t.els[0];
    const at = t.marker?.start ?? first?.start ?? 0;
    const want = /^\d+:\d*:(\d+)/.exec(t.spec)?.[1] ?? String(t.p);
    out.push(
      loc.at(
        at,
        `The tuplet "(${t.spec}" has ${t.els.length} of its ${want} notes before the line ends: a tuplet's notes are written on one line`,
      ),
    );
  }
  const headerEnd = model.header.headerEnd;
  for (let i = abc.indexOf("(", headerEnd); i >= 0; i = abc.indexOf("(", i + 1)) {
    const d = abc.charCodeAt(i + 1);
    if (d < 48 || d > 57 || inside(edits, i) || !inMusic(abc, i)) continue;
    // a chord symbol or a space may stand between the marker and its notes: only a bar line
    // (or the end) before the next note leaves the tuplet without notes
    if (nextAfter(edits, i)?.type === "note") continue;
    const spec = /^\(\d+(?::\d*){0,2}/.exec(abc.slice(i, i + 12))?.[0] ?? "(";
    out.push(loc.at(i, `The tuplet "${spec}" has no notes after it before the bar line`));
  }
  return out;
}

/** Text abcjs took as part of a note that no ABC rule puts there: it would be read one way and written another. */
function oddText(abc: string, toks: readonly Tok[], odd: Tok, loc: Locator): Problem {
  const text = abc.slice(odd.start, odd.end);
  if (text === "]")
    return loc.at(odd.start, `This "]" closes nothing: no chord [ or inline field [K:… was opened before it`);
  const i = toks.indexOf(odd);
  const before = toks[i - 1];
  if (/^\d/.test(text) && before?.kind === "broken") {
    const len = /^[\d/]+/.exec(abc.slice(odd.start, odd.start + 12))?.[0] ?? text;
    return loc.at(
      odd.start,
      `The length "${len}" comes after the broken-rhythm mark "${before.name}": a note's length is written before it (ABC 2.1 §4.4)`,
    );
  }
  return loc.at(odd.start, `"${text}" is not read as part of the note before it`);
}

/** The first element starting after offset `at` (elements sorted by start). */
function nextAfter(edits: TuneModel["edits"], at: number): TuneModel["edits"][number] | undefined {
  let lo = 0;
  let hi = edits.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (edits[mid].start <= at) lo = mid + 1;
    else hi = mid;
  }
  return edits[lo];
}

/** Whether offset `at` lies inside one of the elements (sorted by start). */
function inside(edits: TuneModel["edits"], at: number): boolean {
  let lo = 0;
  let hi = edits.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (edits[mid].start <= at) lo = mid + 1;
    else hi = mid;
  }
  for (let k = lo - 1; k >= 0 && k >= lo - 4; k--) if (at < edits[k].end) return true;
  return false;
}

/** Not in a comment, a field line, a chord symbol or a decoration of its line. */
function inMusic(abc: string, at: number): boolean {
  const start = abc.lastIndexOf("\n", at - 1) + 1;
  const before = abc.slice(start, at);
  if (/^[A-Za-z+]:/.test(before) || before.includes("%")) return false;
  let quotes = 0;
  for (const c of before) if (c === '"') quotes++;
  return quotes % 2 === 0 && !/![^!\s]*$/.test(before);
}

const UNIT_NAMES: Record<number, string> = {
  1: "whole notes",
  2: "half notes",
  4: "quarter notes",
  8: "eighths",
  16: "sixteenths",
  32: "thirty-seconds",
};
/** Most tunes with a wrong meter have many long bars: past this many, one note sums up the rest. */
const MAX_BAR_NOTES = 10;

/**
 * A bar whose length is not the meter's, named by its number: a slip teachers make often. A
 * pickup, a closing bar that completes a pickup (common practice in dance-tune notation: the last
 * bar of a part and the pickup together make one bar), an ending and a multi-bar rest are left alone.
 */
export function barLengthNotes(model: TuneModel, loc: Locator): Problem[] {
  const bars = model.bars.get(model.melody) ?? [];
  const pickups: Fraction[] = [];
  for (const b of bars) if (b.number === 0) pickups.push(b.length);
  const odd: VBar[] = [];
  bars.forEach((bar, i) => {
    const m = bar.meter;
    if (m === null || bar.number === 0 || bar.ending !== null || eq(bar.length, m)) return;
    if (bar.notes.some((n) => n.body.rest === "Z" || n.body.rest === "X")) return;
    const short = cmp(bar.length, m) < 0;
    const next = bars[i + 1];
    if (short && next !== undefined && next.number === 0) return; // completed by the next part's pickup
    const closing =
      next === undefined || bar.right === null || !["bar_thin", "bar_invisible"].includes(bar.right.barType);
    if (short && closing && pickups.some((p) => completes(p, bar.length, m))) return;
    odd.push(bar);
  });
  const out = odd.slice(0, MAX_BAR_NOTES).map((bar) => {
    const unit = valueAt(model.header.units, bar.startChar);
    const m = bar.meter as Fraction;
    return loc.at(
      bar.notes[0]?.start ?? bar.startChar,
      `Bar ${bar.number} lasts ${amount(bar.length, unit)}, but M:${m.num}/${m.den} makes a bar of ${amount(m, unit)}`,
    );
  });
  if (odd.length > MAX_BAR_NOTES) {
    const rest = odd.slice(MAX_BAR_NOTES);
    out.push(
      loc.at(
        rest[0].notes[0]?.start ?? rest[0].startChar,
        `${rest.length} more bars (${rest
          .slice(0, 8)
          .map((b) => b.number)
          .join(", ")}${rest.length > 8 ? " …" : ""}) are not as long as the meter makes a bar: is M: right?`,
      ),
    );
  }
  return out;
}

const completes = (pickup: Fraction, closing: Fraction, m: Fraction): boolean =>
  pickup.num * closing.den * m.den + closing.num * pickup.den * m.den === m.num * pickup.den * closing.den;

/** "10 eighths", "9/2 quarter notes". */
function amount(len: Fraction, unit: Fraction): string {
  const n = div(len, unit);
  const name = unit.num === 1 ? UNIT_NAMES[unit.den] : undefined;
  if (!name) return `${fractionText(n)} × L:${unit.num}/${unit.den}`;
  return `${fractionText(n)} ${n.num === 1 && n.den === 1 ? name.replace(/s$/, "") : name}`;
}
