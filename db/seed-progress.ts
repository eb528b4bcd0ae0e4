// Demo progress: how far demo students have come on their courses' tunes, so the ladders show rungs
// done, in progress, open and locked. Most of it follows from the demo assignments' sign-offs
// (db/seed-data/teaching.ts), as the app itself raises progress on a sign-off; the rest is progress on
// a second ladder from before the demo's assignments.
import { inArray, sql } from "drizzle-orm";
import type { Db } from "./client";
import { tuneProgress, tunes, users } from "./schema";
import { DEMO_TUNES } from "./seed-data/catalogue";
import { STUDENTS, TEACHERS } from "./seed-data/people";
import { DEMO_ASSIGNMENTS } from "./seed-data/teaching";
import { demoTuneAbc, headerField } from "./seed-catalogue";

export interface DemoProgress {
  student: number; // index into STUDENTS
  tune: string; // file in seed-data/tunes
  reached: number;
}

/** Progress that no demo assignment explains: earlier work on the students' other ladder. */
const EARLIER: readonly DemoProgress[] = [
  // STUDENTS[0] on "First Steps": the taster done, the second rung under way, the third locked; on
  // "Tunes for the Dance Floor" the first rung done and the second simply open.
  { student: 0, tune: "little-biscuit.abc", reached: 1 },
  { student: 0, tune: "hop-the-puddle.abc", reached: 1 },
  { student: 0, tune: "rattling-gate.abc", reached: 2 },
  // STUDENTS[3] is further on in "First Steps" and has begun "Ready for the Session".
  { student: 3, tune: "little-biscuit.abc", reached: 2 },
  { student: 3, tune: "hop-the-puddle.abc", reached: 2 },
  { student: 3, tune: "slow-boats-marle.abc", reached: 1 },
  // STUDENTS[1] has finished grade 1 of "Tunes for the Dance Floor" and the first rung of the session course.
  { student: 1, tune: "rattling-gate.abc", reached: 3 },
  { student: 1, tune: "slow-boats-marle.abc", reached: 2 },
  { student: 4, tune: "little-biscuit.abc", reached: 1 },
  { student: 2, tune: "rattling-gate.abc", reached: 2 },
  { student: 2, tune: "kettle-nobody-watched.abc", reached: 1 },
  { student: 5, tune: "little-biscuit.abc", reached: 1 },
  { student: 5, tune: "hop-the-puddle.abc", reached: 1 },
];

/** Every demo student's progress, one row per student and tune: the highest of the above and the sign-offs. */
export const DEMO_PROGRESS: readonly DemoProgress[] = (() => {
  const best = new Map<string, DemoProgress>();
  const raise = (p: DemoProgress) => {
    const key = `${p.student}/${p.tune}`;
    if (p.reached > (best.get(key)?.reached ?? 0)) best.set(key, p);
  };
  EARLIER.forEach(raise);
  for (const a of DEMO_ASSIGNMENTS) {
    const signedOff = a.checkIns.filter((c) => c.review?.outcome === "signed_off").map((c) => c.stage);
    if (signedOff.length) raise({ student: a.student, tune: a.tune, reached: Math.max(...signedOff) });
  }
  return [...best.values()];
})();

/** Idempotent: a second run adds nothing and leaves progress made since then alone. */
export async function seedProgress(db: Db): Promise<number> {
  const emails = [...STUDENTS, ...TEACHERS].map((p) => p.email.toLowerCase());
  const people = await db
    .select({ id: users.id, email: users.email })
    .from(users)
    .where(inArray(sql`lower(${users.email})`, emails));
  const idOf = new Map(people.map((p) => [p.email.toLowerCase(), p.id]));
  const tuneRows = await db.select({ id: tunes.id, teacherId: tunes.teacherId, title: tunes.title }).from(tunes);
  const rows = DEMO_PROGRESS.map((p) => {
    const owner = DEMO_TUNES.find((t) => t.file === p.tune);
    const title = headerField(demoTuneAbc(p.tune), "T");
    const teacherId = owner ? idOf.get(TEACHERS[owner.teacher].email.toLowerCase()) : undefined;
    const userId = idOf.get(STUDENTS[p.student].email.toLowerCase());
    const tune = tuneRows.find((t) => t.teacherId === teacherId && t.title === title);
    if (!userId || !tune)
      throw new Error(
        `demo progress: no student ${STUDENTS[p.student].email} or tune ${p.tune} (seed the catalogue first)`,
      );
    return { userId, tuneId: tune.id, reachedStage: p.reached };
  });
  const made = await db.insert(tuneProgress).values(rows).onConflictDoNothing().returning({ u: tuneProgress.userId });
  return made.length;
}
