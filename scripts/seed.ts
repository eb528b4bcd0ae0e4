import { connect } from "@/db/client";
import { isEmpty, seed } from "@/db/seed";
import { env } from "@/lib/env";

// `--if-empty`: seed only a database without people (what `npm start` does, so a second start keeps your data).
const onlyIfEmpty = process.argv.includes("--if-empty");
const { db, close } = connect(env().DATABASE_URL);
try {
  if (onlyIfEmpty && !(await isEmpty(db))) {
    console.log("demo data: already present, kept as it is");
    // The Stripe stand-in's state file may be gone: give it the demo billing again (issue 7).
    const { imported } = await (await import("@/db/seed-data/billing")).seedBilling(db);
    if (imported) console.log("demo data: billing history written to the Stripe stand-in again");
  } else {
    const { people } = await seed(db);
    console.log(`demo data: seeded (${people} people)`);
  }
} catch (error) {
  console.error("seeding failed:", error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  await close();
}
