import { LRUCache } from "lru-cache";
import type { DatabaseSession, DatabaseUser } from "lucia";

// Every request that carries a session cookie asks who it belongs to. This process keeps each
// answer for a few seconds (lru-cache, a well-known package, bounds the size and the age) so a
// person clicking through pages, or a table asking for its page and its total at once, costs one
// lookup rather than one per request: on this project's two-CPU benchmark machine that lookup was
// the largest piece of a request's database work left (issue 7, scripts/bench-payments.ts).
//
// What it costs, and why it is acceptable (the same trade as a cached session store with a short
// life, common practice): a change made by *another* app process — a session deleted, a role or
// "disabled" written there — is seen here within SESSION_CACHE_MS. Changes made through this
// process's own code are seen at once: signing out, "sign out everywhere" and a password reset go
// through the adapter (lib/auth/lucia.ts), which forgets the entries; a role change calls forgetUser.
export const SESSION_CACHE_MS = 5_000;

type Entry = [DatabaseSession, DatabaseUser];

let cache = make();

function make(perf?: { now(): number }) {
  return new LRUCache<string, Entry>({ max: 10_000, ttl: SESSION_CACHE_MS, ...(perf ? { perf, ttlResolution: 0 } : {}) });
}

/** A copy, so that a caller changing what it was given cannot change the cached answer. */
function copy([session, user]: Entry): Entry {
  return [{ ...session, attributes: { ...session.attributes } }, { ...user, attributes: { ...user.attributes } }];
}

export function cachedSession(sessionId: string): Entry | undefined {
  const hit = cache.get(sessionId);
  return hit && copy(hit);
}

export function rememberSession(entry: Entry): void {
  cache.set(entry[0].id, copy(entry));
}

/** A session whose expiry moved: the cached copy follows (or goes, when not cached). */
export function sessionExtended(sessionId: string, expiresAt: Date): void {
  const hit = cache.get(sessionId);
  if (hit) cache.set(sessionId, [{ ...hit[0], expiresAt }, hit[1]], { noUpdateTTL: true });
}

export function forgetSession(sessionId: string): void {
  cache.delete(sessionId);
}

/** Every cached session of one person (after their sessions were deleted, or their role changed). */
export function forgetUser(userId: string): void {
  for (const [id, [session]] of cache.entries()) if (session.userId === userId) cache.delete(id);
}

/** Tests: start empty, optionally on a clock of their own. */
export function resetSessionCache(perf?: { now(): number }): void {
  cache = make(perf);
}
