// Frame-by-frame pitch and loudness of a mono recording.
//
// Pitch: pitchy's McLeod Pitch Method (P. McLeod and G. Wyvill, "A Smarter Way to Find Pitch",
// ICMC 2005) rather than pitchfinder's YIN (A. de Cheveigné and H. Kawahara, "YIN, a fundamental
// frequency estimator for speech and music", JASA 2002): MPM's normalised square difference is
// computed through an FFT (O(n log n) a frame, where pitchfinder's YIN loops in O(n²)), which keeps
// a minute of audio far inside the 2-second budget, and it returns a clarity (0–1) that doubles as
// the voiced/unvoiced decision. Its known error mode is octave errors — choosing a harmonic's or a
// subharmonic's period (McLeod and Wyvill §4–5) — which ./notes.ts absorbs by judging a note on its
// median and folding one-frame octave jumps into the note around them.
import { PitchDetector } from "pitchy";

/** 32 ms analysis window at 16 kHz: six periods of the fiddle's lowest G (196 Hz), short enough for fast notes. */
export const WINDOW = 512;
/** 8 ms between frames: onsets land within a frame of a note's start. */
export const HOP = 128;
/** Below this clarity a frame has no pitch: noise, a bow change, a chord's blur (MPM's k is 0.9 inside). */
export const MIN_CLARITY = 0.8;

export interface Track {
  /** Time of each frame's centre, in seconds. */
  times: Float32Array;
  /** Fractional MIDI number (A4 = 69 = 440 Hz, ISO 16), NaN when the frame has no pitch. */
  midi: Float32Array;
  clarity: Float32Array;
  /** Loudness of each frame in dB relative to full scale (−120 for silence). */
  db: Float32Array;
  hopSeconds: number;
}

/** ISO 16:1975: the A above middle C is 440 Hz; equal temperament puts 12 semitones to the octave. */
export const A4_HZ = 440;
export const midiOf = (hz: number): number => 69 + 12 * Math.log2(hz / A4_HZ);

// Fiddle range with a margin: open G (55) down a tone, up to about C8; outside it a "pitch" is noise.
const LOWEST_MIDI = 52;
const HIGHEST_MIDI = 108;

export function trackPitch(samples: Float32Array, sampleRate: number): Track {
  const frames = samples.length < WINDOW ? 0 : 1 + Math.floor((samples.length - WINDOW) / HOP);
  const times = new Float32Array(frames);
  const midi = new Float32Array(frames);
  const clarity = new Float32Array(frames);
  const db = new Float32Array(frames);
  const detector = PitchDetector.forFloat32Array(WINDOW);
  detector.minVolumeAbsolute = 1e-4;
  for (let f = 0; f < frames; f++) {
    const start = f * HOP;
    const frame = samples.subarray(start, start + WINDOW);
    let sum = 0;
    for (let i = 0; i < WINDOW; i++) sum += frame[i] * frame[i];
    const rms = Math.sqrt(sum / WINDOW);
    db[f] = rms > 1e-6 ? 20 * Math.log10(rms) : -120;
    times[f] = (start + WINDOW / 2) / sampleRate;
    const [hz, c] = detector.findPitch(frame, sampleRate);
    const m = hz > 0 ? midiOf(hz) : NaN;
    const ok = c >= MIN_CLARITY && m >= LOWEST_MIDI && m <= HIGHEST_MIDI;
    midi[f] = ok ? m : NaN;
    clarity[f] = c;
  }
  return { times, midi, clarity, db, hopSeconds: HOP / sampleRate };
}
