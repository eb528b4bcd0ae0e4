// lib/http/pages-api.ts: an App Router-shaped GET served as a Pages Router API route, over real HTTP.
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { afterEach, describe, expect, it, vi } from "vitest";
import type { GuardedRoute } from "@/lib/auth/guard";
import { pagesApi } from "@/lib/http/pages-api";

let server: Server | undefined;
afterEach(async () => {
  await new Promise<void>((done) => (server ? server.close(() => done()) : done()));
  server = undefined;
  vi.restoreAllMocks();
});

async function serve(GET: GuardedRoute): Promise<string> {
  server = createServer(pagesApi({ GET }));
  await new Promise<void>((done) => server!.listen(0, "127.0.0.1", done));
  return `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
}

/** Answers what it was asked: method, address, the cookie header; with a status, a header and two cookies of its own. */
const echo: GuardedRoute = async (req) => {
  const headers = new Headers({ "content-type": "application/json", "x-answer": "echo" });
  headers.append("set-cookie", "a=1; Path=/; HttpOnly");
  headers.append("set-cookie", "b=2; Path=/");
  const url = new URL(req.url);
  const body = JSON.stringify({
    method: req.method,
    path: url.pathname,
    q: url.searchParams.get("q"),
    cookie: req.headers.get("cookie"),
    host: url.host,
  });
  return new Response(body, { status: 207, headers });
};

describe("pagesApi", () => {
  it("hands GET to the route as a web Request and writes its Response: status, headers, every cookie, body", async () => {
    const base = await serve(echo);
    const res = await fetch(`${base}/api/admin/payments?q=Ivo%20Penrose&page=2`, {
      headers: { cookie: "rosinwood_session=abc" },
    });
    expect(res.status).toBe(207);
    expect(res.headers.get("x-answer")).toBe("echo");
    expect(res.headers.getSetCookie()).toEqual(["a=1; Path=/; HttpOnly", "b=2; Path=/"]);
    expect(await res.json()).toEqual({
      method: "GET",
      path: "/api/admin/payments",
      q: "Ivo Penrose",
      cookie: "rosinwood_session=abc",
      host: new URL(base).host,
    });
  });

  it("answers HEAD with GET's status and headers and no body", async () => {
    const base = await serve(echo);
    const res = await fetch(`${base}/api/x`, { method: "HEAD" });
    expect(res.status).toBe(207);
    expect(res.headers.get("x-answer")).toBe("echo");
    expect((await res.arrayBuffer()).byteLength).toBe(0);
  });

  it("refuses other methods with 405, naming the method and the allowed ones, without calling the route", async () => {
    const route = vi.fn(echo);
    const base = await serve(route);
    const res = await fetch(`${base}/api/x`, { method: "POST", body: "{}" });
    expect(res.status).toBe(405);
    expect(res.headers.get("allow")).toBe("GET, HEAD");
    expect((await res.json()).error).toBe("POST is not allowed here; use GET.");
    expect(route).not.toHaveBeenCalled();
  });

  it("answers 500 with a plain message when the route throws, and logs the error", async () => {
    const logged = vi.spyOn(console, "error").mockImplementation(() => {});
    const base = await serve(async () => {
      throw new Error("boom");
    });
    const res = await fetch(`${base}/api/x`);
    expect(res.status).toBe(500);
    expect(await res.json()).toEqual({ error: "Something went wrong on our side. Please try again." });
    expect(logged).toHaveBeenCalledWith(expect.objectContaining({ message: "boom" }));
  });
});
