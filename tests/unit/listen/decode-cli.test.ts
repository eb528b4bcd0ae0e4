import { execFile } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { describe, expect, it } from "vitest";
import { analyze } from "@/lib/abc";
import { decodeAudio, UnreadableAudio } from "@/lib/listen";
import { encodeWav } from "@/lib/listen/encode";
import { renderRecording } from "@/lib/listen/recording";
import { stageOf } from "./truth";

const run = promisify(execFile);
const dir = mkdtempSync(path.join(tmpdir(), "rosinwood-listen-"));
const TUNE = "db/seed-data/tunes/rattling-gate.abc";

describe("decoding recordings with ffmpeg", () => {
  it("reads a WAV file to 16 kHz mono, whatever its own rate", async () => {
    const samples = Float32Array.from({ length: 44_100 }, (_, i) => 0.5 * Math.sin((2 * Math.PI * 440 * i) / 44_100));
    const file = path.join(dir, "tone.wav");
    writeFileSync(file, encodeWav(samples, 44_100));
    const pcm = await decodeAudio(file);
    expect(pcm.sampleRate).toBe(16_000);
    expect(Math.abs(pcm.samples.length - 16_000)).toBeLessThan(50);
    expect(Math.max(...pcm.samples.subarray(1000, 2000))).toBeGreaterThan(0.45);
  });
  it("says a file that is not audio cannot be read", async () => {
    await expect(decodeAudio(new TextEncoder().encode("this is not audio at all"))).rejects.toBeInstanceOf(
      UnreadableAudio,
    );
  });
});

describe("npm run -s abc -- listen", () => {
  it("prints the bars, tempo, extras and stop of an mp3 rendering as JSON, bar 0 the pickup", async () => {
    const abc = stageOf("rattling-gate.abc", 2);
    const a = analyze(abc);
    if (!a.ok) throw new Error("unreadable");
    const rendered = await renderRecording(abc, {
      bpm: 92,
      voice: "fiddle",
      seed: 9,
      faults: { missed: 0.08 },
      format: "mp3",
    });
    const file = path.join(dir, "take.mp3");
    writeFileSync(file, rendered.bytes);
    const { stdout } = await run("node_modules/.bin/tsx", [
      "scripts/abc-cli.ts",
      "listen",
      TUNE,
      file,
      "--stage",
      "2",
      "--tempo",
      "92",
    ]);
    const out = JSON.parse(stdout) as {
      tempo: { start: number; end: number; expected: number };
      bars: {
        bar: number;
        verdict: string;
        notes: { expected: string; heard: string | null; cents: number | null; at: number | null }[];
      }[];
      extra: unknown[];
      stoppedAt: number | null;
    };
    expect(out.bars[0].bar).toBe(0);
    expect(out.bars.map((b) => b.bar)).toEqual([...Array(17).keys()]);
    expect(out.tempo.expected).toBe(92);
    expect(Math.abs(out.tempo.start - 92)).toBeLessThan(92 * 0.03);
    expect(out.stoppedAt).toBeNull();
    const missed = rendered.performance.truth.filter((t) => t.played === "missed");
    expect(missed.length).toBeGreaterThan(0);
    for (const m of missed) {
      const bar = out.bars.find((b) => b.bar === m.bar);
      expect(bar?.verdict).toBe("check");
      expect(bar?.notes.some((n) => n.heard === null && n.at !== null && Math.abs(n.at - m.at) < 0.4)).toBe(true);
    }
  }, 240_000); // a fresh tsx process and the fiddle samples' decoding: slow on a busy two-CPU machine
  it("exits 2 with a clear message for audio it cannot read", async () => {
    const file = path.join(dir, "notes.txt");
    writeFileSync(file, "not a recording");
    const failed = await run("node_modules/.bin/tsx", ["scripts/abc-cli.ts", "listen", TUNE, file]).then(
      () => null,
      (e: { code: number; stderr: string }) => e,
    );
    expect(failed?.code).toBe(2);
    expect(failed?.stderr).toContain("could not be read as audio");
  }, 240_000);
});
