// Notes heard: the pitch track cut into notes where the pitch moves to another semitone or the sound
// starts again (a new bow stroke on the same note), with each note's pitch the median of its frames.
import { HOP, WINDOW, type Track } from "./pitch-track";

export interface HeardNote {
  start: number; // seconds
  end: number;
  /** Median fractional MIDI number of the note's steady part (A4 = 69). */
  midi: number;
}

// A pitch inside half a semitone of the note's own stays in the note (vibrato, a slightly bent finger).
const SAME_NOTE = 0.5;
// A new pitch must hold this many frames to start a note; a shorter one is the blur between two notes.
const HOLD_FRAMES = 2;
// An octave away it must hold longer: a frame or two an octave off is the pitch method slipping, not a leap.
const OCTAVE_HOLD = 4;
// Unvoiced frames that end a note (24 ms): a shorter gap is a bow change or a moment of scratch.
const GAP_FRAMES = 3;
// Notes shorter than this are grace notes and cuts, not notes of the melody (40 ms).
const MIN_FRAMES = 5;
// A rise in loudness that starts a note again on the same pitch: dB over RISE_FRAMES frames (common practice
// for energy-based onset detection: a sharp rise in short-time energy marks an attack).
const RISE_DB = 6;
const RISE_FRAMES = 4;
// The same note starts again only after its sound dipped this far below its own level (dB), and not in
// its first 80 ms, where a slow attack is still rising.
const DIP_DB = 6;
const SPLIT_FRAMES = 10;
const MIN_STEP_DB = 1.5; // the steepest frame of the rise: the attack itself, not the level settling after it
// Frames dropped from the start of a note before its pitch is judged (the attack's scrape).
const ATTACK_FRAMES = 2;
// Frames this far below the loud part of the recording are silence, whatever their pitch (dB).
const DYNAMIC_RANGE = 35;

function percentile(values: Float32Array, p: number): number {
  const sorted = Float32Array.from(values).sort();
  return sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] : -120;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Loudness of each hop-long slice centred on each frame: sharper in time than the 32 ms window. */
function fineLoudness(samples: Float32Array, frames: number): Float32Array {
  const out = new Float32Array(frames);
  for (let f = 0; f < frames; f++) {
    const from = f * HOP + (WINDOW - HOP) / 2;
    let sum = 0;
    for (let i = from; i < from + HOP; i++) sum += samples[i] * samples[i];
    const rms = Math.sqrt(sum / HOP);
    out[f] = rms > 1e-6 ? 20 * Math.log10(rms) : -120;
  }
  return out;
}

/** Frames where the sound starts again: a rise of RISE_DB within RISE_FRAMES, at its steepest frame. */
function energyOnsets(fine: Float32Array): Uint8Array {
  const rise = new Float32Array(fine.length);
  for (let f = RISE_FRAMES; f < fine.length; f++) {
    let low = fine[f];
    for (let k = 1; k <= RISE_FRAMES; k++) low = Math.min(low, fine[f - k]);
    rise[f] = fine[f] - low;
  }
  const onset = new Uint8Array(fine.length);
  for (let f = 1; f < fine.length - 1; f++) {
    if (rise[f] < RISE_DB) continue;
    const step = fine[f] - fine[f - 1];
    if (
      step >= MIN_STEP_DB &&
      step >= fine[f + 1] - fine[f] &&
      !onset.subarray(Math.max(0, f - RISE_FRAMES), f).includes(1)
    )
      onset[f] = 1;
  }
  return onset;
}

/** Folds a one-frame octave error (McLeod and Wyvill's known failure) back to the note's octave. */
function fold(m: number, ref: number): number | null {
  const d = m - ref;
  if (Math.abs(d) < SAME_NOTE) return m;
  const octaves = Math.round(d / 12);
  if (octaves !== 0 && Math.abs(d - 12 * octaves) < SAME_NOTE) return null;
  return NaN;
}

export function findNotes(track: Track, samples: Float32Array): HeardNote[] {
  const n = track.midi.length;
  if (n === 0) return [];
  const gate = percentile(track.db, 0.95) - DYNAMIC_RANGE;
  const fine = fineLoudness(samples, n);
  const onsets = energyOnsets(fine);
  const notes: HeardNote[] = [];
  let frames: number[] = []; // pitches of the current note's frames (octave errors left out)
  let first = -1;
  let last = -1;
  let ref = NaN;
  let gap = 0;
  let level = 0; // sum of the note's loudness after its attack, over levelFrames frames
  let levelFrames = 0;
  const dipBefore = (f: number) => Math.min(...fine.subarray(Math.max(0, f - RISE_FRAMES), f));

  const close = () => {
    if (first >= 0 && last - first + 1 >= MIN_FRAMES && frames.length >= 3) {
      const steady = frames.length > ATTACK_FRAMES + 3 ? frames.slice(ATTACK_FRAMES) : frames;
      notes.push({
        start: track.times[first], // the window's centre: where more than half of it holds the new note
        end: track.times[last] + track.hopSeconds,
        midi: median(steady),
      });
    }
    frames = [];
    first = -1;
    last = -1;
    ref = NaN;
  };
  const open = (f: number) => {
    first = f;
    last = f;
    frames = [track.midi[f]];
    ref = track.midi[f];
    level = 0;
    levelFrames = 0;
  };
  const holds = (f: number, m: number, frames: number) => {
    for (let k = 1; k < frames; k++) {
      const next = track.midi[f + k];
      if (!(Math.abs(next - m) < SAME_NOTE)) return false;
    }
    return true;
  };

  let pending = -1; // an onset heard on a frame without pitch (the bow's new stroke), waiting for a voiced frame
  for (let f = 0; f < n; f++) {
    const m = track.midi[f];
    if (onsets[f]) pending = f;
    else if (pending >= 0 && f - pending > RISE_FRAMES) pending = -1;
    const voiced = !Number.isNaN(m) && track.db[f] >= gate;
    if (!voiced) {
      if (first >= 0 && ++gap >= GAP_FRAMES) close();
      continue;
    }
    gap = 0;
    if (first < 0) {
      if (holds(f, m, HOLD_FRAMES)) open(f);
      continue;
    }
    const folded = fold(m, ref);
    if (folded === null && !holds(f, m, OCTAVE_HOLD)) {
      last = f; // an octave slip: the note goes on, its pitch is not counted
      continue;
    }
    if (folded === null || Number.isNaN(folded)) {
      if (holds(f, m, HOLD_FRAMES)) {
        close();
        open(f);
      }
      continue;
    }
    if (
      pending >= 0 &&
      pending - first >= SPLIT_FRAMES &&
      dipBefore(pending) <= level / Math.max(1, levelFrames) - DIP_DB
    ) {
      pending = -1;
      close(); // the same note bowed again
      open(f);
      continue;
    }
    last = f;
    frames.push(m);
    if (f - first >= ATTACK_FRAMES) {
      level += fine[f];
      levelFrames++;
    }
    if (frames.length <= 16) ref = median(frames.length > ATTACK_FRAMES + 2 ? frames.slice(ATTACK_FRAMES) : frames);
  }
  close();
  return notes;
}
