import { and, eq, lt, sql } from "drizzle-orm";
import type { Tx as Db } from "@/db/queries/auth";
import { rateLimits } from "@/db/schema";
import { RateLimitedError } from "./errors";

// Fixed-window counters in PostgreSQL so that every app instance shares them (issue 4 §6).
// One atomic upsert per hit: no read-then-write race between instances.

export type Limit = { max: number; windowSeconds: number };

export const LIMITS = {
  // Failures on one account before an address that failed on it must back off (./sign-in-backoff.ts).
  signInAddress: { max: 5, windowSeconds: 15 * 60 },
  signInIp: { max: 100, windowSeconds: 15 * 60 },
  signUpAddress: { max: 5, windowSeconds: 60 * 60 },
  signUpIp: { max: 30, windowSeconds: 60 * 60 },
  resetAddress: { max: 5, windowSeconds: 60 * 60 },
  resetIp: { max: 30, windowSeconds: 60 * 60 },
  invite: { max: 200, windowSeconds: 60 * 60 },
} satisfies Record<string, Limit>;

/** Counts one attempt under `key`; throws RateLimitedError (429, "try again in N minutes") past the limit. */
export async function hit(db: Db, key: string, limit: Limit, now: Date = new Date()): Promise<void> {
  const windowMs = limit.windowSeconds * 1000;
  const windowStart = new Date(Math.floor(now.getTime() / windowMs) * windowMs);
  const rows = await db
    .insert(rateLimits)
    .values({ key, windowStart, count: 1 })
    .onConflictDoUpdate({
      target: [rateLimits.key, rateLimits.windowStart],
      set: { count: sql`${rateLimits.count} + 1` },
    })
    .returning({ count: rateLimits.count });
  if (rows[0].count === 1) {
    // First hit of a new window: the key's older windows are spent, so tidy them here.
    await db.delete(rateLimits).where(and(eq(rateLimits.key, key), lt(rateLimits.windowStart, windowStart)));
  }
  if (rows[0].count > limit.max) {
    throw new RateLimitedError(Math.ceil((windowStart.getTime() + windowMs - now.getTime()) / 1000));
  }
}

/** Several limits for one attempt (per address and per IP); every counter moves even when one trips. */
export async function hitAll(db: Db, checks: Array<[string, Limit]>, now?: Date): Promise<void> {
  const results = await Promise.allSettled(checks.map(([key, limit]) => hit(db, key, limit, now)));
  const limited = results.flatMap((r) => (r.status === "rejected" ? [r.reason as unknown] : []));
  const worst = limited
    .filter((e): e is RateLimitedError => e instanceof RateLimitedError)
    .sort((a, b) => b.retryAfterSeconds - a.retryAfterSeconds)[0];
  if (worst) throw worst;
  if (limited.length) throw limited[0];
}

export const addressKey = (scope: string, email: string) => `${scope}:address:${email.trim().toLowerCase()}`;
export const ipKey = (scope: string, ip: string) => `${scope}:ip:${ip}`;
