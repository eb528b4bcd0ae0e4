// Which note of each double stop carries the melody, read from the cues a fiddler reads (common
// practice): a note held or repeated across neighbouring double stops while the other voice moves
// is a drone, and the moving voice is the tune; an open string sounded beside a stopped note is a
// drone, except the tonic at a cadence; otherwise the melody rides on top. A teacher may turn any
// bar to its other voice, and --highest / --lowest still take one side everywhere.
import type { VBar } from "./bars";
import type { NoteEl, TuneModel } from "./model";
import { letterOf, naturalMidi } from "./pitch";

/** "cues": read each double stop as above; "highest" / "lowest": one side for the whole tune. */
export type DoubleStop = "cues" | "highest" | "lowest";
export type Voice = "upper" | "lower";
/** A teacher's choice per bar (the melody bar's index, from 0), over the cues. */
export type BarVoices = Readonly<Record<number, Voice>>;

export type StopReason =
  | "upper" // nothing says otherwise: the melody usually rides on top
  | "held" // the other note is held or repeated while this voice moves
  | "open" // the other note is an open string sounded beside this stopped note
  | "cadence" // the tonic on an open string at a cadence stays
  | "continues" // the tune goes on from the open string: the notes around are nearer it
  | "parallel" // both voices move together (thirds, sixths): the top one is the tune
  | "teacher" // turned by the teacher
  | "setting"; // --highest / --lowest

export interface StopChoice {
  barIndex: number;
  bar: number; // bar number as shown (a pickup is 0)
  part: string;
  start: number; // the double stop's offsets in the tune's text
  end: number;
  keep: Voice;
  pitch: number; // MIDI number kept
  other: number; // MIDI number left out
  keptName: string; // as a teacher names it: "F♯4" (scientific pitch, middle C = C4)
  otherName: string;
  reason: StopReason;
}

export interface StopPicks {
  /** Index into el.midi of the note kept, for every chord of notes (melody voice and the others). */
  index: Map<NoteEl, number>;
  /** The melody voice's double stops of two sounding pitches, in order: what a teacher may turn. */
  choices: StopChoice[];
}

// Open strings of the fiddle, G3 D4 A4 E5 (standard tuning).
const OPEN = new Set([55, 62, 69, 76]);
// How far to look for a neighbouring double stop: other notes between them (a drone is often
// struck again as a single note between stops, as in B B [gB] B B [aB]).
const REACH = 4;
// Semitones by which the notes around a double stop must lie nearer its open string for the tune to go on from it.
const CLEARLY = 3;

const LETTER_PC: Record<string, number> = { C: 0, D: 2, E: 4, F: 5, G: 7, A: 9, B: 11 };

/** Pitch class of the tonic from the header's K: (highland-pipe and "none" keys have none). */
function tonicOf(abc: string, headerEnd: number): number | null {
  const k = /^K:\s*([A-G])([#b]?)/m.exec(abc.slice(0, headerEnd));
  if (!k) return null;
  return (LETTER_PC[k[1]] + (k[2] === "#" ? 1 : k[2] === "b" ? -1 : 0) + 12) % 12;
}

/** Two sounding pitches, low then high; null for a unison or a chord of three or more. */
function pair(el: NoteEl): [number, number] | null {
  let lo: number | null = null;
  let hi: number | null = null;
  for (const m of el.midi) {
    if (m === null) return null;
    if (lo === null || m < lo) lo = m;
    if (hi === null || m > hi) hi = m;
  }
  if (lo === null || hi === null || lo === hi) return null;
  for (const m of el.midi) if (m !== lo && m !== hi) return null;
  return [lo, hi];
}

/** What one side of a double stop says about which of its notes is a drone. */
interface Side {
  lo: number; // evidence that the lower note is held or repeated while the upper moves
  hi: number;
  parallel: boolean; // the nearest other double stop moves both voices
}

/**
 * Looks one way from the double stop at `at` for the nearest double stop sounding other pitches
 * (the same double stop struck again extends the look). Notes struck alone between them count too:
 * when two or more all repeat one note of the stop (B B [gB] B B), that note is the drone.
 */
function look(notes: readonly NoteEl[], at: number, step: 1 | -1, p: [number, number]): Side {
  const side: Side = { lo: 0, hi: 0, parallel: false };
  let singles: (number | null)[] = [];
  const repeated = (): void => {
    // one note alone may be the tune arriving on the stop's note; two or more struck again are a pulse
    if (singles.length > 1 && singles.every((m) => m === p[0])) side.lo++;
    else if (singles.length > 1 && singles.every((m) => m === p[1])) side.hi++;
    singles = [];
  };
  for (let i = at + step; i >= 0 && i < notes.length; i += step) {
    const el = notes[i];
    const q = el.body.chord ? pair(el) : null;
    if (q && q[0] === p[0] && q[1] === p[1]) {
      repeated();
      continue;
    }
    if (q) {
      repeated();
      if (q[0] === p[0]) side.lo++;
      else if (q[1] === p[1]) side.hi++;
      else side.parallel = true;
      return side;
    }
    if (el.body.chord) break; // a chord of three or more: another texture
    singles.push(el.body.rest ? null : (el.midi[0] ?? null));
    if (singles.length > REACH) return side;
  }
  repeated();
  return side;
}

/** The nearest note struck alone one way from the double stop at `at` (past the same stop struck again). */
function alone(notes: readonly NoteEl[], at: number, step: 1 | -1, p: [number, number]): number | null {
  for (let i = at + step; i >= 0 && i < notes.length; i += step) {
    const el = notes[i];
    if (!el.body.chord) return el.body.rest ? null : (el.midi[0] ?? null);
    const q = pair(el);
    if (!q || q[0] !== p[0] || q[1] !== p[1]) return null;
  }
  return null;
}

/** A bar that ends a part, an ending or the tune: where a cadence falls. */
function closes(bar: VBar, last: boolean): boolean {
  if (last || bar.ending !== null) return true;
  const t = bar.right?.barType ?? "";
  return t === "bar_right_repeat" || t === "bar_dbl_repeat" || t === "bar_thin_thin" || t === "bar_thin_thick";
}

/** The cue-read voice of one double stop and why. */
function readStop(
  notes: readonly NoteEl[],
  i: number,
  p: [number, number],
  cadence: boolean,
  tonic: number | null,
): { keep: Voice; reason: StopReason } {
  const before = look(notes, i, -1, p);
  const after = look(notes, i, 1, p);
  const lo = before.lo + after.lo;
  const hi = before.hi + after.hi;
  if (lo !== hi) return lo > hi ? { keep: "upper", reason: "held" } : { keep: "lower", reason: "held" };
  if (lo > 0 || before.parallel || after.parallel) return { keep: "upper", reason: lo > 0 ? "upper" : "parallel" };
  // an octave is one note in two registers: the upper is the tune's
  if (p[0] % 12 !== p[1] % 12 && OPEN.has(p[0]) !== OPEN.has(p[1])) {
    const open = OPEN.has(p[0]) ? p[0] : p[1];
    const stopped = open === p[0] ? p[1] : p[0];
    const openVoice: Voice = open === p[0] ? "lower" : "upper";
    if (cadence && tonic !== null && open % 12 === tonic) return { keep: openVoice, reason: "cadence" };
    // the notes struck alone on either side lie clearly nearer the open string (by a minor third or more)
    const near = [alone(notes, i, -1, p), alone(notes, i, 1, p)].filter((m): m is number => m !== null);
    const gap = (x: number): number => near.reduce((a, m) => a + Math.abs(m - x), 0);
    if (near.length && gap(stopped) - gap(open) >= CLEARLY) return { keep: openVoice, reason: "continues" };
    return { keep: openVoice === "lower" ? "upper" : "lower", reason: "open" };
  }
  return { keep: "upper", reason: "upper" };
}

/** The note kept of a chord of three or more (or a unison): its highest (or lowest) pitch, first on a tie. */
function extreme(el: NoteEl, side: Voice): number {
  let best = 0;
  for (let i = 1; i < el.midi.length; i++) {
    const m = el.midi[i];
    const b = el.midi[best];
    if (m !== null && (b === null || (side === "upper" ? m > b : m < b))) best = i;
  }
  return best;
}

const indexOf = (el: NoteEl, pitch: number): number => Math.max(0, el.midi.indexOf(pitch));

const SIGN: Record<number, string> = { [-2]: "𝄫", [-1]: "♭", 0: "", 1: "♯", 2: "𝄪" };
/** The written note's letter with what it sounds (key signature and accidentals applied), "F♯4". */
function nameOf(el: NoteEl, i: number): string {
  const pos = el.pos[i] ?? 0;
  const midi = el.midi[i] ?? 0;
  const natural = naturalMidi(pos);
  const octave = Math.floor(natural / 12) - 1;
  return `${letterOf(pos).toUpperCase()}${SIGN[midi - natural] ?? ""}${octave}`;
}

/** The kept note of every chord of notes in the tune, and the melody voice's choices with their reasons. */
export function pickStops(model: TuneModel, mode: DoubleStop = "cues", turned: BarVoices = {}): StopPicks {
  const index = new Map<NoteEl, number>();
  const choices: StopChoice[] = [];
  const tonic = tonicOf(model.abc, model.header.headerEnd);
  for (const [voice, bars] of model.bars) {
    // neighbours are looked for within one part: across a repeat or a double bar the music starts again
    const sections: VBar[][] = [];
    for (const bar of bars) {
      if (bar.opensPart || sections.length === 0) sections.push([]);
      sections[sections.length - 1].push(bar);
    }
    for (const section of sections) {
      const notes = section.flatMap((b) => b.notes);
      let i = 0;
      for (const bar of section) {
        const cadence = closes(bar, bar.index === bars.length - 1);
        for (const el of bar.notes) {
          const place = i++;
          if (!el.body.chord) continue;
          const p = pair(el);
          if (!p) {
            index.set(el, extreme(el, mode === "lowest" ? "lower" : "upper"));
            continue;
          }
          let read: { keep: Voice; reason: StopReason };
          if (mode !== "cues") read = { keep: mode === "highest" ? "upper" : "lower", reason: "setting" };
          else {
            const own = voice === model.melody ? turned[bar.index] : undefined;
            read = own ? { keep: own, reason: "teacher" } : readStop(notes, place, p, cadence, tonic);
          }
          const [kept, other] = read.keep === "upper" ? [p[1], p[0]] : [p[0], p[1]];
          const at = indexOf(el, kept);
          index.set(el, at);
          if (voice === model.melody)
            choices.push({
              barIndex: bar.index,
              bar: bar.number,
              part: bar.part,
              start: el.body.start,
              end: el.body.end,
              keep: read.keep,
              pitch: kept,
              other,
              keptName: nameOf(el, at),
              otherName: nameOf(el, indexOf(el, other)),
              reason: read.reason,
            });
        }
      }
    }
  }
  return { index, choices };
}

/** Index into el.midi of the melody note: the pick for a chord, the note itself otherwise. */
export function melodyIndex(el: NoteEl, picks: StopPicks): number {
  return el.body.chord ? (picks.index.get(el) ?? extreme(el, "upper")) : 0;
}
