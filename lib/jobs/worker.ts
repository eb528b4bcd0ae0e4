import PgBoss from "pg-boss";
import { connect } from "@/db/client";
import { env } from "@/lib/env";
import { mailerFromEnv, sendOutboxEmail, type Mailer } from "@/lib/mail/send";
import { SEND_EMAIL_QUEUE, type SendEmailJob } from "./queue";
import { sweepOutbox } from "./sweeper";
import { sendDueReminders } from "./reminders";
import { sendNewMemberDigests } from "./new-members";
import { cleanAbandonedUploads } from "@/lib/storage/cleanup";
import { storageConfigured } from "@/lib/storage/s3";
import { hearCheckIn, LISTEN_QUEUE, sweepUnheard, type ListenJob } from "./listen";
import { repairRefunds } from "@/lib/billing/refund-repair";
import { stripe } from "@/lib/billing/stripe";

export interface RetryPolicy {
  /** Retries after the first attempt. */
  limit: number;
  /** With back-off, pg-boss waits between delay·2^n and delay·2^(n+1) seconds before retry n+1. */
  delaySeconds: number;
  backoff: boolean;
}

export interface WorkerOptions {
  databaseUrl?: string;
  mailer?: Mailer;
  /** How many e-mails are sent at the same time. */
  concurrency?: number;
  pollingIntervalSeconds?: number;
  retry?: RetryPolicy;
  sweep?: { intervalSeconds: number; minAgeSeconds: number };
  log?: (line: string) => void;
  /** Due-date reminders (lib/jobs/reminders.ts): how often to look; they are checked once at start too. */
  reminders?: { intervalSeconds: number };
  /** Teachers' daily new-members e-mail (lib/jobs/new-members.ts): how often to look; once at start too. */
  digests?: { intervalSeconds: number };
  /** Abandoned uploads (lib/storage/cleanup.ts): how often to look; once at start too. */
  uploads?: { intervalSeconds: number };
  /** The listening aid (lib/jobs/listen.ts): how often check-ins never heard are queued again, and how old they must be. */
  listening?: { intervalSeconds: number; minAgeSeconds: number };
  /** Refunds Stripe made but the app did not record (lib/billing/refund-repair.ts): how often to look. */
  refunds?: { intervalSeconds: number };
  /** The time reminders are judged at; tests pass a clock they can move. */
  clock?: () => Date;
}

export interface RunningWorker {
  stop: () => Promise<void>;
  /** One sweep now, whatever the rows' age; returns how many rows were queued again. */
  sweepNow: () => Promise<number>;
  /** One clean-up of abandoned uploads now, at the worker's clock; returns how many were deleted. */
  cleanUploadsNow: () => Promise<number>;
  /** One sweep of check-ins never heard now, whatever their age; returns how many were queued. */
  sweepUnheardNow: () => Promise<number>;
  /** One refund repair pass now, at the worker's clock. */
  repairRefundsNow: () => Promise<{ recorded: number; failed: number }>;
  /** One reminder pass now, at the worker's clock; returns the dedupe keys it queued. */
  remindNow: () => Promise<string[]>;
  /** One pass of the teachers' daily new-members e-mail now, at the worker's clock; returns the keys queued. */
  digestNow: () => Promise<string[]>;
}

// 5 s doubling ten times: the last retry comes one to three hours after the first try, long enough
// to ride out a provider outage; after that the sweeper keeps trying every quarter hour.
export const DEFAULT_RETRY: RetryPolicy = { limit: 10, delaySeconds: 5, backoff: true };
const DEFAULT_SWEEP = { intervalSeconds: 60, minAgeSeconds: 900 };

let current: RunningWorker | undefined;

export async function startWorker(options: WorkerOptions = {}): Promise<RunningWorker> {
  if (current) throw new Error("the worker is already running in this process");
  const log = options.log ?? ((line: string) => console.log(`[worker] ${line}`));
  const url = options.databaseUrl ?? env().DATABASE_URL;
  const mailer = options.mailer ?? mailerFromEnv();
  const retry = options.retry ?? DEFAULT_RETRY;
  const sweep = options.sweep ?? DEFAULT_SWEEP;
  const concurrency = options.concurrency ?? 4;

  const boss = new PgBoss({
    connectionString: url,
    max: concurrency + 2,
    schedule: false,
    application_name: "rosinwood-worker",
  });
  boss.on("error", (error) => log(`queue error: ${error.message}`));
  await boss.start(); // creates or migrates pg-boss's own schema ("pgboss")
  const queue = {
    name: SEND_EMAIL_QUEUE,
    retryLimit: retry.limit,
    retryDelay: retry.delaySeconds,
    retryBackoff: retry.backoff,
    // A job whose worker died mid-send expires and is retried instead of hanging.
    expireInSeconds: 120,
  };
  if (await boss.getQueue(SEND_EMAIL_QUEUE)) await boss.updateQueue(SEND_EMAIL_QUEUE, queue);
  else await boss.createQueue(SEND_EMAIL_QUEUE, queue);

  const { db, close } = connect(url);
  for (let i = 0; i < concurrency; i++) {
    await boss.work<SendEmailJob>(
      SEND_EMAIL_QUEUE,
      { batchSize: 1, pollingIntervalSeconds: options.pollingIntervalSeconds ?? 1 },
      async ([job]) => {
        if (!job) return;
        const outcome = await sendOutboxEmail(db, job.data.outboxId, mailer);
        if (outcome === "failed") log(`e-mail ${job.data.outboxId} cannot be sent (see email_outbox.last_error)`);
      },
    );
  }

  // The listening aid: one recording at a time (the analysis keeps a CPU busy for about a second a
  // minute of audio); two retries for a storage or ffmpeg failure, then the failure is kept.
  const listenQueue = { name: LISTEN_QUEUE, retryLimit: 2, retryDelay: 30, retryBackoff: false, expireInSeconds: 600 };
  if (await boss.getQueue(LISTEN_QUEUE)) await boss.updateQueue(LISTEN_QUEUE, listenQueue);
  else await boss.createQueue(LISTEN_QUEUE, listenQueue);
  await boss.work<ListenJob>(
    LISTEN_QUEUE,
    { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: options.pollingIntervalSeconds ?? 1 },
    async ([job]) => {
      if (!job) return;
      const heard = await hearCheckIn(db, job.data.checkInId, job.retryCount >= listenQueue.retryLimit);
      if (heard === "failed") log(`check-in ${job.data.checkInId}: the recording could not be heard (kept as failed)`);
    },
  );
  const listening = options.listening ?? { intervalSeconds: 60, minAgeSeconds: 120 };
  const sweepListening = (minAgeSeconds: number) => sweepUnheard(db, boss, minAgeSeconds);
  const listenTimer = setInterval(() => {
    sweepListening(listening.minAgeSeconds).catch((error: unknown) => log(`listening sweep failed: ${String(error)}`));
  }, listening.intervalSeconds * 1000);
  listenTimer.unref();
  const unheard = await sweepListening(0).catch((error: unknown) => {
    log(`listening sweep failed: ${String(error)}`);
    return 0;
  });
  if (unheard) log(`${unheard} check-in recording(s) queued for the listening aid`);

  const sweepWith = (minAgeSeconds: number) =>
    sweepOutbox(db, boss, { minAgeSeconds, slotSeconds: Math.max(sweep.minAgeSeconds, 60) });
  const timer = setInterval(() => {
    sweepWith(sweep.minAgeSeconds).catch((error: unknown) => log(`sweep failed: ${String(error)}`));
  }, sweep.intervalSeconds * 1000);
  timer.unref();
  // Rows left from before this start (a crash, or written before the queue existed) go out now.
  const requeued = await sweepWith(0);
  log(`sending e-mail (${concurrency} at a time); ${requeued} waiting message(s) queued again`);

  const clock = options.clock ?? (() => new Date());
  const remind = () => sendDueReminders(db, clock());
  const reminderTimer = setInterval(
    () => {
      remind().catch((error: unknown) => log(`reminders failed: ${String(error)}`));
    },
    (options.reminders?.intervalSeconds ?? 60) * 1000,
  );
  reminderTimer.unref();
  // Reminders missed while no worker ran go out now; each key can only be queued once.
  const reminded = await remind().catch((error: unknown) => {
    log(`reminders failed: ${String(error)}`);
    return [];
  });
  if (reminded.length) log(`${reminded.length} due-date reminder(s) queued`);

  // Each teacher's new members of yesterday, once their day is over; at most one e-mail a day each.
  const digest = () => sendNewMemberDigests(db, clock());
  const digestTimer = setInterval(
    () => {
      digest().catch((error: unknown) => log(`new-members e-mail failed: ${String(error)}`));
    },
    (options.digests?.intervalSeconds ?? 900) * 1000,
  );
  digestTimer.unref();
  await digest().catch((error: unknown) => log(`new-members e-mail failed: ${String(error)}`));

  // Abandoned uploads (lib/storage/cleanup.ts): hourly, and once at start; only where storage is set up.
  const tidy = async () => {
    if (!storageConfigured()) return 0;
    const n = await cleanAbandonedUploads(db, clock());
    if (n) log(`${n} abandoned upload(s) deleted`);
    return n;
  };
  const tidyTimer = setInterval(
    () => {
      tidy().catch((error: unknown) => log(`upload clean-up failed: ${String(error)}`));
    },
    (options.uploads?.intervalSeconds ?? 3600) * 1000,
  );
  tidyTimer.unref();
  await tidy().catch((error: unknown) => log(`upload clean-up failed: ${String(error)}`));

  // Refunds left pending (a local write failed after Stripe refunded): every five minutes, where Stripe is set up.
  const repair = async () => {
    if (!(process.env.STRIPE_SECRET_KEY ?? env().STRIPE_SECRET_KEY)) return { recorded: 0, failed: 0 };
    const r = await repairRefunds(db, stripe(), clock());
    if (r.recorded || r.failed) log(`refund repair: ${r.recorded} recorded from Stripe, ${r.failed} closed`);
    return r;
  };
  const repairTimer = setInterval(
    () => {
      repair().catch((error: unknown) => log(`refund repair failed: ${String(error)}`));
    },
    (options.refunds?.intervalSeconds ?? 300) * 1000,
  );
  repairTimer.unref();

  let stopping: Promise<void> | undefined;
  const running: RunningWorker = {
    sweepNow: () => sweepWith(0),
    sweepUnheardNow: () => sweepListening(0),
    remindNow: remind,
    digestNow: digest,
    cleanUploadsNow: tidy,
    repairRefundsNow: repair,
    stop: () => {
      stopping ??= (async () => {
        clearInterval(timer);
        clearInterval(reminderTimer);
        clearInterval(digestTimer);
        clearInterval(tidyTimer);
        clearInterval(listenTimer);
        clearInterval(repairTimer);
        // Graceful: jobs in hand finish (or time out and are retried later), no new ones are fetched.
        await boss.stop({ graceful: true, wait: true, timeout: 20_000 });
        await close();
        if (current === running) current = undefined;
      })();
      return stopping;
    },
  };
  current = running;
  return running;
}

export async function stopWorker(): Promise<void> {
  await current?.stop();
}
