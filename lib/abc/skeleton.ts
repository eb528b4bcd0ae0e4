// The skeleton (issue 3 §3): every embellishment kind removed, computed from the one parse.
import { lineKind } from "./bars";
import type { NoteEl } from "./model";
import { melodyIndex, pickStops, type BarVoices, type DoubleStop, type StopPicks } from "./double-stops";
import { emit, type Emitted } from "./emit";
import { Locator } from "./locate";
import { prepareTune, guard, type Prepared } from "./tune";
import { KINDS, type Bar, type Fraction, type MelodyNote, type Result } from "./types";

export interface SkeletonOptions {
  /** How the melody note of each double stop is chosen (the fiddler's cues unless told). */
  doubleStop?: DoubleStop;
  /** Bars (melody bar index) a teacher turned to their other voice. */
  turnedBars?: BarVoices;
}

export interface TuneShape {
  abc: string;
  bars: Bar[];
  meter: Fraction; // as written (6/8 stays 6/8); 4/4 for free meter
  unit: Fraction; // the header's unit note length (L: or the §3.1.7 default)
  title: string;
  key: string;
}

const ALL = new Set(KINDS);

/** The skeleton of one tune, with its bars measured on the skeleton's own text. */
export function skeletonOf(abc: string, opts: SkeletonOptions = {}): Result<TuneShape> {
  const prepared = prepareTune(abc);
  if (!prepared.ok) return prepared;
  return guard(new Locator(abc), () => ({
    ok: true,
    value: skeletonFrom(prepared.value, picksOf(prepared.value, opts)),
    notes: prepared.notes,
  }));
}

export const picksOf = (p: Prepared, opts: SkeletonOptions = {}): StopPicks =>
  pickStops(p.model, opts.doubleStop ?? "cues", opts.turnedBars ?? {});

export function skeletonFrom(p: Prepared, picks: StopPicks): TuneShape {
  const out = emit(p.model, ALL, p.groupOf, picks, true);
  return shapeOf(p, out, picks);
}

/** The unmodified source as a model (used to compare two settings). */
export function buildModel(abc: string, opts: SkeletonOptions = {}): Result<TuneShape> {
  const prepared = prepareTune(abc);
  if (!prepared.ok) return prepared;
  return guard(new Locator(abc), () => ({
    ok: true,
    value: shapeOf(prepared.value, null, picksOf(prepared.value, opts)),
    notes: prepared.notes,
  }));
}

function sourceNote(el: NoteEl, picks: StopPicks): MelodyNote {
  return {
    onset: el.onset,
    duration: el.duration,
    pitch: el.midi[melodyIndex(el, picks)],
    tiedFromPrevious: el.tiedFromPrevious,
    startChar: el.start,
    endChar: el.end,
  };
}

export function shapeOf(p: Prepared, out: Emitted | null, picks: StopPicks): TuneShape {
  const { model } = p;
  const bars: Bar[] = [];
  const pending: MelodyNote[] = []; // each bar's notes, copied out at their count (as in lex.ts)
  for (const vb of model.bars.get(model.melody) ?? []) {
    let count = 0;
    for (const el of vb.notes) {
      const n = out ? out.notes[el.index] : sourceNote(el, picks);
      if (n) pending[count++] = n;
    }
    const notes = pending.slice(0, count);
    bars.push({
      number: vb.number,
      part: vb.part,
      ending: vb.ending,
      startChar: out ? (out.offsets.get(vb.startChar) ?? vb.startChar) : vb.startChar,
      endChar: out ? (out.offsets.get(vb.endChar) ?? vb.endChar) : vb.endChar,
      leftLine: vb.index === 0 && !vb.left ? "start" : lineKind(vb.left),
      rightLine: lineKind(vb.right),
      length: vb.length,
      notes,
    });
  }
  const key = /^K:(.*)$/m.exec(model.abc)?.[1]?.replace(/%.*/, "").trim() ?? "";
  return {
    abc: out ? out.abc : model.abc,
    bars,
    meter: model.header.meter ?? { num: 4, den: 4 },
    unit: model.header.unit,
    title: model.header.title,
    key,
  };
}
