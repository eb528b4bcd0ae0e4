// bench-payments over HTTP (BENCH_HTTP=1): the last build served as `npm start` serves it, asked by wrk.
import { spawn, spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { Agent, request } from "node:http";
import { createServer } from "node:net";
import { availableParallelism, cpus, tmpdir } from "node:os";
import { join } from "node:path";
import {
  CONCURRENCY,
  cpuCheck,
  oneAtATime,
  report,
  ROUNDS,
  type Answer,
  type Case,
  type Round,
} from "./bench-payments-common";

const SECONDS = Number(process.env.BENCH_SECONDS ?? 8); // each wrk run

// wrk's Lua hook: after a run, its totals and every latency it recorded (microseconds, with counts).
const WRK_REPORT = `done = function(summary, latency, requests)
  io.write(string.format("requests %d\\nseconds %f\\nbad %d\\n", summary.requests, summary.duration / 1e6,
    summary.errors.status + summary.errors.connect + summary.errors.read + summary.errors.write + summary.errors.timeout))
  for i = 1, #latency do local v, c = latency(i); if c > 0 then io.write(string.format("%d %d\\n", v, c)) end end
end
`;

/** wrk (C, Debian's package `wrk`), installed the way npm test installs PostgreSQL when it is missing. */
function ensureWrk() {
  if (spawnSync("wrk", ["--version"]).error === undefined) return;
  const r = spawnSync("bash", ["-c", "source scripts/lib.sh && apt_install wrk"], { stdio: "inherit" });
  if (r.status !== 0) throw new Error("BENCH_HTTP=1 needs wrk (Debian's package wrk), and installing it failed");
}

/** One wrk run: CONCURRENCY connections for `seconds`; every latency in ms and the run's length. */
function wrk(url: string, headers: Record<string, string>, seconds: number, script: string): Round {
  const args = ["-t1", `-c${CONCURRENCY}`, `-d${seconds}s`, "--timeout", "10s", "-s", script];
  for (const [k, v] of Object.entries(headers)) args.push("-H", `${k}: ${v}`);
  const r = spawnSync("wrk", [...args, url], { encoding: "utf8", maxBuffer: 64 << 20 });
  if (r.status !== 0) throw new Error(`wrk failed: ${r.stderr}`);
  const report = r.stdout.slice(r.stdout.indexOf("requests "));
  const field = (name: string) => Number(new RegExp(`^${name} (\\S+)$`, "m").exec(report)?.[1]);
  if (field("bad") > 0)
    throw new Error(`wrk: ${field("bad")} of ${field("requests")} requests to ${url} failed or did not answer 2xx`);
  const times: number[] = [];
  for (const line of report.split("\n")) {
    const m = /^(\d+) (\d+)$/.exec(line);
    if (m) for (let i = 0; i < Number(m[2]); i++) times.push(Number(m[1]) / 1000);
  }
  return { times: times.sort((a, b) => a - b), seconds: field("seconds") };
}

/**
 * Over HTTP: the last build served as `npm start` serves it (scripts/serve.mjs), asked by wrk, a load
 * generator in C that leaves the two CPUs to the server (a node:http client took a fifth of them).
 * Each case one at a time first (node:http, also the check of every answer), then ROUNDS interleaved
 * rounds of BENCH_SECONDS per case with CONCURRENCY connections each keeping one request in flight.
 */
export async function overHttp(cases: Case[], cookie: string) {
  if (!existsSync(".next/BUILD_ID"))
    throw new Error("BENCH_HTTP=1 needs a production build: run `npx next build` (npm start and npm test make one)");
  ensureWrk();
  const port = await new Promise<number>((resolve) => {
    const s = createServer().listen(0, "127.0.0.1", () => {
      const { port: p } = s.address() as { port: number };
      s.close(() => resolve(p));
    });
  });
  const base = `http://127.0.0.1:${port}`;
  // The app as `npm start` runs it (scripts/serve.mjs: one process per CPU unless WEB_CONCURRENCY says).
  const server = spawn("node", ["scripts/serve.mjs", "-H", "127.0.0.1", "-p", String(port)], {
    env: { ...process.env, NODE_ENV: "production", APP_URL: base, INSECURE_COOKIES: "true" },
    stdio: "ignore",
    detached: true,
  });
  const dir = mkdtempSync(join(tmpdir(), "bench-wrk-"));
  try {
    const script = join(dir, "report.lua");
    writeFileSync(script, WRK_REPORT);
    for (let i = 0; ; i++) {
      if (
        (await fetch(`${base}/api/health`).then(
          (r) => r.status,
          () => 0,
        )) === 200
      )
        break;
      if (i > 150) throw new Error("next start did not answer /api/health");
      await new Promise((r) => setTimeout(r, 200));
    }
    const agent = new Agent({ keepAlive: true, maxSockets: CONCURRENCY });
    const get = (path: string, headers: Record<string, string>) =>
      new Promise<Answer>((resolve, reject) => {
        request(`${base}${path}`, { agent, headers }, (res) => {
          const chunks: Buffer[] = [];
          res.on("data", (c: Buffer) => chunks.push(c));
          res.on("end", () =>
            resolve({
              status: res.statusCode ?? 0,
              body: JSON.parse(Buffer.concat(chunks).toString("utf8")) as Answer["body"],
            }),
          );
        })
          .on("error", reject)
          .end();
      });
    const all: { c: Case; path: string; headers: Record<string, string> }[] = [
      {
        c: {
          label:
            "GET /api/health (one trivial query; an App Router route handler): HTTP through Next.js on this machine",
          path: "health",
          query: {},
        },
        path: "/api/health",
        headers: {},
      },
      ...cases.map((c) => ({ c, path: `/api/${c.path}?${new URLSearchParams(c.query)}`, headers: { cookie } })),
    ];
    // The server's code is compiled as it runs: warm every route at full concurrency before measuring.
    for (const a of all)
      await Promise.all(
        Array.from({ length: CONCURRENCY }, async () => {
          for (let i = 0; i < 20; i++) await get(a.path, a.headers);
        }),
      );
    const web = process.env.WEB_CONCURRENCY?.trim() || String(availableParallelism());
    console.log(
      `\n== over HTTP on loopback: scripts/serve.mjs (next start, ${web} web processes), asked by wrk (${CONCURRENCY} connections), on the same ${cpus().length} CPUs`,
    );
    const alone = new Map<Case, { xs: number[]; answer: string }>();
    for (const a of all) alone.set(a.c, await oneAtATime(() => get(a.path, a.headers)));
    agent.destroy();
    const rounds = new Map<Case, Round[]>(all.map((a) => [a.c, []]));
    for (let r = 0; r < ROUNDS; r++)
      for (const a of all) rounds.get(a.c)!.push(wrk(`${base}${a.path}`, a.headers, SECONDS, script));
    for (const { c } of all) report(c, alone.get(c)!, rounds.get(c)!, `${SECONDS} s`);
    console.log(`\nafter the rounds: ${cpuCheck()}`);
  } finally {
    if (server.pid) process.kill(-server.pid, "SIGTERM");
    rmSync(dir, { recursive: true, force: true });
  }
}
