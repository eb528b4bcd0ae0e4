// Renders notes to audio: with the app's own fiddle samples (public/soundfonts/violin-mp3, one mp3 per
// note, decoded by ffmpeg) or with a plain synthetic tone. The listening aid's tests hear these
// renderings, and the demo school's check-ins carry them as recordings.
import { existsSync } from "node:fs";
import path from "node:path";
import { decodeAudio } from "./decode";
import { trackPitch } from "./pitch-track";

export interface RenderNote {
  midi: number; // the equal-tempered note (A4 = 69 = 440 Hz, ISO 16)
  cents?: number; // played this far off it
  start: number; // seconds
  duration: number; // seconds sounding
}

export type Voice = "fiddle" | "tone";

const FLAT_NAMES = ["C", "Db", "D", "Eb", "E", "F", "Gb", "G", "Ab", "A", "Bb", "B"];
// The samples' layout is abcjs's (<instrument>-mp3/<Note><octave>.mp3, flats as Bb4): C3 to C7.
const LOWEST_SAMPLE = 48;
const HIGHEST_SAMPLE = 96;
const RELEASE_SECONDS = 0.012; // a short fade at a note's end, as a bow lifts or changes

export function soundfontDir(): string {
  return process.env.ROSINWOOD_SOUNDFONT_DIR ?? path.join(process.cwd(), "public", "soundfonts", "violin-mp3");
}

export interface Sample {
  samples: Float32Array;
  /**
   * How far the sample's first `seconds` sit from its note, in cents (the median of its pitch track, as
   * the listening aid judges a note). FluidR3's violin starts some notes up to 30 cents flat and settles
   * later, so a rendering retunes each note by what it will use of the sample: in tune, or exactly as
   * far out as a test asks.
   */
  offCents: (seconds: number) => number;
}

export class SampleBank {
  private readonly cache = new Map<number, Promise<Sample>>();
  constructor(
    readonly sampleRate: number,
    private readonly dir = soundfontDir(),
  ) {}

  /** The sample of one note, its leading silence cut so the note starts where it is placed. */
  sample(midi: number): Promise<Sample> {
    const m = Math.min(HIGHEST_SAMPLE, Math.max(LOWEST_SAMPLE, Math.round(midi)));
    let p = this.cache.get(m);
    if (!p) {
      const file = path.join(this.dir, `${FLAT_NAMES[m % 12]}${Math.floor(m / 12) - 1}.mp3`);
      if (!existsSync(file)) throw new Error(`no fiddle sample for MIDI ${m} (${file})`);
      p = decodeAudio(file, this.sampleRate).then(({ samples }) => {
        const trimmed = trimStart(samples, this.sampleRate);
        return { samples: trimmed, offCents: offOver(trimmed, this.sampleRate, m) };
      });
      this.cache.set(m, p);
    }
    return p;
  }
}

function offOver(samples: Float32Array, rate: number, midi: number): (seconds: number) => number {
  const track = trackPitch(samples, rate);
  const known = new Map<number, number>();
  return (seconds) => {
    const key = Math.round(seconds * 50); // 20 ms steps
    let off = known.get(key);
    if (off === undefined) {
      const values: number[] = [];
      for (let f = 0; f < track.times.length && track.times[f] <= key / 50; f++)
        if (f >= 2 && Math.abs(track.midi[f] - midi) < 0.5) values.push(track.midi[f]); // octave slips left out
      values.sort((a, b) => a - b);
      off = values.length ? (values[values.length >> 1] - midi) * 100 : 0;
      known.set(key, off);
    }
    return off;
  };
}

function trimStart(samples: Float32Array, rate: number): Float32Array {
  let peak = 0;
  for (const x of samples) peak = Math.max(peak, Math.abs(x));
  const threshold = peak * 0.02;
  let i = 0;
  while (i < samples.length && Math.abs(samples[i]) < threshold) i++;
  return samples.subarray(Math.max(0, i - Math.round(rate * 0.002)));
}

function envelope(i: number, length: number, rate: number, attack: number): number {
  const release = Math.round(RELEASE_SECONDS * rate);
  const a = Math.round(attack * rate);
  if (a > 0 && i < a) return i / a;
  if (i > length - release) return Math.max(0, (length - i) / release);
  return 1;
}

/** A plain tone: four harmonics falling off as 1/n (a soft sawtooth), 10 ms attack. */
function addTone(out: Float32Array, note: RenderNote, rate: number): void {
  const hz = 440 * 2 ** ((note.midi + (note.cents ?? 0) / 100 - 69) / 12);
  const from = Math.round(note.start * rate);
  const length = Math.min(out.length - from, Math.round(note.duration * rate));
  const w = (2 * Math.PI * hz) / rate;
  for (let i = 0; i < length; i++) {
    const e = envelope(i, length, rate, 0.01);
    let v = 0;
    for (let h = 1; h <= 4; h++) v += Math.sin(w * h * i) / h;
    out[from + i] += 0.25 * e * v;
  }
}

/** A fiddle sample, moved by resampling to its note's pitch (and any cents asked), its own offset taken out. */
function addSample(out: Float32Array, note: RenderNote, { samples: sample, offCents }: Sample, rate: number): void {
  const nearest = Math.min(HIGHEST_SAMPLE, Math.max(LOWEST_SAMPLE, Math.round(note.midi)));
  const ratio = 2 ** ((note.midi - nearest + ((note.cents ?? 0) - offCents(note.duration)) / 100) / 12);
  const from = Math.round(note.start * rate);
  const length = Math.min(out.length - from, Math.round(note.duration * rate), Math.floor((sample.length - 1) / ratio));
  for (let i = 0; i < length; i++) {
    const x = i * ratio;
    const k = Math.floor(x);
    const v = sample[k] + (sample[k + 1] - sample[k]) * (x - k);
    out[from + i] += 0.5 * envelope(i, length, rate, 0) * v;
  }
}

const banks = new Map<number, SampleBank>();
/** One bank per sample rate in a process: each sample is decoded once. */
export function bankFor(sampleRate: number): SampleBank {
  let bank = banks.get(sampleRate);
  if (!bank) banks.set(sampleRate, (bank = new SampleBank(sampleRate)));
  return bank;
}

/** Mixes the notes into one mono recording of `seconds` (or just long enough), peak-normalised. */
export async function renderNotes(
  notes: RenderNote[],
  voice: Voice,
  sampleRate: number,
  opts: { seconds?: number; bank?: SampleBank } = {},
): Promise<Float32Array> {
  const end = notes.reduce((a, n) => Math.max(a, n.start + n.duration), 0);
  const out = new Float32Array(Math.ceil((opts.seconds ?? end + 0.5) * sampleRate));
  const bank = voice === "fiddle" ? (opts.bank ?? bankFor(sampleRate)) : null;
  if (bank) await Promise.all([...new Set(notes.map((n) => Math.round(n.midi)))].map((m) => bank.sample(m)));
  for (const note of notes) {
    if (bank) addSample(out, note, await bank.sample(note.midi), sampleRate);
    else addTone(out, note, sampleRate);
  }
  normalise(out, 0.8);
  return out;
}

export function normalise(out: Float32Array, peakTo: number): void {
  let peak = 0;
  for (const x of out) peak = Math.max(peak, Math.abs(x));
  if (peak > 0) for (let i = 0; i < out.length; i++) out[i] *= peakTo / peak;
}

/** A small deterministic generator (mulberry32, common practice), so a rendering is the same every run. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Adds room noise at a signal-to-noise ratio in dB (power of the whole rendering against the noise's):
 * white noise through a one-pole low-pass near 1 kHz, as a room's hum and rumble lean low.
 */
export function addNoise(out: Float32Array, snrDb: number, seed = 1): void {
  const random = seeded(seed);
  const noise = new Float32Array(out.length);
  let y = 0;
  for (let i = 0; i < noise.length; i++) {
    y += 0.3 * (random() * 2 - 1 - y);
    noise[i] = y;
  }
  const power = (a: Float32Array) => a.reduce((s, x) => s + x * x, 0) / Math.max(1, a.length);
  const scale = Math.sqrt(power(out) / power(noise) / 10 ** (snrDb / 10));
  for (let i = 0; i < out.length; i++) out[i] += noise[i] * scale;
}
