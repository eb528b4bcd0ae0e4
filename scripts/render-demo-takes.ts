// Makes the demo school's check-in recordings (db/seed-data/takes.ts) with the app's own renderer and
// fiddle samples, into db/seed-data/recordings/*.mp3; the seed ships them rather than render them each
// time. Deterministic: the same takes give the same notes (ffmpeg's encoder may differ by a byte).
//   npx tsx scripts/render-demo-takes.ts [name …]    (all takes when none is named)
import { readFileSync, writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { analyze } from "../lib/abc/index";
import { renderRecording } from "../lib/listen/recording";
import { DEMO_TAKES, takeFile, type DemoTake, type TakeName } from "../db/seed-data/takes";

const names = (process.argv.length > 2 ? process.argv.slice(2) : Object.keys(DEMO_TAKES)) as TakeName[];
let bytes = 0;
for (const name of names) {
  const take: DemoTake = DEMO_TAKES[name];
  if (!take) throw new Error(`no take "${name}" in db/seed-data/takes.ts`);
  const tune = analyze(readFileSync(new URL(`../db/seed-data/tunes/${take.tune}`, import.meta.url), "utf8"));
  if (!tune.ok) throw new Error(`${take.tune} does not read`);
  const stage = tune.value.stages.find((s) => s.index === take.stage);
  if (!stage) throw new Error(`${take.tune} has no stage ${take.stage}`);
  const rendered = await renderRecording(stage.abc, {
    bpm: take.bpm,
    seed: take.seed,
    noiseDb: take.noiseDb,
    drift: take.drift,
    faults: take.faults,
    repeats: "skip",
    voice: "fiddle",
    // 16 kHz mono at 24 kbit/s: small enough to ship, and the listening aid decodes at 16 kHz anyway.
    sampleRate: 16_000,
    format: "mp3",
    bitrate: "24k",
  });
  writeFileSync(fileURLToPath(takeFile(name)), rendered.bytes);
  bytes += rendered.bytes.length;
  const faultBars = [...new Set(rendered.performance.truth.filter((t) => t.played !== "right").map((t) => t.bar))];
  console.log(
    `${name}: ${rendered.performance.seconds.toFixed(1)} s, ${Math.round(rendered.bytes.length / 1024)} KB, ` +
      `faults in bars ${faultBars.join(", ") || "none"}`,
  );
}
console.log(`${names.length} takes, ${Math.round(bytes / 1024)} KB`);
