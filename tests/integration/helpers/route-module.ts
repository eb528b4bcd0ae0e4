// The module that serves /api/<file> (app/api/<file>/route.ts), for the tests that call route handlers directly.
import { existsSync } from "node:fs";
import path from "node:path";

export type Handler = (r: Request, a: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** `file` is the path under /api with its [brackets], e.g. "teach/tunes/[tuneId]" or "admin/payments/count". */
export async function routeModule(file: string): Promise<Record<string, Handler | undefined>> {
  const found = path.resolve("app/api", file, "route.ts");
  if (!existsSync(found)) throw new Error(`no route serves /api/${file} (looked for ${found})`);
  return (await import(/* @vite-ignore */ found)) as Record<string, Handler | undefined>;
}
