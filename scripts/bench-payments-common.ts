// What bench-payments.ts (in-process) and bench-payments-http.ts (over HTTP) share: the load's shape,
// the cases, the check of each answer and the report of each case.
import { createHash } from "node:crypto";
import { performance } from "node:perf_hooks";

export const CONCURRENCY = 20;
export const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
export const WARMUP = 40;

export type Case = { label: string; path: string; query: Record<string, string>; target?: true };
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

/** WARMUP requests one at a time (also the warm-up): their latencies, sorted, and the answer in words. */
export async function oneAtATime(call: () => Promise<Answer>): Promise<{ xs: number[]; answer: string }> {
  const xs: number[] = [];
  let answer = "";
  for (let i = 0; i < WARMUP; i++) {
    const t = performance.now();
    answer = answerWords(await call());
    xs.push(performance.now() - t);
  }
  return { xs: xs.sort((a, b) => a - b), answer };
}

/** A case's four lines: its answer, one at a time, each round's p95, and the percentiles over every round. */
export function report(c: Case, alone: { xs: number[]; answer: string }, rounds: Round[], roundWords: string): void {
  const all = rounds.flatMap((r) => r.times).sort((a, b) => a - b);
  const rate = all.length / rounds.reduce((t, r) => t + r.seconds, 0);
  const { xs, answer } = alone;
  console.log(`\n${c.label} → ${answer}`);
  console.log(`  one at a time (${WARMUP}): p50 ${pct(xs, 50).toFixed(1)} ms  p95 ${pct(xs, 95).toFixed(1)} ms`);
  console.log(
    `  ${rounds.length} rounds of ${roundWords}, ${CONCURRENCY} at once: p95 by round ${rounds.map((r) => pct(r.times, 95).toFixed(1)).join(" / ")} ms`,
  );
  console.log(
    `  all ${all.length}, ${rate.toFixed(0)} req/s: p50 ${pct(all, 50).toFixed(1)} ms  p95 ${pct(all, 95).toFixed(1)} ms  p99 ${pct(all, 99).toFixed(1)} ms${c.target ? "  (target p95 < 100 ms)" : ""}`,
  );
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
