import { Lucia, TimeSpan, type DatabaseSession, type DatabaseUser } from "lucia";
import { DrizzlePostgreSQLAdapter } from "@lucia-auth/adapter-drizzle";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { sessions, users } from "@/db/schema";
import { env } from "@/lib/env";
import { cachedSession, rememberSession, sessionExtended } from "./session-cache";
import { forgetSessionEverywhere, forgetUserEverywhere, listenForSessionNotices } from "./session-notices";

type Role = "student" | "teacher" | "admin";

/**
 * lucia's drizzle adapter, except that the lookup made on every request reads only what a request
 * uses — the session and the person's name, address, role and "disabled" — instead of both whole rows
 * (the password hash among them), and keeps each answer for a few seconds (./session-cache.ts, which
 * says what that costs). Deleting or extending a session here updates the cache too, and a deletion is
 * announced to the other app processes (./session-notices.ts).
 */
class SessionAdapter extends DrizzlePostgreSQLAdapter {
  override async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    listenForSessionNotices();
    const hit = cachedSession(sessionId);
    if (hit) return hit;
    const [row] = await db()
      .select({
        id: sessions.id,
        userId: sessions.userId,
        expiresAt: sessions.expiresAt,
        name: users.name,
        email: users.email,
        role: users.role,
        disabled: users.disabled,
      })
      .from(sessions)
      .innerJoin(users, eq(users.id, sessions.userId))
      .where(eq(sessions.id, sessionId))
      .prepare("session_and_user")
      .execute();
    if (!row) return [null, null];
    const { id, userId, expiresAt, ...attributes } = row;
    const found: [DatabaseSession, DatabaseUser] = [
      { id, userId, expiresAt, attributes: {} },
      { id: userId, attributes },
    ];
    rememberSession(found);
    return found;
  }

  override async deleteSession(sessionId: string): Promise<void> {
    await super.deleteSession(sessionId);
    await forgetSessionEverywhere(sessionId);
  }

  override async deleteUserSessions(userId: string): Promise<void> {
    await super.deleteUserSessions(userId);
    await forgetUserEverywhere(userId);
  }

  override async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    await super.updateSessionExpiration(sessionId, expiresAt);
    sessionExtended(sessionId, expiresAt);
  }
}

function create() {
  const adapter = new SessionAdapter(db(), sessions, users);
  return new Lucia(adapter, {
    // Sliding expiry: lucia extends a session used in the second half of its 30-day life.
    sessionExpiresIn: new TimeSpan(30, "d"),
    sessionCookie: {
      name: "rosinwood_session",
      expires: false,
      attributes: { secure: env().INSECURE_COOKIES !== "true", sameSite: "lax" },
    },
    getUserAttributes: (a) => ({ name: a.name, email: a.email, role: a.role, disabled: a.disabled }),
  });
}

let instance: ReturnType<typeof create> | undefined;
export function lucia() {
  instance ??= create();
  return instance;
}

declare module "lucia" {
  interface Register {
    Lucia: ReturnType<typeof create>;
    DatabaseUserAttributes: { name: string; email: string; role: Role; disabled: boolean };
  }
}
