// Every embellishment of a tune with its kind and position: part (as the phrase map labels it),
// bar and beat.
import { add, div, toNumber } from "./fraction";
import { beatOf } from "./header";
import { tokKind } from "./decorations";
import type { VBar } from "./bars";
import type { BarEl, NoteEl } from "./model";
import type { Prepared } from "./tune";
import type { Embellishment, Fraction, Kind, Position } from "./types";

const NAMES: Record<string, string> = {
  "<(": "crescendo",
  "crescendo(": "crescendo",
  "<)": "crescendo end",
  "crescendo)": "crescendo end",
  ">(": "diminuendo",
  "diminuendo(": "diminuendo",
  ">)": "diminuendo end",
  "diminuendo)": "diminuendo end",
  ">": "accent",
  emphasis: "accent",
  mordent: "lowermordent",
  pralltriller: "uppermordent",
};

/** The part label of a melody bar (by its index); the P: label in force when none is given. */
export type PartOf = (bar: VBar) => string | undefined;

export function classify(p: Prepared, partOf: PartOf = () => undefined): Embellishment[] {
  const { model } = p;
  const abc = model.abc;
  const found: Embellishment[] = [];
  const melody = model.bars.get(model.melody) ?? [];
  const position = (bar: VBar | null, grid: Fraction): Position => {
    if (!bar) return { part: partOf(melody[0] as VBar) ?? "A", bar: 0, beat: 1 };
    const beat = 1 + toNumber(div(grid, beatOf(bar.meter)));
    // another voice's bar takes the part of the melody's bar in the same place
    const label = partOf(melody[bar.index] ?? bar) ?? bar.part;
    return { part: label, bar: bar.number, beat: Math.round(beat * 1000) / 1000 };
  };
  // which bar each bar line closes, read once (a decoration on a bar line belongs to that bar)
  const closes = new Map<BarEl, VBar>();
  for (const bars of model.bars.values()) for (const b of bars) if (b.right) closes.set(b.right, b);
  for (const el of model.edits) {
    if (el.type === "bar") {
      if (!el.toks.some((t) => t.kind === "deco")) continue;
      // A decoration on a bar line belongs to the end of the bar it closes.
      const bars = model.bars.get(el.voice) ?? [];
      const closed = closes.get(el) ?? null;
      const pos = closed
        ? position(closed, add(closed.length, closed.shift))
        : position(bars[0] ?? null, { num: 0, den: 1 });
      for (const t of el.toks)
        if (t.kind === "deco")
          found.push(found1(abc, tokKind(t) ?? "marks", NAMES[t.name] ?? t.name, t.start, t.end, pos));
      continue;
    }
    const chord = el.body.chord && el.body.notes.length > 1;
    if (el.kinds === 0 && !chord) continue; // nothing on this note to list
    const pos = position(el.bar, el.grid);
    for (const t of el.lex.toks) {
      const kind = tokKind(t);
      if (!kind || t.kind === "slurClose") continue;
      const what =
        t.kind === "grace"
          ? "grace notes"
          : t.kind === "slurOpen"
            ? t.name === "dotted"
              ? "dotted slur"
              : "slur"
            : (NAMES[t.name] ?? t.name);
      found.push(found1(abc, kind, what, t.start, t.end, pos));
    }
    if (chord) found.push(found1(abc, "doubleStops", chordName(el), el.body.start, el.body.end, pos));
  }
  for (const g of p.groups) {
    const first = g.els[0];
    found.push(found1(abc, "fills", g.what, first.start, g.els[g.els.length - 1].end, position(first.bar, first.grid)));
  }
  for (const t of p.crossing) {
    const first = t.els[0];
    if (first)
      found.push(
        found1(
          abc,
          "fills",
          "tuplet kept in every stage (it crosses a beat, or its notes cannot become one)",
          first.start,
          t.els[t.els.length - 1].end,
          position(first.bar, first.grid),
        ),
      );
  }
  return found.sort((a, b) => a.startChar - b.startChar || a.endChar - b.endChar);
}

function found1(abc: string, kind: Kind, what: string, start: number, end: number, position: Position): Embellishment {
  return { kind, what, source: abc.slice(start, end), startChar: start, endChar: end, position };
}

function chordName(el: NoteEl): string {
  const distinct = new Set(el.midi).size;
  if (distinct === 1) return "unison double stop";
  return distinct === 2 ? "double stop" : "chord";
}
