// How much one tune may hold. Each limit is checked before anything is made in proportion to it:
// the text's size before abcjs reads it, bar counts and lengths on the model (which is made in
// proportion to the text) before the phrase grid, whose size follows the music's length.
import { cmp, frac, mul, toNumber } from "./fraction";
import type { Locator } from "./locate";
import type { TuneModel } from "./model";
import type { Fraction, Problem } from "./types";

/** A long medley is a few thousand characters; a file of many tunes is split before this. */
export const MAX_ABC_BYTES = 200_000;
/** More than any written-out set of tunes. */
export const MAX_BARS = 2000;
/** A note or rest (or a whole bar) longer than this many bars of its meter is a slip of the keyboard. */
export const MAX_NOTE_BARS = 64;
/** The longest bar a meter may make, in whole notes (M:16/4): longer ones are not dance-tune meters. */
export const MAX_BAR_WHOLES = 4;

const FREE_METER = frac(1); // measured as 4/4 where M: is none or missing
const count = (n: number): string => Math.round(n).toLocaleString("en");

/** Problem at the offset where the text passes MAX_ABC_BYTES (UTF-8), or null. */
export function sizeProblem(abc: string, loc: Locator): Problem | null {
  // a UTF-16 unit is at most 3 bytes of UTF-8: short texts need no count
  if (abc.length * 3 <= MAX_ABC_BYTES) return null;
  let bytes = 0;
  let over = -1;
  for (let i = 0; i < abc.length; i++) {
    const c = abc.charCodeAt(i);
    bytes += c < 0x80 ? 1 : c < 0x800 ? 2 : c >= 0xd800 && c < 0xdc00 ? 4 : c >= 0xdc00 && c < 0xe000 ? 0 : 3;
    if (over < 0 && bytes > MAX_ABC_BYTES) over = i;
  }
  if (over < 0) return null;
  return loc.at(
    over,
    `The tune is ${count(bytes / 1000)} kB of ABC; one tune may be at most ${MAX_ABC_BYTES / 1000} kB. Split it into several tunes.`,
  );
}

const meterText = (m: Fraction): string => `${m.num}/${m.den}`;

/** Limits on the bars and lengths of a read tune; empty when it is within them. */
export function modelProblems(model: TuneModel, loc: Locator): Problem[] {
  const out: Problem[] = [];
  for (const change of model.header.meters) {
    const m = change.value;
    if (m !== null && toNumber(m) > MAX_BAR_WHOLES) {
      const at = change.at === 0 ? Math.max(0, model.abc.search(/^M:/m)) : change.at;
      out.push(
        loc.at(
          at,
          `M:${meterText(m)} makes a bar of ${count(toNumber(m))} whole notes; a meter may make a bar of at most ${MAX_BAR_WHOLES} (M:16/4).`,
        ),
      );
      return out;
    }
  }
  const melody = model.bars.get(model.melody) ?? [];
  if (melody.length > MAX_BARS) {
    out.push(
      loc.at(
        melody[MAX_BARS].notes[0]?.start ?? melody[MAX_BARS].startChar,
        `The tune has ${count(melody.length)} bars; one tune may have at most ${count(MAX_BARS)}. Split it into several tunes.`,
      ),
    );
    return out;
  }
  let worth = 0;
  for (const bars of model.bars.values()) {
    for (const bar of bars) {
      const meter = bar.meter ?? FREE_METER;
      const most = mul(meter, frac(MAX_NOTE_BARS));
      if (bars === melody) worth += toNumber(bar.length) / toNumber(meter);
      if (cmp(bar.length, most) <= 0) continue;
      const long = bar.notes.find((n) => cmp(n.duration, most) > 0);
      const what = long ? `"${model.abc.slice(long.body.start, long.body.end)}"` : `Bar ${bar.number}`;
      const howMany = count(toNumber(long ? long.duration : bar.length) / toNumber(meter));
      out.push(
        loc.at(
          long ? long.start : bar.startChar,
          `${what} lasts ${howMany} bars of ${meterText(meter)}; a note, rest or bar may last at most ${MAX_NOTE_BARS} bars.`,
        ),
      );
      return out;
    }
  }
  // bars may each be long within the limit above: the whole tune is held to twice the bar count
  if (worth > 2 * MAX_BARS)
    out.push(
      loc.at(
        melody[0]?.startChar ?? 0,
        `The tune's music lasts ${count(worth)} bars of its meter; one tune may last at most ${count(2 * MAX_BARS)}. Split it into several tunes.`,
      ),
    );
  return out;
}
