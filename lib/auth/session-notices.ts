import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { processListener } from "@/db/notices";
import { forgetSession, forgetUser, resetSessionCache } from "./session-cache";

// Each app process keeps its own session cache (./session-cache.ts), and `npm start` runs one
// process per CPU (scripts/serve.mjs). What one process changes — a session deleted, a person's
// role changed or their sessions ended — is announced to the others through PostgreSQL's
// LISTEN/NOTIFY (db/notices.ts), and each forgets it on receipt, so signing out or a role change
// holds in every process at once, not after SESSION_CACHE_MS. A notice lost while a process's
// listening connection was down is covered by forgetting everything on listening again, and by the
// cache's short life.
const CHANNEL = "rosinwood_session_cache";
type Notice = { session: string } | { user: string };

const listener = processListener(CHANNEL, received, () => resetSessionCache());

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
export const listenForSessionNotices = (): void => listener.start();

/** Tests: settles once this process listens. */
export const sessionNoticesReady = (): Promise<void> => listener.ready();

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
