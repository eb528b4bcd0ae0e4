// Serves a route written for the App Router — a GuardedRoute from lib/auth/guard.ts, taking a web
// Request and answering a web Response — as a Pages Router API route (pages/api/**, Next.js docs:
// "API Routes"). Used for the routes asked most often under load, the admin money tables' pages and
// counts (pages/api/admin/), because Next.js 15 spends about half as much of its own work on such a
// request as on an App Router route handler. Measured with wrk at 20 in flight against one `next
// start` process on this two-CPU machine: /api/health cost 2.0–2.1 ms of the web process's CPU a
// request as a route handler and 1.0–1.2 ms as an API route answering the same JSON; the payments
// page with a 200-person search cost 3.5–4.8 ms and 2.8–3.2 ms, with a byte-identical body. The
// guard, the validation and the query are the same code either way, and the authorization matrix
// calls the same GET as before.
// Written here rather than taken from a package: this is the few lines of glue between Next.js's
// two request shapes, and no package does just that.
import type { IncomingHttpHeaders, IncomingMessage, ServerResponse } from "node:http";
import { UNEXPECTED_FAILURE } from "@/lib/auth/errors";
import type { GuardedRoute } from "@/lib/auth/guard";

type Methods = { GET: GuardedRoute };

function headersOf(incoming: IncomingHttpHeaders): Headers {
  const headers = new Headers();
  for (const [name, value] of Object.entries(incoming)) {
    if (value === undefined) continue;
    if (Array.isArray(value)) for (const v of value) headers.append(name, v);
    else headers.set(name, value);
  }
  return headers;
}

function answerJson(res: ServerResponse, status: number, body: unknown, extra: Record<string, string> = {}) {
  res.writeHead(status, { "content-type": "application/json", "cache-control": "no-store", ...extra });
  res.end(JSON.stringify(body));
}

/** The API route's default export: GET (and HEAD, answered by GET without its body); any other method is a 405. */
export function pagesApi(methods: Methods) {
  return async (req: IncomingMessage, res: ServerResponse): Promise<void> => {
    const method = req.method ?? "GET";
    if (method !== "GET" && method !== "HEAD") {
      answerJson(res, 405, { error: `${method} is not allowed here; use GET.` }, { allow: "GET, HEAD" });
      return;
    }
    try {
      // The address as the client asked it (as Next.js builds a route handler's request.url).
      const url = new URL(req.url ?? "/", `http://${req.headers.host ?? "localhost"}`);
      const answer = await methods.GET(new Request(url, { method, headers: headersOf(req.headers) }), {
        params: Promise.resolve({}),
      });
      const body = Buffer.from(await answer.arrayBuffer());
      res.statusCode = answer.status;
      for (const [name, value] of answer.headers) if (name !== "set-cookie") res.setHeader(name, value);
      const cookies = answer.headers.getSetCookie();
      if (cookies.length > 0) res.setHeader("set-cookie", cookies);
      res.end(method === "HEAD" ? undefined : body);
    } catch (error) {
      // guardRoute answers its own failures; this is for one that escapes it (a bug), never a hung request.
      console.error(error);
      if (!res.headersSent) answerJson(res, 500, { error: UNEXPECTED_FAILURE });
      else res.destroy();
    }
  };
}
