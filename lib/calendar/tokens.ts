// The private calendar address: /api/calendar/<token>. The token is the whole credential (a calendar
// program sends no cookie), so it is long and random; rotating it revokes the old address at once.
// Stored as is, not hashed, because the settings page shows the address again.
import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { users } from "@/db/schema";
import { env } from "@/lib/env";

/** 32 random bytes, base64url (RFC 4648 §5): 43 characters, safe in a path without escaping. */
export function newCalendarToken(): string {
  return randomBytes(32).toString("base64url");
}

export function feedAddress(token: string, appUrl = env().APP_URL): string {
  return new URL(`/api/calendar/${token}`, appUrl).toString();
}

/** Creates or replaces the person's token; the old address stops answering in the same statement. */
export async function rotateCalendarToken(db: Db, userId: string): Promise<string> {
  const token = newCalendarToken();
  await db.update(users).set({ calendarToken: token }).where(eq(users.id, userId));
  return token;
}

export async function revokeCalendarToken(db: Db, userId: string): Promise<void> {
  await db.update(users).set({ calendarToken: null }).where(eq(users.id, userId));
}

export async function currentCalendarToken(db: Db, userId: string): Promise<string | null> {
  const [row] = await db.select({ token: users.calendarToken }).from(users).where(eq(users.id, userId));
  return row?.token ?? null;
}

/** Tokens are exactly what newCalendarToken makes; anything else is not looked up at all. */
export function isWellFormedToken(token: string): boolean {
  return /^[A-Za-z0-9_-]{43}$/.test(token);
}
