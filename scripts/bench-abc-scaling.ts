// The tune engine on long tunes and odd input, for bench:abc: analysis time as a tune grows (its
// parts repeated, as a long set is written out), the same for distinct music (a medley of corpus
// tunes), and the slowest of the fuzz test's mutated tunes.
import { compareSettings } from "../lib/abc/compare";
import { analyze, prepareTune } from "../lib/abc/index";
import { corpusTunes, FUZZ_COUNT, FUZZ_SEED, mutants } from "./abc-mutate";

const SIZES = [64, 512, 2000];
const RUNS = [120, 16, 4]; // runs a batch: each batch of a size takes about as long

/**
 * CPU time (the process's user and system time: the machine is shared, and waiting for a CPU is
 * not the engine's cost) per analysis over a batch of n runs in a row, best of three batches. A
 * batch pays for the garbage its runs leave, as a server would: a long tune's parse (abcjs
 * builds about 350 bytes of objects per character) is still alive when the first collection
 * comes, a short tune's is not, and timing single runs would leave that cost out for short ones.
 */
function perRun(n: number, f: () => unknown): number {
  let best = Infinity;
  for (let batch = 0; batch < 3; batch++) {
    const c0 = process.cpuUsage();
    for (let i = 0; i < n; i++) f();
    const d = process.cpuUsage(c0);
    best = Math.min(best, (d.user + d.system) / 1000 / n);
  }
  return best;
}

/** CPU time of one run, best of n (a fuzz input is small: one run is what a teacher waits for). */
function bestOf(n: number, f: () => unknown): number {
  let best = Infinity;
  for (let i = 0; i < n; i++) {
    const c0 = process.cpuUsage();
    f();
    const d = process.cpuUsage(c0);
    best = Math.min(best, (d.user + d.system) / 1000);
  }
  return best;
}

const barCount = (abc: string): number => {
  const p = prepareTune(abc);
  return p.ok ? (p.value.model.bars.get(p.value.model.melody)?.length ?? 0) : 0;
};
const split = (abc: string): { head: string; body: string } => {
  const k = /^K:.*$/m.exec(abc);
  const end = k ? k.index + k[0].length + 1 : 0;
  return { head: abc.slice(0, end), body: abc.slice(end).trimEnd() };
};

/** The first cleaned reel of 16 bars in two parts: its body written out again and again. */
function repeated(tunes: string[]): { title: string; tunes: string[] } {
  const base = tunes.find((t) => /^R:\s*reel|reel/im.test(t) && barCount(t) === 16 && analyze(t).ok) ?? tunes[0] ?? "";
  const { head, body } = split(base);
  const title = /^T:(.*)$/m.exec(base)?.[1]?.trim() ?? "?";
  return { title, tunes: SIZES.map((n) => `${head}${Array.from({ length: n / 16 }, () => body).join("\n")}\n`) };
}

/** Distinct tunes one after another, each with its own M:, L: and K:, until the size is reached. */
function medley(tunes: string[]): string[] {
  const pieces: { text: string; bars: number }[] = [];
  for (const t of tunes) {
    if (!analyze(t).ok) continue;
    const { head, body } = split(t);
    const fields = head.split("\n").filter((l) => /^[MLK]:/.test(l));
    pieces.push({ text: `${fields.join("\n")}\n${body.replace(/\n\s*\n/g, "\n")}`, bars: barCount(t) });
    if (pieces.reduce((a, p) => a + p.bars, 0) > SIZES[SIZES.length - 1] + 100) break;
  }
  return SIZES.map((n) => {
    const used: string[] = [];
    let bars = 0;
    for (const p of pieces) {
      if (bars + p.bars > n) break;
      used.push(p.text);
      bars += p.bars;
    }
    return `X:1\nT:Medley\n${used.join("\n")}\n`;
  });
}

function line(label: string, abcs: string[]): void {
  const times = abcs.map((abc, i) => perRun(RUNS[i] ?? 3, () => analyze(abc)));
  const sizes = abcs.map(barCount);
  const cells = times.map((t, i) => `${sizes[i]?.toLocaleString("en")} bars ${t.toFixed(1)} ms`).join(", ");
  const ratio = (times[times.length - 1] ?? 0) / (times[0] ?? 1);
  const linear = (sizes[2] ?? 0) / (sizes[0] ?? 1);
  console.log(`${label}: ${cells}; ${ratio.toFixed(1)}× as long for ${linear.toFixed(1)}× the bars`);
}

export function benchScaling(): void {
  const tunes = corpusTunes();
  const rep = repeated(tunes);
  for (const abc of rep.tunes) analyze(abc); // warm-up
  const times = rep.tunes.map((abc, i) => perRun(RUNS[i] ?? 3, () => analyze(abc)));
  const sizes = rep.tunes.map(barCount);
  console.log(
    `scaling (${rep.title}, its parts repeated; CPU time a run, in batches of ${RUNS.join("/")}): ${times
      .map((t, i) => `${sizes[i]?.toLocaleString("en")} bars ${t.toFixed(1)} ms`)
      .join(", ")}`,
  );
  const ratio = (times[2] ?? 0) / (times[0] ?? 1);
  console.log(`scaling ratio 2000/64 bars: ${ratio.toFixed(1)} (goal ≤ 40; 31 is linear)`);
  line("scaling, distinct music (a medley of corpus tunes)", medley(tunes));
  // compare: each long setting against itself with one note in seven a step higher
  const other = (abc: string): string => {
    const { head, body } = split(abc);
    let n = 0;
    return (
      head +
      body.replace(/[A-Ga-g]/g, (c) =>
        ++n % 7 === 0 ? (c === "g" ? "a" : c === "G" ? "A" : String.fromCharCode(c.charCodeAt(0) + 1)) : c,
      )
    );
  };
  const cmpTimes = rep.tunes.map((abc, i) => perRun(RUNS[i] ?? 3, () => compareSettings(abc, other(abc))));
  console.log(
    `compare, the same settings against a changed copy: ${cmpTimes
      .map((t, i) => `${sizes[i]?.toLocaleString("en")} bars ${t.toFixed(1)} ms`)
      .join(", ")}; ${((cmpTimes[2] ?? 0) / (cmpTimes[0] ?? 1)).toFixed(1)}× as long for the longest`,
  );

  const inputs = mutants(tunes, FUZZ_COUNT, FUZZ_SEED);
  const each = inputs.map((abc) => bestOf(3, () => analyze(abc)));
  const sorted = [...each].sort((a, b) => a - b);
  const slowest = sorted[sorted.length - 1] ?? 0;
  const at = each.indexOf(slowest);
  console.log(
    `fuzz inputs: ${FUZZ_COUNT.toLocaleString("en")} mutated corpus tunes (seed ${FUZZ_SEED}), median ${(sorted[sorted.length >> 1] ?? 0).toFixed(2)} ms, slowest ${slowest.toFixed(1)} ms CPU (best of 3; mutant ${at}, ${inputs[at]?.length ?? 0} characters; goal ≤ 250 ms)`,
  );
}
