import { sql } from "drizzle-orm";
import { db, listen, poolGeneration } from "@/db/client";
import { forgetSession, forgetUser, resetSessionCache } from "./session-cache";

// Each app process keeps its own session cache (./session-cache.ts), and `npm start` runs one
// process per CPU (scripts/serve.mjs). What one process changes — a session deleted, a person's
// role changed or their sessions ended — is announced to the others through PostgreSQL's
// LISTEN/NOTIFY (PostgreSQL docs: NOTIFY), and each forgets it on receipt, so signing out or a role
// change holds in every process at once, not after SESSION_CACHE_MS. A notice sent while a
// process's listening connection is down is lost: on listening again it forgets everything it
// cached, and the cache's short life bounds whatever remains.
const CHANNEL = "rosinwood_session_cache";
type Notice = { session: string } | { user: string };

const KEY = Symbol.for("rosinwood.session-notices"); // one listener per process, like the cache itself
const shared = globalThis as typeof globalThis & { [KEY]?: { pool: number; listens: number; ready: Promise<void> } };

function received(payload: string) {
  try {
    const notice = JSON.parse(payload) as Notice;
    if ("session" in notice) forgetSession(notice.session);
    else if ("user" in notice) forgetUser(notice.user);
  } catch {
    resetSessionCache(); // not one of ours: forgetting everything is always safe
  }
}

/** Starts this process's listener once (again after the pool was closed and opened anew). */
export function listenForSessionNotices(): void {
  db();
  if (shared[KEY]?.pool === poolGeneration()) return;
  const state = { pool: poolGeneration(), listens: 0, ready: Promise.resolve() };
  shared[KEY] = state;
  state.ready = listen(CHANNEL, received, () => {
    if (state.listens++ > 0) resetSessionCache(); // listening again after a lost connection
  }).catch((error: unknown) => {
    console.error("session notices: could not listen; other processes' changes reach this one within the cache's life", error);
    if (shared[KEY] === state) shared[KEY] = undefined;
  });
}

/** Tests: settles once this process listens. */
export function sessionNoticesReady(): Promise<void> {
  listenForSessionNotices();
  return shared[KEY]?.ready ?? Promise.resolve();
}

async function announce(notice: Notice): Promise<void> {
  await db().execute(sql`select pg_notify(${CHANNEL}, ${JSON.stringify(notice)})`);
}

/** A session deleted: this process forgets it now, every other on the notice. */
export async function forgetSessionEverywhere(sessionId: string): Promise<void> {
  forgetSession(sessionId);
  await announce({ session: sessionId });
}

/** A person's sessions ended or their role changed: every process forgets their cached sessions. */
export async function forgetUserEverywhere(userId: string): Promise<void> {
  forgetUser(userId);
  await announce({ user: userId });
}
