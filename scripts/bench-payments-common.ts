// What bench-payments.ts (in-process) and bench-payments-http.ts (over HTTP) share: the load's shape,
// the cases, the check of each answer and the report of each case.
import { createHash } from "node:crypto";
import { performance } from "node:perf_hooks";

export const CONCURRENCY = 20;
export const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const WARMUP = 20;
const ALONE = Number(process.env.BENCH_ALONE ?? 200);
/** One admin asking one request at a time: every case's p95 (the figure). */
const TARGET_MS = 100;

export type Case = { label: string; path: string; query: Record<string, string> };
export type Answer = { status: number; body: { rows?: unknown[]; hasMore?: boolean; total?: number } };
/** One round of one case: every latency (ms, sorted) and how long the round took. */
export type Round = { times: number[]; seconds: number };

export const pct = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];

/** A case's answer in words for the report; anything but a 200 with rows (where it lists) stops the benchmark. */
export function answerWords({ status, body }: Answer): string {
  if (status !== 200 || (body.rows && body.rows.length === 0))
    throw new Error(`unexpected answer ${status}: ${JSON.stringify(body).slice(0, 200)}`);
  return body.rows
    ? `${body.rows.length} rows, more: ${body.hasMore}`
    : body.total !== undefined
      ? `total ${body.total}`
      : "ok";
}

/** Each case's requests one at a time after WARMUP unmeasured: their latencies, sorted, and the answer in words. */
export async function oneAtATime(call: () => Promise<Answer>): Promise<{ xs: number[]; answer: string }> {
  for (let i = 0; i < WARMUP; i++) answerWords(await call());
  const xs: number[] = [];
  let answer = "";
  for (let i = 0; i < ALONE; i++) {
    const t = performance.now();
    answer = answerWords(await call());
    xs.push(performance.now() - t);
  }
  return { xs: xs.sort((a, b) => a - b), answer };
}

/**
 * A case's lines: its answer, one at a time against the target, each round's p95 at CONCURRENCY in
 * flight, and the percentiles over every round. Returns whether the case met the target.
 */
export function report(c: Case, alone: { xs: number[]; answer: string }, rounds: Round[], roundWords: string): boolean {
  const all = rounds.flatMap((r) => r.times).sort((a, b) => a - b);
  const rate = all.length / rounds.reduce((t, r) => t + r.seconds, 0);
  const { xs, answer } = alone;
  const met = pct(xs, 95) <= TARGET_MS;
  console.log(`\n${c.label} → ${answer}`);
  console.log(
    `  one at a time (${xs.length}): p50 ${pct(xs, 50).toFixed(1)} ms  p95 ${pct(xs, 95).toFixed(1)} ms  p99 ${pct(xs, 99).toFixed(1)} ms  (target p95 ≤ ${TARGET_MS} ms: ${met ? "met" : "MISSED"})`,
  );
  console.log(
    `  ${CONCURRENCY} in flight, ${rounds.length} rounds of ${roundWords}: p95 by round ${rounds.map((r) => pct(r.times, 95).toFixed(1)).join(" / ")} ms; all ${all.length}, ${rate.toFixed(0)} req/s: p50 ${pct(all, 50).toFixed(1)} ms  p95 ${pct(all, 95).toFixed(1)} ms  p99 ${pct(all, 99).toFixed(1)} ms`,
  );
  return met;
}

/**
 * The machine's speed at this moment: a fixed piece of work on one CPU (200,000 chained SHA-256
 * digests), timed. The benchmark's machine is shared, and its speed was seen to move by half from one
 * quarter of an hour to the next; this number, printed before and after the measurements, says how
 * fast the machine was while they ran, so runs can be compared.
 */
export function cpuCheck(): string {
  const t0 = performance.now();
  let h = "rosinwood";
  for (let i = 0; i < 200_000; i++) h = createHash("sha256").update(h).digest("hex");
  return `CPU check (200,000 SHA-256 digests on one CPU): ${(performance.now() - t0).toFixed(0)} ms`;
}
