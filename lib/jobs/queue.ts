import PgBoss from "pg-boss";
import { db as appDb } from "@/db/client";
import { pgBossExecutor, type DbOrTx } from "./sql-executor";

export const SEND_EMAIL_QUEUE = "send-email";

export interface SendEmailJob {
  outboxId: string;
}

/**
 * Callers only insert jobs, so they need no pool and no start(): every send goes through the
 * `db` option, on the caller's connection or transaction. This handle refuses any other use.
 */
const producer = new PgBoss({
  db: {
    executeSql: () => Promise.reject(new Error("the job producer has no connection of its own: pass { db }")),
  },
});

/**
 * Queues the sending of one outbox row. Retry and back-off settings come from the queue (set by the
 * worker), so a job inserted here follows whatever policy the running worker declared.
 * Returns the job id, or null when the queue does not exist yet (no worker has started): the
 * worker's sweeper then picks the row up.
 */
export async function scheduleEmail(outboxId: string, db: DbOrTx = appDb(), sendAfter?: Date): Promise<string | null> {
  const data: SendEmailJob = { outboxId };
  return producer.send(SEND_EMAIL_QUEUE, data, {
    db: pgBossExecutor(db),
    ...(sendAfter ? { startAfter: sendAfter } : {}),
  });
}
