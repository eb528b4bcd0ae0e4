// Renders a made-up recording of one stage of a tune with the app's fiddle samples (or a plain tone):
//   npx tsx scripts/render-stage.ts <tune.abc> <out.mp3|.wav|.ogg|.webm> [--stage N] [--bpm B] [--voice fiddle|tone]
//     [--seed S] [--noise SNR_DB] [--drift 0.1] [--wrong 0.05] [--missed 0.05] [--extra 0.05] [--detune 0.05]
//     [--skip-repeats] [--late SECONDS] [--stop AFTER_NOTES:RESTART_BAR]
// Prints what was played wrong (the truth) as JSON on stdout. The demo seed calls renderRecording() itself.
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { analyze } from "../lib/abc/index";
import { renderRecording } from "../lib/listen/recording";
import type { Compressed } from "../lib/listen/encode";

const args = process.argv.slice(2);
const value = (name: string): string | undefined => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const num = (name: string): number | undefined => {
  const v = value(name);
  if (v === undefined) return undefined;
  const n = Number(v);
  if (!Number.isFinite(n)) {
    console.error(`${name} needs a number, not "${v}"`);
    process.exit(2);
  }
  return n;
};
const BARE = new Set(["--skip-repeats"]); // the one option without a value
const positional = args.filter(
  (a, i) => !a.startsWith("--") && (i === 0 || !args[i - 1].startsWith("--") || BARE.has(args[i - 1])),
);
const [tuneFile, out] = positional;
if (!tuneFile || !out) {
  console.error(
    "usage: npx tsx scripts/render-stage.ts <tune.abc> <out.mp3|.wav|.ogg|.webm> [options] (see the file's head)",
  );
  process.exit(2);
}
const format = path.extname(out).slice(1) as Compressed | "wav";
if (!["mp3", "wav", "ogg", "webm"].includes(format)) {
  console.error(`${out}: the name must end in .mp3, .wav, .ogg or .webm`);
  process.exit(2);
}
const tune = analyze(readFileSync(tuneFile, "utf8"));
if (!tune.ok) {
  for (const p of tune.problems) console.error(`${tuneFile}:${p.line}:${p.column}: ${p.message}`);
  process.exit(2);
}
const stage = tune.value.stages.find((s) => s.index === (num("--stage") ?? 1));
if (!stage) {
  console.error(`${tuneFile}: no stage ${num("--stage")}`);
  process.exit(2);
}
const stop = value("--stop")?.split(":").map(Number);
const rendered = await renderRecording(stage.abc, {
  bpm: num("--bpm") ?? 90,
  voice: value("--voice") === "tone" ? "tone" : "fiddle",
  seed: num("--seed") ?? 1,
  noiseDb: num("--noise"),
  drift: num("--drift"),
  repeats: args.includes("--skip-repeats") ? "skip" : "play",
  lateStart: num("--late"),
  faults: { wrong: num("--wrong"), missed: num("--missed"), extra: num("--extra"), detune: num("--detune") },
  stop: stop && stop.length === 2 ? { afterNotes: stop[0], restartBar: stop[1], pauseSeconds: 2 } : undefined,
  format,
});
writeFileSync(out, rendered.bytes);
const { truth, extras, seconds } = rendered.performance;
const faults = truth
  .filter((t) => t.played !== "right")
  .map(({ bar, played, midi, cents, at }) => ({ bar, played, midi, cents, at }));
console.log(JSON.stringify({ file: out, contentType: rendered.contentType, seconds, faults, extras }, null, 2));
