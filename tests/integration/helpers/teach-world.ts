// Calls the teacher routes (app/api/teach/**) through their real guard, as a given person.
import { authWorld, TEST_APP_URL, type AuthWorld } from "./auth-world";
import { routeModule } from "./route-module";

export interface TeachCall {
  cookie?: string;
  params?: Record<string, string>;
  query?: string;
  /** JSON body (objects) or a raw body (strings, bytes, streams: the import's file). */
  body?: unknown;
  raw?: BodyInit;
}

/** `file` is the path under /api, e.g. "teach/tunes/[tuneId]" (tests/integration/helpers/route-module.ts finds its module). */
export async function callRoute(file: string, method: string, c: TeachCall = {}): Promise<Response> {
  const handler = (await routeModule(file))[method];
  if (!handler) throw new Error(`${method} ${file} does not exist`);
  const headers = new Headers({ origin: TEST_APP_URL });
  if (c.cookie) headers.set("cookie", c.cookie);
  let body: BodyInit | undefined = c.raw;
  if (c.body !== undefined) {
    headers.set("content-type", "application/json");
    body = JSON.stringify(c.body);
  }
  const init: RequestInit & { duplex?: "half" } = {
    method,
    headers,
    body,
    duplex: body instanceof ReadableStream ? "half" : undefined,
  };
  return handler(new Request(`${TEST_APP_URL}/api/${file}${c.query ?? ""}`, init), {
    params: Promise.resolve(c.params ?? {}),
  });
}

export async function teachWorld(): Promise<AuthWorld & { call: typeof callRoute }> {
  const w = await authWorld();
  return { ...w, call: callRoute };
}

/** Reads an NDJSON answer into its lines. */
export async function ndjsonLines<T>(res: Response): Promise<T[]> {
  return (await res.text())
    .split("\n")
    .filter((l) => l.trim())
    .map((l) => JSON.parse(l) as T);
}
