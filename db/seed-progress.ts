// Demo progress (issue 5): how far a few demo students have come on their courses' tunes, so the
// ladders show rungs done, in progress, open and locked. Issue 6 writes real progress on sign-off.
import { and, eq, sql } from "drizzle-orm";
import type { Db } from "./client";
import { tuneProgress, tunes, users } from "./schema";
import { STUDENTS, TEACHERS } from "./seed-data/people";

/** [student index, teacher index of the tune, tune title, stage reached]. */
export const DEMO_PROGRESS: readonly [number, number, string, number][] = [
  // STUDENTS[0] on "First Steps": the taster done, the second rung under way, the third locked…
  [0, 0, "Little Biscuit Polka", 1],
  [0, 0, "Hop the Puddle", 1],
  // (and nothing yet on "Tunes for the Dance Floor", whose first rung stays simply open)
  // STUDENTS[3] is further on in "First Steps" and has begun "Ready for the Session".
  [3, 0, "Little Biscuit Polka", 2],
  [3, 0, "Hop the Puddle", 2],
  [3, 0, "Evening at Thornsby Weir", 2],
  [3, 2, "Slow Boats on the Marle", 1],
  // STUDENTS[1] has finished grade 1 of "Tunes for the Dance Floor".
  [1, 1, "The Rattling Gate", 3],
  [1, 1, "The Kettle Nobody Watched", 2],
];

async function idOf(db: Db, email: string): Promise<string | undefined> {
  const rows = await db
    .select({ id: users.id })
    .from(users)
    .where(sql`lower(${users.email}) = lower(${email})`)
    .limit(1);
  return rows[0]?.id;
}

/** Idempotent: a second run adds nothing and leaves progress made since then alone. */
export async function seedProgress(db: Db): Promise<number> {
  let written = 0;
  for (const [student, teacher, title, reached] of DEMO_PROGRESS) {
    const userId = await idOf(db, STUDENTS[student].email);
    const teacherId = await idOf(db, TEACHERS[teacher].email);
    const tune = teacherId
      ? (
          await db
            .select({ id: tunes.id })
            .from(tunes)
            .where(and(eq(tunes.teacherId, teacherId), eq(tunes.title, title)))
            .limit(1)
        )[0]
      : undefined;
    if (!userId || !tune)
      throw new Error(
        `demo progress: no student ${STUDENTS[student].email} or tune "${title}" (seed the catalogue first)`,
      );
    const made = await db
      .insert(tuneProgress)
      .values({ userId, tuneId: tune.id, reachedStage: reached })
      .onConflictDoNothing()
      .returning({ u: tuneProgress.userId });
    written += made.length;
  }
  return written;
}
