import type { Cookie } from "lucia";
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
 * The client's address for per-IP limits: the right-most X-Forwarded-For entry, i.e. the one the
 * nearest proxy appended (`next start` itself fills the header from the socket when it is absent).
 * Without a proxy in front a client can write that header itself, which is why every limit that
 * matters is also kept per address.
 */
export function clientIp(headers: Headers): string {
  const forwarded = headers.get("x-forwarded-for");
  const last = forwarded
    ?.split(",")
    .map((s) => s.trim())
    .filter(Boolean)
    .pop();
  return last || headers.get("x-real-ip") || "unknown";
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
