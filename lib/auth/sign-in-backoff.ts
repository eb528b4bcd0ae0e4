import { and, eq, gt, lt, sql } from "drizzle-orm";
import type { Tx as Db } from "@/db/queries/auth";
import { rateLimits } from "@/db/schema";
import { RateLimitedError } from "./errors";
import { addressKey, LIMITS } from "./rate-limit";

// Guessing one account's password is slowed, never locked (OWASP "Authentication Cheat Sheet",
// "Login Throttling"): each sign-in attempt is one rate_limits row (key, its time) for the account
// and one for the account from that client address, written before the password is checked and
// removed when it was right. Once the account has had LIMITS.signInAddress.max failures in the
// window, an address that has itself failed on it waits 1 s, 2 s, 4 s … (at most the window) after the
// account's latest failure. An address that has not failed on the account is never made to wait, so
// the owner's right password from their own device gets in while someone elsewhere is guessing; a
// guesser gets one attempt per fresh address, which per-IP limits bound.

const WINDOW_MS = LIMITS.signInAddress.windowSeconds * 1000;

export type SignInAttempt = { accountKey: string; pairKey: string; at: Date };

const pairKeyOf = (accountKey: string, ip: string) => `${accountKey}|ip:${ip}`;
/** The account's rows and its addresses' (not another account whose address merely starts alike). */
const ofAccount = (accountKey: string) =>
  sql`(${rateLimits.key} = ${accountKey} or starts_with(${rateLimits.key}, ${pairKeyOf(accountKey, "")}))`;

/** The wait, in ms, for an address that failed on an account with `failures` failures, the last at `last`. */
export function backoffMs(failures: number, last: Date, now: Date): number {
  const over = failures - LIMITS.signInAddress.max;
  if (over < 0) return 0;
  const wait = Math.min(1000 * 2 ** over, WINDOW_MS);
  return Math.max(0, last.getTime() + wait - now.getTime());
}

/**
 * Checks the back-off and records the attempt, under a lock on the account's key so that attempts
 * sent at once are counted one after the other. Throws RateLimitedError while the address must wait.
 */
export async function reserveSignInAttempt(
  db: Db,
  email: string,
  ip: string,
  now: Date = new Date(),
): Promise<SignInAttempt> {
  const accountKey = addressKey("sign-in", email);
  const pairKey = pairKeyOf(accountKey, ip);
  const since = new Date(now.getTime() - WINDOW_MS);
  await db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${accountKey}))`);
    await tx.delete(rateLimits).where(and(ofAccount(accountKey), lt(rateLimits.windowStart, since)));
    const [row] = await tx
      .select({
        failures: sql<number>`coalesce(sum(${rateLimits.count}) filter (where ${rateLimits.key} = ${accountKey}), 0)::int`,
        mine: sql<number>`coalesce(sum(${rateLimits.count}) filter (where ${rateLimits.key} = ${pairKey}), 0)::int`,
        last: sql<string | null>`max(${rateLimits.windowStart}) filter (where ${rateLimits.key} = ${accountKey})`,
      })
      .from(rateLimits)
      .where(and(sql`${rateLimits.key} in (${accountKey}, ${pairKey})`, gt(rateLimits.windowStart, since)));
    if (row.mine > 0 && row.last) {
      const wait = backoffMs(row.failures, new Date(row.last), now);
      if (wait > 0) throw new RateLimitedError(Math.ceil(wait / 1000));
    }
    for (const key of [accountKey, pairKey]) {
      await tx
        .insert(rateLimits)
        .values({ key, windowStart: now, count: 1 })
        .onConflictDoUpdate({
          target: [rateLimits.key, rateLimits.windowStart],
          set: { count: sql`${rateLimits.count} + 1` },
        });
    }
  });
  return { accountKey, pairKey, at: now };
}

/** The password was right: this attempt was no failure, and the address's own failures are forgiven. */
export async function signInSucceeded(db: Db, attempt: SignInAttempt): Promise<void> {
  await db.transaction(async (tx) => {
    const mine = and(eq(rateLimits.key, attempt.accountKey), eq(rateLimits.windowStart, attempt.at));
    await tx
      .update(rateLimits)
      .set({ count: sql`${rateLimits.count} - 1` })
      .where(mine);
    await tx.delete(rateLimits).where(and(mine, sql`${rateLimits.count} <= 0`));
    await tx.delete(rateLimits).where(eq(rateLimits.key, attempt.pairKey));
  });
}

/** Forgets every failure on the account (e.g. once its owner has proven the address again). */
export async function liftSignInBackoff(db: Db, email: string): Promise<void> {
  await db.delete(rateLimits).where(ofAccount(addressKey("sign-in", email)));
}
