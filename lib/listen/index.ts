// The listening aid: a recording heard against one stage of a tune, bar by bar (PRODUCT.md §3,
// "listening aid"). Pure apart from ./decode.ts, which runs ffmpeg: no database, no framework.
import type { Problem } from "@/lib/abc";
import { align } from "./align";
import { decodeAudio, type Pcm } from "./decode";
import { readScore } from "./expected";
import { findNotes } from "./notes";
import { trackPitch } from "./pitch-track";
import { buildReport } from "./report";
import type { ListenResult } from "./types";

export type { ListenResult, BarReport, Verdict, HeardNoteReport, ExtraNote, TempoReport, StopReport } from "./types";
export { decodeAudio, UnreadableAudio, SAMPLE_RATE, type Pcm } from "./decode";
export { summarise, barList, clock } from "./summary";

export class UnreadableTune extends Error {
  constructor(readonly problems: Problem[]) {
    super(
      `The stage's music could not be read: ${problems.map((p) => `${p.line}:${p.column} ${p.message}`).join("; ")}`,
    );
    this.name = "UnreadableTune";
  }
}

export interface ListenOptions {
  /** The tempo the student meant to play at, in beats of the meter per minute (the tune's Q: field otherwise). */
  tempo?: number;
}

/** Hears decoded audio against a stage's ABC. Throws UnreadableTune when the ABC has no music. */
export function listen(abc: string, pcm: Pcm, opts: ListenOptions = {}): ListenResult {
  const read = readScore(abc);
  if (!read.ok) throw new UnreadableTune(read.problems);
  const track = trackPitch(pcm.samples, pcm.sampleRate);
  const heard = findNotes(track, pcm.samples);
  const steps = align(heard, read.score);
  const expected = opts.tempo ?? read.score.marked;
  return buildReport(read.score, heard, steps, pcm.samples.length / pcm.sampleRate, expected ?? null);
}

/** Decodes a recording (a path or its bytes) with ffmpeg and hears it against the stage. */
export async function listenTo(
  abc: string,
  recording: string | Uint8Array,
  opts: ListenOptions = {},
): Promise<ListenResult> {
  const read = readScore(abc);
  if (!read.ok) throw new UnreadableTune(read.problems);
  return listen(abc, await decodeAudio(recording), opts);
}
