// One web process of scripts/serve.mjs: Next.js's own request handler (the "custom server" API, Next.js
// docs: "Custom Server"; the same router `next start` uses) behind a node:http server that appends the
// socket's address to X-Forwarded-For, as a proxy would. The app then reads the client's address from
// that list, trusting only TRUSTED_PROXIES entries before it (lib/auth/context.ts clientIp): a client
// can write the header itself, but never the entry this process appends. `next start` alone keeps a
// client's header as it came (next/dist/server/base-server.js: `x-forwarded-for ??=`).
// Usage (through serve.mjs): -p PORT -H HOST.
import { createServer } from "node:http";
import { parseArgs } from "node:util";
import { withPeer } from "./peer-address.mjs";

process.env.NODE_ENV ??= "production";
const { values } = parseArgs({
  options: { port: { type: "string", short: "p" }, hostname: { type: "string", short: "H" } },
  strict: true,
});
const port = Number(values.port ?? process.env.PORT ?? 3000);
const hostname = values.hostname ?? "0.0.0.0";

const { default: next } = await import("next");
const app = next({ dev: false, dir: process.cwd(), hostname, port });
await app.prepare();
const handle = app.getRequestHandler();

const server = createServer((req, res) => {
  req.headers["x-forwarded-for"] = withPeer(req.headers["x-forwarded-for"], req.socket.remoteAddress);
  handle(req, res).catch((error) => {
    console.error(error);
    if (!res.headersSent) res.statusCode = 500;
    res.end();
  });
});
server.listen(port, hostname, () => console.log(`serve: web process ${process.pid} ready on ${hostname}:${port}`));

// Stop taking connections, let the requests in flight finish, then leave (what `next start` does on SIGTERM).
process.on("SIGTERM", () => {
  server.close(() => app.close().finally(() => process.exit(0)));
  setTimeout(() => process.exit(0), 8_000).unref();
});
