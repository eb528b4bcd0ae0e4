// The local Resend stand-in. It speaks only the subset of Resend's HTTP API that the `resend` SDK 6.38
// uses for sending (checked in node_modules/resend/dist/index.mjs): `POST {baseUrl}/emails` with a JSON
// body (from, to, subject, html, text), `Authorization: Bearer <key>` and an optional `Idempotency-Key`
// header; success is `{ id }`, an error is `{ statusCode, name, message }` (Resend API reference, "Errors").
// Beside that, /_fake/* lets the app's /dev/mail page and the tests read messages and set a failure rate.
//
// Run: `tsx scripts/fakes/resend.ts` with RESEND_FAKE_PORT (0 = any free port), RESEND_FAKE_FAIL_RATE
// (0..1), RESEND_FAKE_STORE (a JSON-lines file, optional) and RESEND_API_KEY (when set, the only key accepted).
import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import { pathToFileURL } from "node:url";
import { FakeEmailStore, type FakeEmail } from "./resend-store";
import { validateEmail } from "./resend-validate";

export type { FakeEmail };

export interface ResendFakeOptions {
  port?: number;
  host?: string;
  /** Share of `POST /emails` requests answered with a 500, decided before anything is stored. */
  failRate?: number;
  /** When set, only this key is accepted (403 otherwise); when not, any bearer key is. */
  apiKey?: string;
  storeFile?: string;
}

/** One `POST /emails` as received, successful or not, so tests can see retries and their timing. */
export interface FakeRequest {
  at: number;
  idempotencyKey: string | null;
  status: number;
}

export interface ResendFake {
  url: string;
  port: number;
  emails: () => FakeEmail[];
  requests: () => FakeRequest[];
  setFailRate: (rate: number) => void;
  close: () => Promise<void>;
}

const MAX_BODY = 2 * 1024 * 1024;

export async function startResendFake(options: ResendFakeOptions = {}): Promise<ResendFake> {
  const store = new FakeEmailStore(options.storeFile);
  const requests: FakeRequest[] = [];
  let failRate = checkRate(options.failRate ?? 0);

  async function sendEmail(req: IncomingMessage, res: ServerResponse, raw: string): Promise<void> {
    const key = header(req, "idempotency-key");
    const answer = (status: number, body: unknown) => {
      requests.push({ at: Date.now(), idempotencyKey: key, status });
      json(res, status, body);
    };
    const bearer = /^Bearer\s+(\S+)\s*$/i.exec(header(req, "authorization") ?? "")?.[1];
    if (!bearer) return answer(401, error(401, "missing_api_key", "Missing API key in the authorization header."));
    if (options.apiKey && bearer !== options.apiKey)
      return answer(403, error(403, "invalid_api_key", "API key is invalid."));
    if (key !== null && (key.length < 1 || key.length > 256)) {
      return answer(400, error(400, "invalid_idempotency_key", "The key must be between 1-256 chars."));
    }
    if (Math.random() < failRate) {
      return answer(
        500,
        error(500, "internal_server_error", "An unexpected error occurred (the stand-in failed on purpose)."),
      );
    }
    let body: unknown;
    try {
      body = JSON.parse(raw);
    } catch {
      return answer(400, error(400, "validation_error", "The body is not valid JSON."));
    }
    const checked = validateEmail(body);
    if (!checked.ok) return answer(422, error(422, checked.name, checked.message));
    const result = store.store(checked.email, key, raw);
    if (result.kind === "conflict") {
      return answer(
        409,
        error(409, "invalid_idempotent_request", "Same idempotency key used with a different request payload."),
      );
    }
    return answer(200, { id: result.email.id });
  }

  function fakeRoutes(req: IncomingMessage, res: ServerResponse, path: string, raw: string): void {
    if (req.method === "GET" && path === "/_fake/emails") return json(res, 200, { object: "list", data: store.list() });
    if (req.method === "DELETE" && path === "/_fake/emails") return (store.clear(), json(res, 200, { deleted: true }));
    const one = /^\/_fake\/emails\/([\w-]+)$/.exec(path);
    if (req.method === "GET" && one?.[1]) {
      const email = store.get(one[1]);
      return email ? json(res, 200, email) : json(res, 404, error(404, "not_found", "Email not found"));
    }
    if (path === "/_fake/settings" && req.method === "GET") return json(res, 200, { failRate });
    if (path === "/_fake/settings" && req.method === "POST") {
      try {
        failRate = checkRate((JSON.parse(raw) as { failRate?: unknown }).failRate);
        return json(res, 200, { failRate });
      } catch (e) {
        return json(res, 400, error(400, "validation_error", e instanceof Error ? e.message : "bad settings"));
      }
    }
    json(res, 404, error(404, "not_found", `The stand-in does not serve ${req.method} ${path}.`));
  }

  const server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on("data", (chunk: Buffer) => {
      size += chunk.length;
      if (size <= MAX_BODY) chunks.push(chunk);
    });
    req.on("end", () => {
      if (size > MAX_BODY) return json(res, 413, error(413, "validation_error", "The body is too large."));
      const raw = Buffer.concat(chunks).toString("utf8");
      const path = new URL(req.url ?? "/", "http://fake").pathname;
      if (req.method === "POST" && path === "/emails") {
        sendEmail(req, res, raw).catch((e: unknown) => json(res, 500, error(500, "application_error", String(e))));
      } else fakeRoutes(req, res, path, raw);
    });
  });

  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port ?? 0, options.host ?? "127.0.0.1", () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://${options.host ?? "127.0.0.1"}:${port}`,
    port,
    emails: () => store.list(),
    requests: () => [...requests],
    setFailRate: (rate) => {
      failRate = checkRate(rate);
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

function checkRate(value: unknown): number {
  const rate = Number(value);
  if (!Number.isFinite(rate) || rate < 0 || rate > 1)
    throw new Error(`the failure rate must be a number from 0 to 1, not ${String(value)}`);
  return rate;
}

function header(req: IncomingMessage, name: string): string | null {
  const value = req.headers[name];
  return typeof value === "string" ? value : null;
}

function error(statusCode: number, name: string, message: string) {
  return { statusCode, name, message };
}

function json(res: ServerResponse, status: number, body: unknown): void {
  res.writeHead(status, { "content-type": "application/json" });
  res.end(JSON.stringify(body));
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const fake = await startResendFake({
    port: Number(process.env.RESEND_FAKE_PORT ?? 0),
    failRate: Number(process.env.RESEND_FAKE_FAIL_RATE ?? 0),
    apiKey: process.env.RESEND_API_KEY || undefined,
    storeFile: process.env.RESEND_FAKE_STORE || undefined,
  });
  console.log(`[resend stand-in] listening on ${fake.url}`);
  const stop = () => void fake.close().then(() => process.exit(0));
  process.on("SIGTERM", stop);
  process.on("SIGINT", stop);
}
