import { cache } from "react";
import { cookies } from "next/headers";
import { lucia } from "./lucia";

export type CurrentUser = { id: string; name: string; email: string; role: "student" | "teacher" | "admin" };

/** The signed-in person for this request, or null; refreshes the cookie when lucia slides the expiry. */
export const getCurrentUser = cache(async (): Promise<CurrentUser | null> => {
  const jar = await cookies();
  const sessionId = jar.get(lucia().sessionCookieName)?.value ?? null;
  if (!sessionId) return null;
  const { session, user } = await lucia().validateSession(sessionId);
  try {
    // Setting cookies is only allowed in actions and route handlers; in a page render it throws, which is fine.
    if (session?.fresh) {
      const c = lucia().createSessionCookie(session.id);
      jar.set(c.name, c.value, c.attributes);
    }
    if (!session) {
      const c = lucia().createBlankSessionCookie();
      jar.set(c.name, c.value, c.attributes);
    }
  } catch {
    /* rendering a server component */
  }
  if (!user || user.disabled) return null;
  return { id: user.id, name: user.name, email: user.email, role: user.role };
});
