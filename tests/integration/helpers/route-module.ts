// The module that serves /api/<file> in the tests that call route handlers directly: an App Router
// route.ts, or a Pages Router API route (pages/api/**, lib/http/pages-api.ts), whose named GET is the
// same guarded handler its default export serves.
import { existsSync } from "node:fs";
import path from "node:path";

export type Handler = (r: Request, a: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** `file` is the path under /api with its [brackets], e.g. "teach/tunes/[tuneId]" or "admin/payments/count". */
export async function routeModule(file: string): Promise<Record<string, Handler | undefined>> {
  const places = [
    path.resolve("app/api", file, "route.ts"),
    path.resolve("pages/api", `${file}.ts`),
    path.resolve("pages/api", file, "index.ts"),
  ];
  const found = places.find((p) => existsSync(p));
  if (!found) throw new Error(`no route serves /api/${file} (looked in app/api and pages/api)`);
  return (await import(/* @vite-ignore */ found)) as Record<string, Handler | undefined>;
}
