// The phrase map as JSON (issue 3 §5 and §8). Plain data: it serialises with JSON.stringify.

/** Where two twins differ: one entry per group of differing notes. */
export interface TwinDifference {
  firstBar: number;
  secondBar: number;
  lastFirstBar: number; // where the difference ends, when a long or tied note carries it on
  lastSecondBar: number;
  beat: number; // 1-based beat in the bar, fractional between beats
  firstPitch: number | null; // MIDI; null for a rest
  secondPitch: number | null;
  firstNote: string; // scientific pitch name ("D5", "rest") for people reading the JSON
  secondNote: string;
  notes: number; // how many notes this difference is
}

export interface Twin {
  first: string; // phrase id, the earlier phrase
  second: string;
  kind: "exact" | "near";
  differingNotes: number;
  differences: TwinDifference[];
  /** The phrases differ in length (e.g. a last bar cut short by a pickup); compared over the shorter. */
  partial: boolean;
}

/** A second (third …) ending: the phrase as played with that ending instead of the first. */
export interface PhraseAlternative {
  id: string; // "A4/2": phrase A4 played with ending 2
  ending: string;
  bars: [number, number];
  barNumbers: number[];
  letter: string;
}

export interface Phrase {
  id: string; // part label + 1-based number: "A1"
  /** First and last bar; the last phrase's range also covers the bars of its other endings. */
  bars: [number, number];
  /** The bars as first played (through the first ending), in order. */
  barNumbers: number[];
  letter: string;
  alternatives: PhraseAlternative[];
}

export interface PartMap {
  label: string;
  foundBy: string;
  /** Bar numbers of the anacrusis leading into the part (not counted as bars). */
  pickup: number[];
  /** Bars counted for the grouping: the part as first played, through its first ending. */
  countedBars: number;
  grouping: { phraseBars: number[]; reason: string };
  endings: string; // how endings were handled, empty when the part has none
  phrases: Phrase[];
}

export type PatternName = "phrase1=phrase3" | "lastPhraseShared" | "secondHalfShared";

export interface Pattern {
  pattern: PatternName;
  parts: string[];
  first: string[]; // phrase ids on the first side
  second: string[];
  kind: "exact" | "near";
  differingNotes: number;
  description: string;
}

export interface Swap {
  phrase: string; // the near twin that is played like its model while learning
  model: string; // the first occurrence of its letter's phrase
  differingNotes: number;
}

export interface PhraseMap {
  parts: PartMap[];
  twins: Twin[];
  patterns: Pattern[];
  swaps: Swap[];
  learningLoad: { distinct: number; afterSwaps: number };
  /** The grid the phrases were compared on, in whole notes ("1/8"). */
  grid: string;
}
