// Shared types of the tune engine (lib/abc). Pure data: no abcjs, database or framework imports,
// so every part of the engine, the CLI, the server and the browser can use them.

/** The embellishment kinds of PRODUCT.md §3 (plus fingerings and other marks, see issue 3). */
export const KINDS = [
  "bowing", // slurs (also dotted), up-bow/down-bow (u, v)
  "ornaments", // rolls, trills, turns, mordents, grace-note groups
  "slides", // !slide!
  "fills", // rhythmic fills: sixteenth fills, ornamental triplets / tuplets
  "doubleStops", // chords of notes and double stops
  "dynamics", // !p! … !ff!, hairpins
  "articulation", // staccato, accents, tenuto, fermata, breath
  "fingerings", // !0! … !5!
  "marks", // any other decoration (segno, coda, D.C., …): not an embellishment, still not in the skeleton
] as const;
export type Kind = (typeof KINDS)[number];

/** A problem in the input, 1-based line and column in the text that was given to the engine. */
export interface Problem {
  line: number;
  column: number;
  message: string; // plain text, no HTML
}

/**
 * What the engine says about a tune: `problems` refuse it (the music could not be read as
 * written), `notes` are shown beside it and the tune is kept (e.g. a bar longer than the meter).
 */
export type Result<T> = { ok: true; value: T; notes: Problem[] } | { ok: false; problems: Problem[]; notes: Problem[] };

/** Where something is in the tune. Bars are numbered from 1; a pickup is bar 0. */
export interface Position {
  part: string; // part label ("A", "B" …); "A" when the tune has one part and no P: field
  bar: number;
  beat: number; // 1-based beat within the bar, may be fractional (2.5 = half way through beat 2)
}

export interface Embellishment {
  kind: Kind;
  what: string; // e.g. "roll", "slur", "grace notes", "triplet", "sixteenth fill", "double stop", "p", "crescendo"
  source: string; // the ABC text of the embellishment itself, e.g. "~", "!roll!", "{g}", "(3"
  startChar: number; // offsets into the tune's ABC text
  endChar: number;
  position: Position;
}

/** A stage plan: stage 1 is always the skeleton (no kinds); each later stage adds the kinds listed. */
export interface StagePlan {
  stages: { name: string; adds: Kind[] }[];
}

export interface Stage {
  index: number; // 1-based
  name: string;
  kinds: Kind[]; // every kind present in this stage (cumulative)
  /** The kinds this stage brings back (with those of any stage merged into it). */
  adds: Kind[];
  abc: string;
  /** Stages of the default plan taken into this one: this tune has none of their kinds. */
  merged: string[];
  /** A teacher's plan kept as made: the earlier stage whose music this one repeats. */
  repeats: number | null;
}

/**
 * One note (or rest) of the melody line on the time grid: what the phrase map and the setting
 * comparison work on. Times are in whole notes as exact fractions (num/den reduced) to avoid
 * floating-point drift; `pitch` is a MIDI number after key signature and accidentals, null for a rest.
 */
export interface Fraction {
  num: number;
  den: number;
}
export interface MelodyNote {
  onset: Fraction; // from the start of its bar
  duration: Fraction;
  pitch: number | null;
  tiedFromPrevious: boolean; // a tie continues the previous note: same sounding note
  startChar: number;
  endChar: number;
}

export type BarLineKind = "single" | "double" | "final" | "repeatStart" | "repeatEnd" | "repeatBoth" | "start";

export interface Bar {
  number: number; // 1-based; 0 for a pickup
  part: string; // the P: label in force, or the one the phrase map assigns
  ending: string | null; // "1", "2", "1,3" … when the bar is inside a numbered ending
  startChar: number; // first character of the bar's content
  endChar: number; // after the bar line that closes it
  leftLine: BarLineKind | null;
  rightLine: BarLineKind | null;
  length: Fraction; // actual length of the bar's notes
  notes: MelodyNote[];
}
