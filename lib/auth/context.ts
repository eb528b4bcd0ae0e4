import type { Cookie } from "lucia";
import { env } from "@/lib/env";
import { lucia } from "./lucia";
import type { CurrentUser } from "./current-user";

/** Who is asking and from where; built from request headers so tests can supply their own. */
export type RequestContext = {
  user: CurrentUser | null;
  sessionId: string | null;
  ip: string;
  /** Queue a cookie on the answer (a refreshed or new session, or a blank one to sign out). */
  setCookie: (cookie: Cookie) => void;
};

/**
 * The client's address for per-IP limits. scripts/serve-worker.mjs appends the socket's address to
 * X-Forwarded-For, and each of `trusted` proxies in front appended the address it was reached from, so
 * the client is the entry `trusted` places before the last; entries further left are the client's own
 * words and never used. Without the serve script's entry (`next dev`) the last entry is taken.
 */
export function clientIp(headers: Headers, trusted: number = env().TRUSTED_PROXIES): string {
  const chain = (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean);
  return chain[Math.max(0, chain.length - 1 - trusted)] ?? "unknown";
}

export async function loadContext(headers: Headers, setCookie: (cookie: Cookie) => void): Promise<RequestContext> {
  const ip = clientIp(headers);
  const sessionId = lucia().readSessionCookie(headers.get("cookie") ?? "");
  if (!sessionId) return { user: null, sessionId: null, ip, setCookie };
  const { session, user } = await lucia().validateSession(sessionId);
  // Sliding expiry: lucia marks a session "fresh" when it extended it, and the cookie must follow.
  if (session?.fresh) setCookie(lucia().createSessionCookie(session.id));
  if (!session) setCookie(lucia().createBlankSessionCookie());
  if (!session || !user || user.disabled) return { user: null, sessionId: null, ip, setCookie };
  return {
    user: { id: user.id, name: user.name, email: user.email, role: user.role },
    sessionId: session.id,
    ip,
    setCookie,
  };
}

/** Starts a session for a person and queues its cookie. */
export async function startSession(ctx: RequestContext, userId: string): Promise<void> {
  const session = await lucia().createSession(userId, {});
  ctx.setCookie(lucia().createSessionCookie(session.id));
}
