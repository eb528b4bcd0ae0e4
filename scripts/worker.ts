// The job worker: sends queued e-mail (and later other background jobs). `tsx scripts/worker.ts`.
// Reads DATABASE_URL, RESEND_API_KEY, RESEND_BASE_URL, MAIL_FROM and APP_URL (lib/env.ts).
import { startWorker } from "@/lib/jobs/worker";

const worker = await startWorker().catch((error: unknown) => {
  console.error(`[worker] cannot start: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  console.log(`[worker] ${signal}: finishing the e-mails in hand, then stopping`);
  try {
    await worker.stop();
    process.exit(0);
  } catch (error) {
    console.error(`[worker] did not stop cleanly: ${String(error)}`);
    process.exit(1);
  }
}
process.on("SIGTERM", () => void shutdown("SIGTERM"));
process.on("SIGINT", () => void shutdown("SIGINT"));
