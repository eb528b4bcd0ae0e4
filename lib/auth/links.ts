import { env } from "@/lib/env";

/** An absolute address in the app, for e-mailed links. */
export function appLink(path: string, query: Record<string, string> = {}): string {
  const url = new URL(path, env().APP_URL);
  for (const [k, v] of Object.entries(query)) url.searchParams.set(k, v);
  return url.toString();
}

/**
 * A return address after sign-in, only when it stays on this site: a path starting with one "/"
 * (not "//" or "/\", which browsers read as another host). Anything else is an open redirect.
 */
export function safeNext(next: string | undefined | null): string | null {
  if (!next || !next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) return null;
  return next;
}
