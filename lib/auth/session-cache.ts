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

function make(perf?: { now(): number }) {
  return new LRUCache<string, Entry>({
    max: 10_000,
    ttl: SESSION_CACHE_MS,
    ...(perf ? { perf, ttlResolution: 0 } : {}),
  });
}

// One cache for the whole process. `next build` copies this module into several server bundles
// (route handlers, pages and server actions each get one: `.next/server/chunks` held ten copies),
// and a module-level variable would give each its own cache — a role change made by a server action
// would then not be forgotten by the pages' copy. A key on globalThis is shared by every copy.
const KEY = Symbol.for("rosinwood.session-cache");
const shared = globalThis as typeof globalThis & { [KEY]?: LRUCache<string, Entry> };
const store = () => (shared[KEY] ??= make());

/** A copy, so that a caller changing what it was given cannot change the cached answer. */
function copy([session, user]: Entry): Entry {
  return [
    { ...session, attributes: { ...session.attributes } },
    { ...user, attributes: { ...user.attributes } },
  ];
}

export function cachedSession(sessionId: string): Entry | undefined {
  const hit = store().get(sessionId);
  return hit && copy(hit);
}

export function rememberSession(entry: Entry): void {
  store().set(entry[0].id, copy(entry));
}

/** A session whose expiry moved: a cached copy follows (keeping its age). */
export function sessionExtended(sessionId: string, expiresAt: Date): void {
  const hit = store().get(sessionId);
  if (hit) store().set(sessionId, [{ ...hit[0], expiresAt }, hit[1]], { noUpdateTTL: true });
}

export function forgetSession(sessionId: string): void {
  store().delete(sessionId);
}

/** Every cached session of one person (after their sessions were deleted, or their role changed). */
export function forgetUser(userId: string): void {
  const cache = store();
  for (const [id, [session]] of cache.entries()) if (session.userId === userId) cache.delete(id);
}

/** Tests: start empty, optionally on a clock of their own. */
export function resetSessionCache(perf?: { now(): number }): void {
  shared[KEY] = make(perf);
}
