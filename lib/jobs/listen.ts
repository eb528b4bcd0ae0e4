// The listening aid as a job (lib/listen): a check-in with a recording is heard against its stage on
// the worker, and the result kept with the check-in. Nothing here can hold up a check-in: the job is
// queued after the check-in is saved, a lost job is queued again by the sweep, and a recording that
// cannot be heard is kept as a failure with its reason (the teacher just listens).
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import PgBoss from "pg-boss";
import { db as appDb } from "@/db/client";
import { checkInToHear, saveListening, unheardCheckIns } from "@/db/queries/listening";
import { listenTo, UnreadableAudio, UnreadableTune } from "@/lib/listen";
import { readObject } from "@/lib/storage/s3";
import { assignmentStages } from "@/lib/teaching/teach-stages";
import { pgBossExecutor, type DbOrTx } from "./sql-executor";

export const LISTEN_QUEUE = "listen-check-in";

export interface ListenJob {
  checkInId: string;
}

// Callers only insert jobs (see ./queue.ts): this handle has no connection of its own.
const producer = new PgBoss({
  db: {
    executeSql: () => Promise.reject(new Error("the job producer has no connection of its own: pass { db }")),
  },
});

/** Queues the hearing of a check-in's recording; the job id, or null when the queue does not exist yet. */
export async function scheduleListening(checkInId: string, db: DbOrTx = appDb()): Promise<string | null> {
  const data: ListenJob = { checkInId };
  return producer.send(LISTEN_QUEUE, data, { db: pgBossExecutor(db) });
}

/**
 * Queues it after the check-in was saved, never failing the caller: when the queue is not there (no
 * worker has started yet) or the database refuses, the worker's sweep finds the check-in later.
 */
export async function scheduleListeningSafely(
  checkInId: string,
  db: DbOrTx = appDb(),
  log: (line: string) => void = console.error,
): Promise<void> {
  try {
    await scheduleListening(checkInId, db);
  } catch (error) {
    const why = error instanceof Error && error.cause instanceof Error ? error.cause.message : String(error);
    log(`listening aid: check-in ${checkInId} not queued now (${why.split("\n")[0]}); the worker's sweep will`);
  }
}

export type Heard = "done" | "failed" | "nothing to hear";

/**
 * Hears one check-in's recording. A recording or stage that cannot be read is kept as a failure; any
 * other error (storage unreachable, ffmpeg missing) is thrown for the queue to retry, unless `final`.
 */
export async function hearCheckIn(db: DbOrTx, checkInId: string, final = true): Promise<Heard> {
  const row = await checkInToHear(db, checkInId);
  if (!row || !row.storageKey || row.uploadStatus !== "stored") return "nothing to hear";
  const stage = (await assignmentStages(db, row.tuneId, row.stagePlan)).find((s) => s.index === row.stageIndex);
  if (!stage) {
    await saveListening(db, { checkInId, status: "failed", error: `The assignment has no stage ${row.stageIndex}.` });
    return "failed";
  }
  const dir = await mkdtemp(path.join(tmpdir(), "rosinwood-listen-"));
  try {
    // a file, not a pipe: ffmpeg must seek in some containers (an m4a's index can sit at its end)
    const file = path.join(dir, "recording");
    await writeFile(file, await readObject(row.storageKey));
    const result = await listenTo(stage.abc, file);
    await saveListening(db, { checkInId, status: "done", result: { ...result } });
    return "done";
  } catch (error) {
    const known = error instanceof UnreadableAudio || error instanceof UnreadableTune;
    if (!known && !final) throw error;
    const message = known ? error.message : "The recording could not be heard this time.";
    await saveListening(db, { checkInId, status: "failed", error: message });
    return "failed";
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** Queues every recent check-in whose recording was never heard (its job lost, or made before a worker ran). */
export async function sweepUnheard(db: DbOrTx, boss: PgBoss, minAgeSeconds: number): Promise<number> {
  const ids = await unheardCheckIns(db, { minAgeSeconds, maxAgeSeconds: 14 * 86_400, limit: 200 });
  let queued = 0;
  for (const checkInId of ids) {
    const data: ListenJob = { checkInId };
    // one job per check-in per sweep window: sweeps never pile jobs up behind a slow analysis
    if (await boss.send(LISTEN_QUEUE, data, { singletonKey: checkInId, singletonSeconds: 600 })) queued++;
  }
  return queued;
}
