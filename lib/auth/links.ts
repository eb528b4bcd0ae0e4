import { env } from "@/lib/env";

/** An absolute address in the app, for e-mailed links. */
export function appLink(path: string, query: Record<string, string> = {}): string {
  const url = new URL(path, env().APP_URL);
  for (const [k, v] of Object.entries(query)) url.searchParams.set(k, v);
  return url.toString();
}

const NEXT_MAX = 2000;
// C0 controls and DEL: browsers strip tab and newline from addresses (WHATWG URL Standard, "basic URL
// parser"), so "/<tab>/host" becomes "//host"; a backslash is read as "/" in http(s) addresses.
const UNSAFE = /[\u0000-\u001f\u007f\\]/;

function decoded(s: string): string | null {
  try {
    return decodeURIComponent(s);
  } catch {
    return null;
  }
}

/**
 * A return address after sign-in, only when it stays on this site (OWASP "Unvalidated Redirects and
 * Forwards Cheat Sheet"): a path with a single leading "/", no control character or backslash, also
 * once percent-decoded, that resolves against APP_URL to APP_URL's own origin. Anything else is null,
 * and the caller falls back to the person's home. The answer is the resolved path (normalised).
 */
export function safeNext(next: string | undefined | null, base: string = env().APP_URL): string | null {
  if (!next || next.length > NEXT_MAX || !next.startsWith("/") || next.startsWith("//")) return null;
  const plain = decoded(next);
  if (plain === null || UNSAFE.test(next) || UNSAFE.test(plain) || plain.startsWith("//")) return null;
  let url: URL;
  try {
    url = new URL(next, base);
  } catch {
    return null;
  }
  // "/.//host" normalises to the path "//host", which a browser would read as another host.
  if (url.origin !== new URL(base).origin || url.pathname.startsWith("//") || url.username || url.password) {
    return null;
  }
  const path = url.pathname + url.search + url.hash;
  return decoded(path)?.startsWith("//") ? null : path;
}
