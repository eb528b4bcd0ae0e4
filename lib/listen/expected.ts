// The notes a stage asks for, in written order, from the tune engine's bars: pitches as MIDI numbers
// in equal temperament (A4 = 440 Hz, ISO 16), times in beats from the meter and the unit note length,
// and the places where the music may go back (a repeat) or over (a first ending) without a fault.
import { buildModel, classify, prepareTune, type Fraction, type Problem } from "@/lib/abc";

export interface ExpectedNote {
  index: number;
  bar: number; // as the phrase map numbers bars (pickup = 0)
  midi: number;
  name: string; // "A4", "Bb3"
  beat: number; // onset in beats from the start of the written music
  beats: number; // its length in beats, ties included
  span: number; // beats until the next written note starts (a rest after it counts)
  /** Carries an ornament (a roll, a cut, grace notes, a slide): the short notes around it are not extra. */
  ornament: boolean;
}

export interface ScoreBar {
  number: number;
  first: number; // index of its first note (the position at its start)
  end: number; // index after its last note
  beats: number;
}

export interface Score {
  notes: ExpectedNote[];
  bars: ScoreBar[];
  /** Free moves of the position (the index of the next note): a repeat back, over a first ending. */
  jumps: { from: number; to: number }[];
  beatName: string;
  /** A tempo written in the tune's Q: field, in its beats per minute, when there is one. */
  marked: number | null;
}

const SHARP_NAMES = ["C", "C#", "D", "D#", "E", "F", "F#", "G", "G#", "A", "A#", "B"];
const FLAT_NAMES = ["C", "Db", "D", "Eb", "E", "F", "Gb", "G", "Ab", "A", "Bb", "B"];

/** Scientific pitch name (middle C = C4, MIDI 60). */
export function pitchName(midi: number, flats = false): string {
  const m = Math.round(midi);
  return `${(flats ? FLAT_NAMES : SHARP_NAMES)[((m % 12) + 12) % 12]}${Math.floor(m / 12) - 1}`;
}

// Sharps (+) or flats (−) of each major key's signature, and each mode's shift from its major (common practice).
const MAJOR: Record<string, number> = { C: 0, G: 1, D: 2, A: 3, E: 4, B: 5, "F#": 6, "C#": 7, F: -1 };
Object.assign(MAJOR, { Bb: -2, Eb: -3, Ab: -4, Db: -5, Gb: -6, Cb: -7 });
const MODE: [RegExp, number][] = [
  [/^(maj|ion)/, 0],
  [/^mix/, -1],
  [/^dor/, -2],
  [/^(m|min|aeo)(?![a-z]*ix)/, -3],
  [/^phr/, -4],
  [/^loc/, -5],
  [/^lyd/, 1],
];

/** Whether a key's signature has flats, so its notes are named with flats (K: field text, e.g. "Gm", "Ador"). */
export function keyHasFlats(key: string): boolean {
  const m = /^\s*([A-G])([#b]?)\s*([A-Za-z]*)/.exec(key);
  if (!m) return false;
  const major = MAJOR[m[1] + m[2]] ?? 0;
  const mode = m[3].toLowerCase();
  const shift = MODE.find(([re]) => re.test(mode))?.[1] ?? 0;
  return major + shift < 0;
}

/** Beat of a meter: compound meters (6/8, 9/8, 12/8) count dotted quarters, others 1/den (common practice). */
export function beatOf(meter: Fraction): { whole: number; name: string } {
  if (meter.num % 3 === 0 && meter.num > 3 && meter.den >= 8) {
    const whole = 3 / meter.den;
    return { whole, name: whole === 3 / 8 ? "dotted quarter note" : `dotted 1/${meter.den / 2} note` };
  }
  const names: Record<number, string> = { 1: "whole note", 2: "half note", 4: "quarter note", 8: "eighth note" };
  return { whole: 1 / meter.den, name: names[meter.den] ?? `1/${meter.den} note` };
}

/** Q: as beats per minute of the meter's beat ("Q:1/4=96" in 6/8 is 64 dotted quarters a minute). */
function markedTempo(abc: string, beatWhole: number): number | null {
  const q = /^Q:\s*(?:"[^"]*"\s*)?(?:(\d+)\/(\d+)\s*=\s*)?(\d+)/m.exec(abc);
  if (!q) return null;
  const of = q[1] ? Number(q[1]) / Number(q[2]) : 1 / 4;
  const perMinute = Number(q[3]);
  return perMinute > 0 && of > 0 ? (perMinute * of) / beatWhole : null;
}

const isRepeatStart = (k: string | null) => k === "repeatStart" || k === "repeatBoth";
const isRepeatEnd = (k: string | null) => k === "repeatEnd" || k === "repeatBoth";
const endingHas = (ending: string | null, n: string) => ending !== null && ending.split(/[,-]/).includes(n);

export function readScore(abc: string): { ok: true; score: Score } | { ok: false; problems: Problem[] } {
  const model = buildModel(abc);
  if (!model.ok) return { ok: false, problems: model.problems };
  const { bars, meter, key } = model.value;
  const flats = keyHasFlats(key);
  // Where ornaments sit in the text: each belongs to the first melody note at or after it.
  const prepared = prepareTune(abc);
  const ornamentAt = prepared.ok
    ? classify(prepared.value)
        .filter((e) => e.kind === "ornaments" || e.kind === "slides")
        .map((e) => e.startChar)
        .sort((a, b) => a - b)
    : [];
  let nextOrnament = 0;
  const beat = beatOf(meter);
  const notes: ExpectedNote[] = [];
  const scoreBars: ScoreBar[] = [];
  let barBeat = 0;
  for (const b of bars) {
    const first = notes.length;
    for (const n of b.notes) {
      const onset = barBeat + n.onset.num / n.onset.den / beat.whole;
      const length = n.duration.num / n.duration.den / beat.whole;
      const prev = notes[notes.length - 1];
      if (n.tiedFromPrevious && prev && prev.midi === n.pitch) {
        prev.beats += length; // a tie continues the sounding note
        continue;
      }
      let ornament = false;
      while (nextOrnament < ornamentAt.length && ornamentAt[nextOrnament] < n.endChar) {
        ornament = true;
        nextOrnament++;
      }
      if (n.pitch === null) continue;
      notes.push({
        ornament,
        index: notes.length,
        bar: b.number,
        midi: n.pitch,
        name: pitchName(n.pitch, flats),
        beat: onset,
        beats: length,
        span: length,
      });
    }
    const beats = b.length.num / b.length.den / beat.whole;
    barBeat += beats;
    scoreBars.push({ number: b.number, first, end: notes.length, beats });
  }
  notes.forEach((n, i) => (n.span = (notes[i + 1]?.beat ?? barBeat) - n.beat));

  const jumps: { from: number; to: number }[] = [];
  const firstFull = bars.findIndex((b) => b.number > 0);
  let sectionStart = scoreBars[Math.max(0, firstFull)]?.first ?? 0;
  for (let k = 0; k < bars.length; k++) {
    const b = bars[k];
    const prev = bars[k - 1];
    const startsSection =
      isRepeatStart(b.leftLine) ||
      (prev && (isRepeatStart(prev.rightLine) || prev.rightLine === "double" || prev.rightLine === "final"));
    if (startsSection && k >= firstFull) sectionStart = scoreBars[k].first;
    // Over the first ending on the way through again: from where it starts to where the second starts.
    if (endingHas(b.ending, "1") && !endingHas(prev?.ending ?? null, "1")) {
      const second = bars.findIndex((x, j) => j > k && endingHas(x.ending, "2"));
      if (second > 0) jumps.push({ from: scoreBars[k].first, to: scoreBars[second].first });
    }
    if (isRepeatEnd(b.rightLine)) {
      jumps.push({ from: scoreBars[k].end, to: sectionStart });
      if (!endingHas(b.ending, "1")) sectionStart = scoreBars[k].end;
    }
  }
  return {
    ok: true,
    score: {
      notes,
      bars: scoreBars,
      jumps: jumps.filter((j) => j.from !== j.to),
      beatName: beat.name,
      marked: markedTempo(abc, beat.whole),
    },
  };
}
