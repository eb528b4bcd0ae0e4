// Runs the built app: Next.js's server in one worker process per CPU (WEB_CONCURRENCY to choose), all on
// one port. Next.js serves every request of a process on its one JavaScript thread, so one process
// uses one CPU at most; on the two-CPU machine bench-payments runs on, a second process raised the
// admin payments page from ~230 to ~330 requests a second at 20 in flight (scripts/bench-payments.ts).
// node:cluster shares the listening socket between the workers (Node.js docs: "Cluster"). The app
// keeps no state of its own in a process — sessions, rate limits, jobs and e-mail live in PostgreSQL
// and the build is the same for every worker — so any worker may answer any request.
// Each worker is scripts/serve-worker.mjs: Next.js's request handler behind a server that adds the socket's
// address to X-Forwarded-For, so a client cannot choose the address per-IP limits see.
// Usage: node scripts/serve.mjs -p PORT -H HOST (the arguments go to serve-worker.mjs).
import cluster from "node:cluster";
import { availableParallelism } from "node:os";
import { fileURLToPath } from "node:url";

const asked = process.env.WEB_CONCURRENCY?.trim();
const workers = asked ? Number(asked) : availableParallelism();
if (!Number.isInteger(workers) || workers < 1 || workers > 64) {
  console.error(`WEB_CONCURRENCY must be a whole number of web processes from 1 to 64 (it is "${asked}")`);
  process.exit(1);
}

cluster.setupPrimary({
  exec: fileURLToPath(new URL("./serve-worker.mjs", import.meta.url)),
  args: process.argv.slice(2),
});

const STEADY_MS = 15_000; // a worker that stops sooner than this after starting is not restarted
const startedAt = new Map();
let stopping = false;
let exitCode = 0;

function fork() {
  const worker = cluster.fork();
  startedAt.set(worker.id, Date.now());
}

function stop(code) {
  if (stopping) return;
  stopping = true;
  exitCode = code;
  for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill("SIGTERM");
  setTimeout(() => process.exit(exitCode), 10_000).unref();
}

cluster.on("exit", (worker, code, signal) => {
  if (stopping) {
    if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(exitCode);
    return;
  }
  const lived = Date.now() - (startedAt.get(worker.id) ?? 0);
  const how = signal ? `signal ${signal}` : `exit code ${code}`;
  if (lived < STEADY_MS) {
    // A setting missing or the build broken: every new worker would stop the same way.
    console.error(`serve: a web process stopped (${how}) ${lived} ms after starting; stopping them all`);
    stop(1);
    return;
  }
  console.error(`serve: web process ${worker.process.pid} stopped (${how}); starting another`);
  fork();
});

process.on("SIGTERM", () => stop(0));
process.on("SIGINT", () => stop(0));
console.log(`serve: ${workers} web process${workers === 1 ? "" : "es"}`);
for (let i = 0; i < workers; i++) fork();
