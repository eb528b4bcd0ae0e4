// HTTP for the stand-in: /v1/* as Stripe's API (Bearer key, form-encoded parameters, JSON answers with
// Stripe's error bodies), /pay/* the hosted checkout page, /_fake/* the stand-in's own controls.
import type { IncomingMessage, ServerResponse } from "node:http";
import type { Fake, Handler } from "./context";
import { payPage } from "./checkout-page";
import { StripeFakeError, badKey, unknownRoute } from "./errors";
import { Params, parseForm } from "./params";
import { newId } from "./state";
import type { JsonObject } from "./types";

export type Route = [method: string, path: RegExp, handler: Handler];
export type FakeRoute = (
  fake: Fake,
  method: string,
  path: string,
  body: string,
  query: URLSearchParams,
) => Promise<JsonObject | null>;

function readBody(req: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => resolve(Buffer.concat(chunks).toString("utf8")));
    req.on("error", reject);
  });
}

function keyOf(req: IncomingMessage): string | null {
  const h = req.headers.authorization ?? "";
  if (h.startsWith("Bearer ")) return h.slice(7).trim();
  // Stripe also takes the key as the Basic auth user name (curl -u sk_test_…:).
  if (h.startsWith("Basic ")) return Buffer.from(h.slice(6), "base64").toString("utf8").split(":")[0] ?? null;
  return null;
}

function send(res: ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}): void {
  res.writeHead(status, { "content-type": "application/json", "request-id": newId("req"), ...headers });
  res.end(JSON.stringify(body, null, 2));
}

interface Replay {
  status: number;
  body: unknown;
  at: number;
  params: string;
}

export function createHandler(fake: Fake, apiKey: string, routes: Route[], fakeRoutes: FakeRoute) {
  // Idempotency-Key (Stripe docs: "Idempotent requests"): the SDK sends one with each POST and reuses it
  // when it retries, so a retried create answers with the first result instead of making a second object.
  const replays = new Map<string, Replay>();

  async function api(
    req: IncomingMessage,
    res: ServerResponse,
    method: string,
    path: string,
    query: string,
  ): Promise<void> {
    const key = keyOf(req);
    if (key !== apiKey) throw badKey(key);
    const idem = method === "POST" ? req.headers["idempotency-key"] : undefined;
    const replayKey = typeof idem === "string" ? `${path} ${idem}` : null;
    const body = method === "POST" ? await readBody(req) : query;
    const seen = replayKey ? replays.get(replayKey) : undefined;
    if (seen && seen.params !== body) {
      throw new StripeFakeError(400, {
        type: "idempotency_error",
        message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${String(idem)}' if you meant to execute a different request.`,
      });
    }
    if (seen) return send(res, seen.status, seen.body, { "idempotent-replayed": "true" });
    for (const [m, pattern, handler] of routes) {
      const match = m === method ? pattern.exec(path) : null;
      if (!match) continue;
      let status = 200;
      let out: unknown;
      try {
        out = handler({ fake, params: new Params(parseForm(body)), ids: match.slice(1).map(decodeURIComponent) });
        if (method !== "GET") fake.store.save();
      } catch (err) {
        if (!(err instanceof StripeFakeError)) throw err;
        status = err.status;
        out = { error: err.body };
        fake.store.save();
      }
      if (replayKey) {
        replays.set(replayKey, { status, body: out, at: Date.now(), params: body });
        for (const [k, r] of replays) if (r.at < Date.now() - 86_400_000) replays.delete(k);
      }
      return send(res, status, out, { "stripe-version": String(req.headers["stripe-version"] ?? "") });
    }
    throw unknownRoute(method, path);
  }

  return async (req: IncomingMessage, res: ServerResponse): Promise<void> => {
    const url = new URL(req.url ?? "/", "http://stand-in");
    const method = req.method ?? "GET";
    try {
      if (url.pathname.startsWith("/v1/")) return await api(req, res, method, url.pathname, url.search.slice(1));
      const pay = /^\/pay\/([^/]+)$/.exec(url.pathname);
      if (pay) {
        const body = method === "POST" ? await readBody(req) : "";
        const out = payPage(fake, method, decodeURIComponent(pay[1] ?? ""), body);
        res.writeHead(
          out.status,
          out.location ? { location: out.location } : { "content-type": "text/html; charset=utf-8" },
        );
        return void res.end(out.html ?? "");
      }
      if (url.pathname.startsWith("/_fake/")) {
        const body = method === "POST" ? await readBody(req) : "";
        const out = await fakeRoutes(fake, method, url.pathname, body, url.searchParams);
        if (out) return send(res, 200, out);
      }
      throw unknownRoute(method, url.pathname);
    } catch (err) {
      if (err instanceof StripeFakeError) return send(res, err.status, { error: err.body });
      console.error(err);
      send(res, 500, { error: { type: "api_error", message: err instanceof Error ? err.message : String(err) } });
    }
  };
}
