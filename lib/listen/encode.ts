// Rendered audio to files: a WAV written here (16-bit PCM), mp3/ogg/webm through Debian's ffmpeg.
import { spawn } from "node:child_process";
import { ffmpegPath } from "./decode";

/**
 * 16-bit mono PCM WAV. Layout per the RIFF WAVE format (Microsoft Multimedia Programming Interface and
 * Data Specifications 1.0): "RIFF" size "WAVE", a 16-byte "fmt " chunk with PCM = 1, then "data".
 */
export function encodeWav(samples: Float32Array, sampleRate: number): Buffer {
  const data = Buffer.alloc(samples.length * 2);
  for (let i = 0; i < samples.length; i++)
    data.writeInt16LE(Math.round(Math.max(-1, Math.min(1, samples[i])) * 32767), i * 2);
  const h = Buffer.alloc(44);
  h.write("RIFF", 0, "ascii");
  h.writeUInt32LE(36 + data.length, 4);
  h.write("WAVE", 8, "ascii");
  h.write("fmt ", 12, "ascii");
  h.writeUInt32LE(16, 16);
  h.writeUInt16LE(1, 20); // PCM
  h.writeUInt16LE(1, 22); // mono
  h.writeUInt32LE(sampleRate, 24);
  h.writeUInt32LE(sampleRate * 2, 28); // byte rate
  h.writeUInt16LE(2, 32); // block align
  h.writeUInt16LE(16, 34); // bits per sample
  h.write("data", 36, "ascii");
  h.writeUInt32LE(data.length, 40);
  return Buffer.concat([h, data]);
}

const CODECS = {
  mp3: ["-f", "mp3", "-c:a", "libmp3lame", "-b:a", "64k"],
  ogg: ["-f", "ogg", "-c:a", "libopus", "-b:a", "48k"],
  webm: ["-f", "webm", "-c:a", "libopus", "-b:a", "48k"],
} as const;
export type Compressed = keyof typeof CODECS;

/**
 * Compresses mono float samples with ffmpeg (mp3 plays in every browser; ogg/webm are what browsers record).
 * `bitrate` (ffmpeg's form, e.g. "24k") replaces the codec's default: the demo's shipped takes are small.
 */
export function encodeCompressed(
  samples: Float32Array,
  sampleRate: number,
  format: Compressed,
  bitrate?: string,
): Promise<Buffer> {
  const args = ["-hide_banner", "-loglevel", "error", "-f", "f32le", "-ar", String(sampleRate), "-ac", "1"];
  const codec: string[] = [...CODECS[format]];
  if (bitrate) codec[codec.indexOf("-b:a") + 1] = bitrate;
  args.push("-i", "pipe:0", ...codec, "pipe:1");
  return new Promise((resolve, reject) => {
    const child = spawn(ffmpegPath(), args, { stdio: ["pipe", "pipe", "pipe"] });
    const out: Buffer[] = [];
    let errors = "";
    child.stdout.on("data", (c: Buffer) => out.push(c));
    child.stderr.on("data", (c: Buffer) => (errors += c.toString()));
    child.on("error", reject);
    child.on("close", (code) =>
      code === 0
        ? resolve(Buffer.concat(out))
        : reject(new Error(`ffmpeg could not encode ${format}: ${errors.trim()}`)),
    );
    child.stdin.end(Buffer.from(samples.buffer, samples.byteOffset, samples.byteLength));
  });
}
