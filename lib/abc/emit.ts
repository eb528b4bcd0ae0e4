// Writes a version of the tune with some embellishment kinds taken out, by editing the source
// text element by element (abcjs offsets); text between elements is copied as it is.
import { abcLength, div, mul } from "./fraction";
import { kindBit, kindMask, tokKind } from "./decorations";
import type { FillGroup } from "./groups";
import type { Tok } from "./lex";
import type { BarEl, NoteEl, TuneModel } from "./model";
import { BarAccidentals } from "./pitch";
import { Offsets } from "./offsets";
import { melodyIndex, type StopPicks } from "./double-stops";
import type { Fraction, Kind, MelodyNote } from "./types";

export interface Emitted {
  abc: string;
  /** Source element boundary → offset in the output (for bars and notes). */
  offsets: Offsets;
  /** Melody notes as written in the output, by the index (TuneModel.edits) of the element that starts them. */
  notes: (MelodyNote | undefined)[];
}

export { tokKind };

/** The output text; a class rather than a closure so that nothing is made per call but itself. */
class Writer {
  text = "";
  write(s: string): void {
    this.text += s;
  }
}

/** What one emit takes out, read once: `mask` holds the removed kinds as bits. */
interface Removal {
  mask: number;
  reduce: boolean; // chords become their melody note
  picks: StopPicks;
}

const keeps = (t: Tok, mask: number): boolean => (kindBit(tokKind(t)) & mask) === 0;

/** `track`: also record offsets and melody notes (only the skeleton's bars need them). */
export function emit(
  model: TuneModel,
  removed: ReadonlySet<Kind>,
  groupOf: Map<NoteEl, FillGroup>,
  picks: StopPicks,
  track = false,
): Emitted {
  const { abc } = model;
  const out = new Writer();
  let pos = 0;
  const offsets = new Offsets(track ? 2 * model.edits.length : 0);
  const notes: (MelodyNote | undefined)[] = track ? new Array<MelodyNote | undefined>(model.edits.length) : [];
  const states = new Map<string, BarAccidentals>();
  const r: Removal = { mask: kindMask(removed), reduce: removed.has("doubleStops"), picks };
  const collapse = removed.has("fills") && groupOf.size > 0;
  for (const el of model.edits) {
    if (el.start < pos) continue;
    if (el.start > pos) {
      // a collapsed tuplet's marker outside its first note goes with the tuplet
      const g = collapse && el.type === "note" ? groupOf.get(el) : undefined;
      const marker = g?.els[0] === el ? g.tuplet?.marker : null;
      if (marker && marker.start >= pos && marker.end <= el.start)
        out.write(abc.slice(pos, marker.start) + abc.slice(marker.end, el.start));
      else out.write(abc.slice(pos, el.start));
    }
    if (track) offsets.set(el.start, out.text.length);
    let state = states.get(el.voice);
    if (!state) {
      state = new BarAccidentals(NO_KEY);
      states.set(el.voice, state);
    }
    if (el.type === "bar") {
      state.reset();
      out.write((el.kinds & r.mask) === 0 ? abc.slice(el.start, el.end) : renderBar(abc, el, r.mask));
    } else {
      state.key = el.key;
      const g = collapse ? groupOf.get(el) : undefined;
      if (!g || g.els[0] === el) {
        const start = out.text.length;
        const midi = writeNote(abc, el, g, state, r, out);
        if (track && el.voice === model.melody) {
          notes[el.index] = {
            onset: el.onset,
            duration: g ? g.total : el.duration,
            pitch: midi,
            tiedFromPrevious: el.tiedFromPrevious,
            startChar: start,
            endChar: out.text.length,
          };
        }
      }
    }
    if (track) offsets.set(el.end, out.text.length);
    pos = el.end;
  }
  out.write(abc.slice(pos));
  return { abc: out.text, offsets, notes };
}

const NO_KEY: ReadonlyMap<string, number> = new Map();

/**
 * Whether emit, with none of the tune's kinds taken out, gives back the source unchanged: every
 * element is then written as it stands, so only a re-spelt accidental could differ. Runs emit's
 * walk and spelling without writing anything.
 */
export function emitsSource(model: TuneModel): boolean {
  let pos = 0;
  const states = new Map<string, BarAccidentals>();
  for (const el of model.edits) {
    if (el.start < pos) continue;
    let state = states.get(el.voice);
    if (!state) {
      state = new BarAccidentals(NO_KEY);
      states.set(el.voice, state);
    }
    if (el.type === "bar") state.reset();
    else {
      state.key = el.key;
      if (!el.body.rest && respelt(el, state)) return false;
    }
    pos = el.end;
  }
  return true;
}

/**
 * The kinds emit can take out of this tune, as bits: those of its marks, fills where it has
 * groups, double stops where it has chords. Taking out any other kind changes nothing.
 */
export function kindsIn(model: TuneModel, groupOf: Map<NoteEl, FillGroup>): number {
  let m = groupOf.size > 0 ? kindBit("fills") : 0;
  for (const el of model.edits) {
    m |= el.kinds;
    if (el.type === "note" && el.body.chord) m |= kindBit("doubleStops");
  }
  return m;
}

function renderBar(abc: string, el: BarEl, mask: number): string {
  let s = abc.slice(el.start, el.end);
  for (let i = el.toks.length - 1; i >= 0; i--) {
    const t = el.toks[i];
    if (!keeps(t, mask)) s = s.slice(0, t.start - el.start) + s.slice(t.end - el.start);
  }
  return s;
}

const PREFIX = new Set(["gchord", "deco", "short", "grace", "slurOpen"]);

/** Writes one note element (or a whole collapsed group); returns the melody pitch written. */
function writeNote(
  src: string,
  el: NoteEl,
  g: FillGroup | undefined,
  state: BarAccidentals,
  r: Removal,
  out: Writer,
): number | null {
  const body = el.body;
  const reduce = body.chord && r.reduce;
  const m = melodyIndex(el, r.picks);
  if (!g && !reduce && (el.kinds & r.mask) === 0) {
    // Nothing to take out: the element as written, unless an accidental must be re-spelt.
    const spelt = body.rest ? null : respelt(el, state);
    if (!spelt) out.write(src.slice(el.start, el.end));
    else
      for (const t of el.lex.toks)
        out.write(t.kind === "body" ? withAccidentals(src, el, spelt) : src.slice(t.start, t.end));
    return el.midi[m];
  }
  if (!g) {
    // A tie from a reduced chord survives only if the next note still sounds its pitch.
    const tieOk = !reduce || tiedPitches(el.next, r).includes(el.midi[m]);
    for (const t of el.lex.toks) {
      if (t.kind === "body") out.write(renderBody(src, el, state, reduce ? m : null, null, tieOk));
      else if (keeps(t, r.mask) && (t.kind !== "tie" || tieOk)) out.write(src.slice(t.start, t.end));
    }
    return el.midi[m];
  }
  // A collapsed group: every member's kept marks before one note of the group's whole time.
  const last = g.els[g.els.length - 1];
  for (const member of g.els) {
    for (const t of member.lex.toks) {
      const lead = member === el && t.kind === "ws" && t.end <= el.body.start;
      if (lead || (PREFIX.has(t.kind) && keeps(t, r.mask))) out.write(src.slice(t.start, t.end));
    }
  }
  out.write(renderBody(src, el, state, reduce ? m : null, div(g.total, el.unit)));
  const sameNote = el.midi[m] !== null && tiedPitches(last.next, r).includes(el.midi[m]);
  for (const t of last.lex.toks) if (t.kind === "tie" && sameNote) out.write(src.slice(t.start, t.end));
  for (const member of g.els)
    for (const t of member.lex.toks)
      if (t.kind === "slurClose" && keeps(t, r.mask)) out.write(src.slice(t.start, t.end));
  const tail = last.lex.toks[last.lex.toks.length - 1];
  if (tail?.kind === "ws") out.write(src.slice(tail.start, tail.end));
  return el.midi[m];
}

/**
 * The accidentals to write for each note of the body in the output's bar context, or null when
 * they are the ones written (the common case, which then allocates nothing).
 */
function respelt(el: NoteEl, state: BarAccidentals): string[] | null {
  const written = el.body.notes;
  let spelt: string[] | null = null;
  for (let i = 0; i < written.length; i++) {
    const a = state.spell(el.pos[i], written[i].acc, el.midi[i] ?? 0);
    if (spelt) spelt.push(a);
    else if (a !== written[i].acc) {
      spelt = [];
      for (let k = 0; k < i; k++) spelt.push(written[k].acc);
      spelt.push(a);
    }
  }
  return spelt;
}

/** Pitches a note element sounds once the removed kinds are gone. */
function tiedPitches(el: NoteEl | null, r: Removal): readonly (number | null)[] {
  if (!el) return [];
  return el.body.chord && r.reduce ? [el.midi[melodyIndex(el, r.picks)]] : el.midi;
}

/** The body as written, with `spelt` accidentals in place of the written ones. */
function withAccidentals(src: string, el: NoteEl, spelt: string[]): string {
  const b = el.body;
  let s = "";
  let at = b.start;
  b.notes.forEach((n, i) => {
    s += src.slice(at, n.start) + spelt[i];
    at = n.letterStart;
  });
  return s + src.slice(at, b.end);
}

/**
 * A body as written, or reduced to its melody note (`only`), or with a new length (`len`, a
 * multiple of L). Accidentals are re-spelt where the output's bar context differs from the source.
 */
function renderBody(
  src: string,
  el: NoteEl,
  state: BarAccidentals,
  only: number | null,
  len: Fraction | null,
  tieOk = true,
): string {
  const b = el.body;
  if (b.rest) return len ? b.rest + abcLength(len) : src.slice(b.start, b.end);
  const spelt = b.notes.map((n, i) =>
    only === null || only === i ? state.spell(el.pos[i], n.acc, el.midi[i] ?? 0) : "",
  );
  if (only !== null) {
    const n = b.notes[only];
    const l = len ?? mul(b.notes[0].len, b.outerLen);
    return spelt[only] + n.name + abcLength(l) + (len || !tieOk ? "" : n.tie);
  }
  if (len) {
    const pitches = b.notes.map((n, i) => spelt[i] + n.name).join("");
    return b.chord ? `[${pitches}]${abcLength(len)}` : pitches + abcLength(len);
  }
  return withAccidentals(src, el, spelt);
}
