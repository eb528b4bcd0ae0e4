// Any recording the app accepts (the browser's recorder's webm/ogg, uploaded wav, mp3, m4a …) to
// mono 32-bit float PCM through Debian's ffmpeg (installed by scripts/lib.sh), read from its stdout.
import { spawn } from "node:child_process";

/** 16 kHz: the fiddle's range (G3 196 Hz to about E7 2.6 kHz) with room to spare, at a third of CD's work. */
export const SAMPLE_RATE = 16_000;
/** The longest recording analysed; a check-in is one stage, minutes at most. */
export const MAX_SECONDS = 600;

export class UnreadableAudio extends Error {
  constructor(message: string) {
    super(message);
    this.name = "UnreadableAudio";
  }
}

export interface Pcm {
  samples: Float32Array;
  sampleRate: number;
}

/** The ffmpeg program: FFMPEG_PATH when set, else the one on PATH. */
export function ffmpegPath(): string {
  return process.env.FFMPEG_PATH || "ffmpeg";
}

/**
 * Decodes a file (a path) or bytes (piped to ffmpeg's stdin) to mono PCM at `sampleRate`.
 * Throws UnreadableAudio when ffmpeg finds no audio in it; an Error when ffmpeg itself is missing.
 */
export function decodeAudio(input: string | Uint8Array, sampleRate = SAMPLE_RATE): Promise<Pcm> {
  const source = typeof input === "string" ? input : "pipe:0";
  const args = [
    "-hide_banner",
    "-nostdin",
    "-loglevel",
    "error",
    "-threads",
    "1",
    "-i",
    source,
    "-vn",
    "-t",
    String(MAX_SECONDS),
  ];
  args.push("-ac", "1", "-ar", String(sampleRate), "-f", "f32le", "-acodec", "pcm_f32le", "pipe:1");
  return new Promise((resolve, reject) => {
    const child = spawn(ffmpegPath(), args, { stdio: [typeof input === "string" ? "ignore" : "pipe", "pipe", "pipe"] });
    const chunks: Buffer[] = [];
    let errors = "";
    child.stdout?.on("data", (c: Buffer) => chunks.push(c));
    child.stderr?.on("data", (c: Buffer) => {
      if (errors.length < 4000) errors += c.toString();
    });
    child.on("error", (e: NodeJS.ErrnoException) =>
      reject(
        e.code === "ENOENT"
          ? new Error("ffmpeg is not installed (Debian's package ffmpeg; npm start and npm test install it)")
          : e,
      ),
    );
    if (typeof input !== "string" && child.stdin) {
      // ffmpeg may stop reading early (a bad header): that is its exit code's business, not a crash here.
      child.stdin.on("error", () => {});
      child.stdin.end(Buffer.from(input.buffer, input.byteOffset, input.byteLength));
    }
    child.on("close", (code) => {
      const bytes = Buffer.concat(chunks);
      const first = errors.split("\n").find((l) => l.trim()) ?? "";
      if (code !== 0 || bytes.length < 4) {
        reject(new UnreadableAudio(`The recording could not be read as audio${first ? ` (${first.trim()})` : ""}.`));
        return;
      }
      const n = Math.floor(bytes.length / 4);
      // a copy: a small Buffer may sit at an offset of Node's pool that Float32Array cannot view
      const samples = new Float32Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + n * 4));
      resolve({ samples, sampleRate });
    });
  });
}
