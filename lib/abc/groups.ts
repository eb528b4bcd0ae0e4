// Rhythmic fills: the note groups the skeleton turns into one note (issue 3 §3).
import { add, cmp, div, frac, isInteger, lt, mul, sum, ZERO } from "./fraction";
import { beatOf } from "./header";
import type { NoteEl, TuneModel, Tuplet } from "./model";
import type { Fraction } from "./types";

export interface FillGroup {
  what: string; // "sixteenth fill", "triplet" …
  els: NoteEl[];
  total: Fraction; // sounding time of the whole group
  tuplet: Tuplet | null;
}

const EIGHTH = frac(1, 8);
const TUPLET_NAMES: Record<number, string> = {
  2: "duplet",
  3: "triplet",
  4: "quadruplet",
  5: "quintuplet",
  6: "sextuplet",
  7: "septuplet",
};

/**
 * Every collapsible group of the tune, keyed by its first element.
 * - A sixteenth fill: consecutive notes each shorter than an eighth, starting on the eighth-note
 *   grid and together exactly one eighth (issue 3 §3), not inside a tuplet, and with no broken
 *   rhythm reaching into or out of the group (that would change the neighbour's length).
 * - A tuplet that does not cross a beat: it becomes its first note held for its whole time. One
 *   that crosses a beat is kept, since its held first note would sound over a beat where the
 *   source sounds another pitch.
 */
export function findGroups(model: TuneModel): { groups: FillGroup[]; crossing: Tuplet[] } {
  const groups: FillGroup[] = [];
  const crossing: Tuplet[] = [];
  for (const t of model.tuplets) {
    const first = t.els[0];
    if (
      !first?.bar ||
      t.els.some((e) => e.bar !== first.bar) ||
      !collapsible(model.abc, t.els, sum(t.els.map((e) => e.duration)))
    ) {
      crossing.push(t);
      continue;
    }
    const total = sum(t.els.map((e) => e.duration));
    const beat = beatOf(first.bar.meter);
    const from = div(first.grid, beat);
    const to = div(add(first.grid, total), beat);
    // A beat onset strictly inside (from, to) means the tuplet crosses a beat.
    const nextBeat = frac(Math.floor(from.num / from.den) + 1);
    const crosses = cmp(nextBeat, to) < 0;
    if (crosses || t.els.some((e) => e.brokenOut)) crossing.push(t);
    else groups.push({ what: TUPLET_NAMES[t.p] ?? "tuplet", els: t.els, total, tuplet: t });
  }
  for (const bars of model.bars.values()) {
    for (const bar of bars) {
      let run: NoteEl[] = [];
      let total: Fraction = ZERO;
      const notes = bar.notes;
      notes.forEach((el, i) => {
        const small = !el.tuplet && lt(el.duration, EIGHTH) && el.duration.num > 0;
        if (!small) {
          run = [];
          total = ZERO;
          return;
        }
        if (run.length === 0) {
          if (!isInteger(div(el.grid, EIGHTH)) || notes[i - 1]?.brokenOut) return;
        }
        run.push(el);
        total = add(total, el.duration);
        const c = cmp(total, EIGHTH);
        if (c === 0) {
          if (run.length > 1 && !el.brokenOut && collapsible(model.abc, run, total))
            groups.push({ what: "sixteenth fill", els: run, total, tuplet: null });
          run = [];
          total = ZERO;
        } else if (c > 0) {
          run = [];
          total = ZERO;
        }
      });
    }
  }
  return { groups, crossing };
}

/**
 * A group can become one note only if abcjs can write that note (a plain or dotted value, ABC 2.1
 * §4.3; abcjs warns "Duration not representable" for any other length under a whole note: three
 * eighths-in-a-triplet written D/EF last 5/3 of an eighth) and the group is on one line (its
 * members' line break, or a line continuation between them, would go with them).
 */
function collapsible(abc: string, els: NoteEl[], total: Fraction): boolean {
  const first = els[0];
  const last = els[els.length - 1];
  if (!first || !last) return false;
  for (let i = first.start; i < last.end; i++) if (abc.charCodeAt(i) === 10) return false;
  const written = div(total, first.unit);
  return representable(mul(written, first.unit));
}

/** abcjs's note values (abc_parse_settings.js): 1/2 to 1/64 with up to five dots, or a whole note or more. */
export function representable(d: Fraction): boolean {
  if (d.num >= d.den) return true;
  const den = d.den;
  if ((den & (den - 1)) !== 0) return false; // not a power of two
  const dots = Math.log2(d.num + 1) - 1; // num = 2^(dots+1) - 1
  if (!Number.isInteger(dots) || dots < 0 || dots > 5) return false;
  const n = Math.log2(den) - dots; // den = 2^(n + dots), the undotted value 1/2^n
  return n >= 1 && n <= 6;
}
