import { and, asc, eq, isNull, lte, or, sql } from "drizzle-orm";
import type PgBoss from "pg-boss";
import { emailOutbox } from "@/db/schema";
import { SEND_EMAIL_QUEUE, type SendEmailJob } from "./queue";
import type { DbOrTx } from "./sql-executor";

export interface SweepOptions {
  /** Rows younger than this still have their own job (or are being retried): leave them. */
  minAgeSeconds: number;
  /** At most one sweeper job per row in each window of this length, so sweeps never pile jobs up. */
  slotSeconds: number;
  batch?: number;
}

/**
 * Queues again every outbox row still waiting: a row whose job was lost (written before any worker
 * had created the queue, or whose retries ran out while the provider was down) is sent in the end.
 * A spare job is harmless: the sender locks the row and skips it once sent.
 */
export async function sweepOutbox(db: DbOrTx, boss: PgBoss, options: SweepOptions): Promise<number> {
  const rows = await db
    .select({ id: emailOutbox.id })
    .from(emailOutbox)
    .where(
      and(
        eq(emailOutbox.status, "queued"),
        lte(emailOutbox.createdAt, sql`now() - make_interval(secs => ${options.minAgeSeconds})`),
        // A message held back until later has its own delayed job; the sweep takes it once the hold is over.
        or(isNull(emailOutbox.sendAfter), lte(emailOutbox.sendAfter, sql`now()`)),
      ),
    )
    .orderBy(asc(emailOutbox.createdAt))
    .limit(options.batch ?? 500);
  let queued = 0;
  for (const { id } of rows) {
    const data: SendEmailJob = { outboxId: id };
    const jobId = await boss.send(SEND_EMAIL_QUEUE, data, { singletonKey: id, singletonSeconds: options.slotSeconds });
    if (jobId) queued += 1;
  }
  return queued;
}
