// A made-up check-in recording of one stage: a performance (./perform.ts) rendered with the fiddle
// samples or a plain tone, optionally with room noise, encoded as a file. The demo school's check-ins
// and the listening aid's tests use it; scripts/render-stage.ts is its command line.
import { SAMPLE_RATE } from "./decode";
import { encodeCompressed, encodeWav, type Compressed } from "./encode";
import { perform, type Performance, type PerformOptions } from "./perform";
import { addNoise, renderNotes, type Voice } from "./render";

export interface RecordingOptions extends PerformOptions {
  voice?: Voice; // "fiddle" by default
  /** Room noise at this signal-to-noise ratio in dB; none when absent. */
  noiseDb?: number;
  sampleRate?: number;
}

export interface Rendered {
  performance: Performance;
  samples: Float32Array;
  sampleRate: number;
}

export async function renderPerformance(stageAbc: string, opts: RecordingOptions): Promise<Rendered> {
  const performance = perform(stageAbc, opts);
  const sampleRate = opts.sampleRate ?? SAMPLE_RATE;
  const samples = await renderNotes(performance.notes, opts.voice ?? "fiddle", sampleRate, {
    seconds: performance.seconds,
  });
  if (opts.noiseDb !== undefined) addNoise(samples, opts.noiseDb, (opts.seed ?? 1) + 7);
  return { performance, samples, sampleRate };
}

export const CONTENT_TYPES: Record<Compressed | "wav", string> = {
  wav: "audio/wav",
  mp3: "audio/mpeg",
  ogg: "audio/ogg",
  webm: "audio/webm",
};

/** The rendering as a file's bytes and content type (mp3 by default: small, and every browser plays it). */
export async function renderRecording(
  stageAbc: string,
  opts: RecordingOptions & { format?: Compressed | "wav"; bitrate?: string },
): Promise<Rendered & { bytes: Buffer; contentType: string }> {
  const rendered = await renderPerformance(stageAbc, { sampleRate: 22_050, ...opts });
  const format = opts.format ?? "mp3";
  const bytes =
    format === "wav"
      ? encodeWav(rendered.samples, rendered.sampleRate)
      : await encodeCompressed(rendered.samples, rendered.sampleRate, format, opts.bitrate);
  return { ...rendered, bytes, contentType: CONTENT_TYPES[format] };
}
