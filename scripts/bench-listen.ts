// npm run -s bench:listen — how long the listening aid takes over 60 seconds of audio on one core:
// ffmpeg's decode (one thread) and the analysis (Node's one thread), each the median of five runs,
// with the CPU time the analysis used beside its wall time (this machine is shared).
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { loadavg, tmpdir } from "node:os";
import path from "node:path";
import { analyze } from "@/lib/abc";
import { decodeAudio, listen } from "@/lib/listen";
import { renderRecording } from "@/lib/listen/recording";

const RUNS = 5;
const SECONDS = 60;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1];
const cpuMs = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};
/** CPU time of finished child processes (ffmpeg), from /proc/self/stat's cutime and cstime (Linux, 100 ticks a second). */
const childCpuMs = () => {
  const fields = readFileSync("/proc/self/stat", "utf8").split(") ")[1].split(" ");
  return (Number(fields[13]) + Number(fields[14])) * 10;
};

const tune = analyze(readFileSync("db/seed-data/tunes/frost-cold-frame.abc", "utf8"));
if (!tune.ok) throw new Error("the demo reel does not read");
const stage = tune.value.stages[0].abc;
// The reel's first stage, repeats played, at a tempo that fills about a minute; room noise at 20 dB.
const rendered = await renderRecording(stage, { bpm: 150, voice: "fiddle", seed: 1, noiseDb: 20, format: "mp3" });
const dir = mkdtempSync(path.join(tmpdir(), "bench-listen-"));
const file = path.join(dir, "take.mp3");
writeFileSync(file, rendered.bytes);

const decodes: number[] = [];
const decodeCpus: number[] = [];
const walls: number[] = [];
const cpus: number[] = [];
let seconds = 0;
let bars = 0;
for (let run = 0; run < RUNS; run++) {
  const d0 = childCpuMs();
  const t0 = performance.now();
  const pcm = await decodeAudio(file);
  const t1 = performance.now();
  decodeCpus.push(childCpuMs() - d0);
  const c0 = cpuMs();
  const result = listen(stage, pcm);
  const c1 = cpuMs();
  const t2 = performance.now();
  seconds = pcm.samples.length / pcm.sampleRate;
  bars = result.bars.filter((b) => b.verdict !== "clean").length;
  decodes.push(t1 - t0);
  walls.push(t2 - t1);
  cpus.push(c1 - c0);
}
rmSync(dir, { recursive: true, force: true });
const scale = SECONDS / seconds; // figures per 60 s of audio
const f = (ms: number) => (ms / 1000).toFixed(2);
console.log(
  `bench:listen — ${seconds.toFixed(1)} s of fiddle (mp3, 20 dB room noise), median of ${RUNS} runs; load average ${loadavg()[0].toFixed(1)} on this shared machine`,
);
console.log(
  `  decode (ffmpeg, 1 thread):          ${f(median(decodes) * scale)} s wall, ${f(median(decodeCpus) * scale)} s CPU`,
);
console.log(
  `  analysis (pitch, notes, alignment): ${f(median(walls) * scale)} s wall, ${f(median(cpus) * scale)} s CPU`,
);
const cpu = (median(decodeCpus) + median(cpus)) * scale;
console.log(
  `  60 s of audio analysed in ${f(cpu)} s of one core's time (goal ≤ 2 s: ${cpu <= 2000 ? "met" : "missed"}); ` +
    `${f((median(decodes) + median(walls)) * scale)} s wall at this load. Bars to check in this clean take: ${bars}`,
);
