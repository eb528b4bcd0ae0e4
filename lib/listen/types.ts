// The listening aid's shapes: what it heard in a recording against one stage of a tune. Plain data
// (it serialises with JSON.stringify, is stored with the check-in and read by the browser).

/** How a bar sounded: every note heard as written / something to listen to / not played at all. */
export type Verdict = "clean" | "check" | "missed";

export interface HeardNoteReport {
  /** The written note, scientific pitch name ("A4"). */
  expected: string;
  /** The nearest equal-tempered note heard for it, or null when it was not heard (missed). */
  heard: string | null;
  /** Intonation of what was heard against that nearest note, in cents (A4 = 440 Hz); null when missed. */
  cents: number | null;
  /** When it started in the recording, in seconds; for a missed note, about when it was due. */
  at: number | null;
  /** Semitones from the written note to the one heard (0 when right); null when missed. */
  off: number | null;
}

export interface BarReport {
  /** The bar as the phrase map numbers it (pickup = 0). */
  bar: number;
  verdict: Verdict;
  /** When the bar was first heard, in seconds (where a click on the bar starts the recording). */
  at: number | null;
  /** How many times the bar was heard (a repeat or a restart plays it again). */
  heardTimes: number;
  /** Median intonation of the bar's notes in cents, null when none was heard. */
  cents: number | null;
  /** Why the bar is worth a listen, in plain words ("G4 heard for A4 (1 semitone low)"). */
  reasons: string[];
  notes: HeardNoteReport[];
}

export interface ExtraNote {
  heard: string;
  cents: number;
  at: number;
  /** The bar it was played in, or null before the tune started or after it ended. */
  bar: number | null;
  /** Beside a note written with an ornament: likely part of the ornament, so not a fault. */
  ornament: boolean;
}

export interface TempoPoint {
  at: number; // seconds
  bpm: number;
  bar: number;
}

export interface TempoReport {
  /** Beats per minute over the opening bars and the closing bars; null when too little was heard. */
  start: number | null;
  end: number | null;
  /** The tempo asked for (the player's, or the tune's Q: field), in the same beats; null when none. */
  expected: number | null;
  /** What a beat is here ("quarter note", "dotted quarter note"). */
  beat: string;
  /** Bar by bar, as played. */
  overTime: TempoPoint[];
  /** Spread of the bar-by-bar tempo: the coefficient of variation, in percent. */
  spreadPercent: number | null;
  steadiness: "steady" | "a little uneven" | "uneven" | null;
}

export interface StopReport {
  /** Where the playing broke off, in seconds, and the bar it broke off in. */
  at: number;
  bar: number;
  /** The bar it started again from, or null when the recording ends there. */
  restartBar: number | null;
}

export interface ListenResult {
  tempo: TempoReport;
  bars: BarReport[];
  extra: ExtraNote[];
  /** Where the student first stopped (a break and a restart, or the recording ending early); null when played through. */
  stoppedAt: number | null;
  stops: StopReport[];
  /** The median intonation of every note heard, in cents: a whole recording a little sharp or flat is a tuning matter. */
  tuningCents: number | null;
  /** Seconds of audio heard, and how many notes. */
  seconds: number;
  notesHeard: number;
  /** One line for the teacher: "3 bars to listen to: 5, 6, 14; tempo 92→84 bpm". */
  summary: string;
}
