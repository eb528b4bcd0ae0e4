import { connect } from "@/db/client";
import { isEmpty, seed } from "@/db/seed";
import { env } from "@/lib/env";
import { scheduleListening } from "@/lib/jobs/listen";

// `--if-empty`: seed only a database without people (what `npm start` does, so a second start keeps your data).
const onlyIfEmpty = process.argv.includes("--if-empty");
const { db, close } = connect(env().DATABASE_URL);
const took = () => `${(performance.now() / 1000).toFixed(1)} s`; // since this process started

/** Asks the listening aid to hear the new check-ins' recordings now, when the job queue exists yet. */
async function queueListening(checkInIds: string[]): Promise<string> {
  try {
    let queued = 0;
    for (const id of checkInIds) if (await scheduleListening(id, db)) queued++;
    if (queued === checkInIds.length) return `${queued} recordings queued for the listening aid`;
  } catch {
    // no queue before the worker's first start: its start-up sweep hears them (lib/jobs/listen.ts)
  }
  return `the worker hears ${checkInIds.length} recordings when it starts`;
}

try {
  if (onlyIfEmpty && !(await isEmpty(db))) {
    console.log("demo data: already present, kept as it is");
    // The Stripe stand-in's state file may be gone: give it the demo billing again (issue 7).
    const { imported } = await (await import("@/db/seed-data/billing")).seedBilling(db);
    if (imported) console.log("demo data: billing history written to the Stripe stand-in again");
  } else {
    const { people, teaching } = await seed(db);
    const heard = teaching.recent.length ? `; ${await queueListening(teaching.recent)}` : "";
    console.log(
      `demo data: seeded in ${took()} (${people} people, ${teaching.assignments} new assignments with ` +
        `${teaching.checkIns} check-ins${heard})`,
    );
  }
} catch (error) {
  console.error("seeding failed:", error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  await close();
}
