import { db, listen, poolGeneration } from "./client";

// Each app process keeps caches of its own (the session cache, the admin search's people), and
// `npm start` runs one process per CPU (scripts/serve.mjs). A change is announced to every process
// through PostgreSQL's LISTEN/NOTIFY (PostgreSQL docs: NOTIFY) and each forgets what it cached on
// receipt. A notice sent while a process's listening connection is down is lost, so on listening
// again it forgets everything it cached.
type State = { pool: number; listens: number; ready: Promise<void> };

export type ProcessListener = {
  /** Starts this process's listener once (again after the pool was closed and opened anew). */
  start(): void;
  /** Settles once this process listens (tests). */
  ready(): Promise<void>;
  /** Whether notices reach this process now: a cache that depends on them keeps nothing otherwise. */
  listening(): boolean;
};

/**
 * One listener per channel per process. `next build` copies a module into several server bundles,
 * so the state lives on globalThis (as lib/auth/session-cache.ts explains) and the first copy's
 * `received` and `forgetAll` serve them all: both must act on globalThis-held caches.
 */
export function processListener(
  channel: string,
  received: (payload: string) => void,
  forgetAll: () => void,
): ProcessListener {
  const KEY = Symbol.for(`rosinwood.listener.${channel}`);
  const shared = globalThis as typeof globalThis & { [KEY]?: State };
  const current = () => (shared[KEY]?.pool === poolGeneration() ? shared[KEY] : undefined);
  function start() {
    db();
    if (current()) return;
    const state: State = { pool: poolGeneration(), listens: 0, ready: Promise.resolve() };
    shared[KEY] = state;
    state.ready = listen(channel, received, () => {
      if (state.listens++ > 0) forgetAll(); // listening again after a lost connection
    }).catch((error: unknown) => {
      console.error(`${channel}: could not listen for the changes other processes announce`, error);
      if (shared[KEY] === state) shared[KEY] = undefined;
    });
  }
  return {
    start,
    ready() {
      start();
      return shared[KEY]?.ready ?? Promise.resolve();
    },
    listening: () => (current()?.listens ?? 0) > 0,
  };
}
