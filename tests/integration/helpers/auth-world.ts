import { desc, eq, sql } from "drizzle-orm";
import type { Cookie } from "lucia";
import { createTestDatabase } from "./db";
import { emailOutbox, users } from "@/db/schema";

export const TEST_APP_URL = "http://127.0.0.1:3999";

/**
 * A throwaway database with the app's auth modules loaded against it. The environment is set
 * BEFORE the dynamic imports because db() and env() read it once and cache.
 */
export async function authWorld() {
  const t = await createTestDatabase();
  process.env.DATABASE_URL = t.url;
  process.env.APP_URL = TEST_APP_URL;
  process.env.INSECURE_COOKIES = "true";
  const { loadContext } = await import("@/lib/auth/context");
  const { lucia } = await import("@/lib/auth/lucia");
  const { hashPassword } = await import("@/lib/auth/password");
  const { closeDb } = await import("@/db/client");
  let n = 0;

  /** A person straight in the database (verified unless told otherwise). */
  async function person(
    role: "student" | "teacher" | "admin",
    o: { email?: string; name?: string; password?: string; verified?: boolean } = {},
  ) {
    n += 1;
    const rows = await t.db
      .insert(users)
      .values({
        email: o.email ?? `${role}${n}@people.example`,
        name: o.name ?? `${role[0].toUpperCase()}${role.slice(1)} ${n}`,
        role,
        passwordHash: await hashPassword(o.password ?? "spruce-and-maple-top"),
        emailVerifiedAt: o.verified === false ? null : new Date(),
      })
      .returning();
    return rows[0];
  }

  /** The Cookie header of a fresh session for that person. */
  async function cookieFor(userId: string): Promise<string> {
    const session = await lucia().createSession(userId, {});
    return `${lucia().sessionCookieName}=${session.id}`;
  }

  /** A request context as the guard builds it, plus the cookies it queued. */
  async function context(cookie?: string, ip = "192.0.2.10") {
    const headers = new Headers({ "x-forwarded-for": ip });
    if (cookie) headers.set("cookie", cookie);
    const set: Cookie[] = [];
    const ctx = await loadContext(headers, (c) => set.push(c));
    return { ctx, set };
  }

  /** Messages queued to an address, newest first (read from the outbox table, not the provider). */
  async function mailsTo(address: string) {
    return t.db
      .select()
      .from(emailOutbox)
      .where(sql`lower(${emailOutbox.toAddress}) = lower(${address})`)
      .orderBy(desc(emailOutbox.createdAt));
  }

  /** The token of the newest e-mailed link of a template to an address. */
  async function tokenMailed(address: string, template: string): Promise<string> {
    const mail = (await mailsTo(address)).find((m) => m.template === template);
    const match = JSON.stringify(mail?.payload ?? {}).match(/[?&]token=([A-Za-z0-9_-]+)/);
    if (!match) throw new Error(`no ${template} link mailed to ${address}`);
    return match[1];
  }

  async function userByEmail(email: string) {
    return (
      (
        await t.db
          .select()
          .from(users)
          .where(sql`lower(${users.email}) = lower(${email})`)
      )[0] ?? null
    );
  }

  /** A change written straight to the database. */
  async function setUser(id: string, v: Partial<typeof users.$inferInsert>) {
    await t.db.update(users).set(v).where(eq(users.id, id));
  }

  async function close() {
    await closeDb();
    await t.drop();
  }

  return { db: t.db, lucia, person, cookieFor, context, mailsTo, tokenMailed, userByEmail, setUser, close };
}

export type AuthWorld = Awaited<ReturnType<typeof authWorld>>;
