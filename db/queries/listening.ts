// SQL of the listening aid (lib/jobs/listen.ts): what a check-in's recording is to be heard against,
// its result kept with the check-in, and the check-ins whose recording has not been heard yet.
import { and, asc, eq, gte, inArray, isNotNull, isNull, lte, sql } from "drizzle-orm";
import type { Tx } from "./auth";
import { assignments, checkIns, checkInListenings, stageStates, uploads } from "../schema";
import { toAssignment } from "./check-in-place";

/** The recording's object and the stage it was checked in on; null when the check-in is gone. */
export async function checkInToHear(db: Tx, checkInId: string) {
  const [row] = await toAssignment(
    db
      .select({
        checkInId: checkIns.id,
        storageKey: uploads.storageKey,
        uploadStatus: uploads.status,
        tuneId: assignments.tuneId,
        stagePlan: assignments.stagePlan,
        stageIndex: stageStates.stageIndex,
      })
      .from(checkIns)
      .$dynamic(),
  )
    .leftJoin(uploads, eq(uploads.id, checkIns.uploadId))
    .where(eq(checkIns.id, checkInId));
  return row ?? null;
}

export type ListeningRow = typeof checkInListenings.$inferSelect;

/** Keeps the result (or the failure) of hearing one check-in; hearing it again replaces it. */
export async function saveListening(
  db: Tx,
  row: { checkInId: string; status: "done" | "failed"; result?: Record<string, unknown> | null; error?: string | null },
): Promise<void> {
  const values = { status: row.status, result: row.result ?? null, error: row.error ?? null, createdAt: new Date() };
  await db
    .insert(checkInListenings)
    .values({ checkInId: row.checkInId, ...values })
    .onConflictDoUpdate({ target: checkInListenings.checkInId, set: values });
}

export async function listeningsOf(db: Tx, checkInIds: string[]): Promise<ListeningRow[]> {
  if (!checkInIds.length) return [];
  return db.select().from(checkInListenings).where(inArray(checkInListenings.checkInId, checkInIds));
}

/** Check-ins with a stored recording and no hearing yet, made between `maxAgeSeconds` and `minAgeSeconds` ago. */
export async function unheardCheckIns(
  db: Tx,
  o: { minAgeSeconds: number; maxAgeSeconds: number; limit: number },
): Promise<string[]> {
  const rows = await db
    .select({ id: checkIns.id })
    .from(checkIns)
    .innerJoin(uploads, eq(uploads.id, checkIns.uploadId))
    .leftJoin(checkInListenings, eq(checkInListenings.checkInId, checkIns.id))
    .where(
      and(
        isNotNull(checkIns.uploadId),
        eq(uploads.status, "stored"),
        isNull(checkInListenings.checkInId),
        lte(checkIns.createdAt, sql`now() - make_interval(secs => ${o.minAgeSeconds})`),
        gte(checkIns.createdAt, sql`now() - make_interval(secs => ${o.maxAgeSeconds})`),
      ),
    )
    .orderBy(asc(checkIns.createdAt))
    .limit(o.limit);
  return rows.map((r) => r.id);
}
