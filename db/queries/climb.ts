// SQL for a member climbing a course's tune stage by stage: the tune's place on their enrolment and
// its stage rows. Whether the tune is open to them is decided in lib/catalogue/access.ts, the state
// changes in lib/teaching/transitions.ts; these only read and write rows.
import { and, asc, desc, eq, gte, inArray } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { checkIns, courses, enrolments, enrolmentTunes, stageStates, tunes, tuneStages, users } from "../schema";

type StageRowState = "locked" | "open" | "checked_in" | "signed_off";

export async function findEnrolmentTune(db: Db, enrolmentId: string, tuneId: string): Promise<string | null> {
  const [row] = await db
    .select({ id: enrolmentTunes.id })
    .from(enrolmentTunes)
    .where(and(eq(enrolmentTunes.enrolmentId, enrolmentId), eq(enrolmentTunes.tuneId, tuneId)))
    .limit(1);
  return row?.id ?? null;
}

/**
 * The tune's place on the enrolment with one stage row per stage of the tune, made once: the stages
 * the student has already reached (elsewhere, e.g. on an assignment) start signed off, the next open.
 */
export async function ensureEnrolmentTune(
  db: Db,
  v: { enrolmentId: string; tuneId: string; reached: number; now: Date },
): Promise<string> {
  return db.transaction(async (tx) => {
    await tx
      .insert(enrolmentTunes)
      .values({ enrolmentId: v.enrolmentId, tuneId: v.tuneId, createdAt: v.now })
      .onConflictDoNothing();
    const id = await findEnrolmentTune(tx, v.enrolmentId, v.tuneId);
    if (!id) throw new Error(`enrolment_tunes row for ${v.enrolmentId}/${v.tuneId} vanished`);
    const stages = await tx
      .select({ index: tuneStages.index })
      .from(tuneStages)
      .where(eq(tuneStages.tuneId, v.tuneId))
      .orderBy(asc(tuneStages.index));
    if (stages.length) {
      const stateOf = (i: number): StageRowState =>
        i <= v.reached ? "signed_off" : i === v.reached + 1 ? "open" : "locked";
      await tx
        .insert(stageStates)
        .values(
          stages.map((s) => ({
            enrolmentTuneId: id,
            stageIndex: s.index,
            state: stateOf(s.index),
            openedAt: stateOf(s.index) === "locked" ? null : v.now,
            signedOffAt: stateOf(s.index) === "signed_off" ? v.now : null,
          })),
        )
        .onConflictDoNothing();
    }
    return id;
  });
}

export async function placeStages(db: Db, enrolmentTuneId: string) {
  return db
    .select({ id: stageStates.id, index: stageStates.stageIndex, state: stageStates.state })
    .from(stageStates)
    .where(eq(stageStates.enrolmentTuneId, enrolmentTuneId))
    .orderBy(asc(stageStates.stageIndex));
}

/** The check-ins on some stage rows, newest first, with what the tune page and the teacher show. */
export async function placeCheckIns(db: Db, stageStateIds: string[]) {
  if (stageStateIds.length === 0) return [];
  return db
    .select({
      id: checkIns.id,
      stageStateId: checkIns.stageStateId,
      status: checkIns.status,
      selfRating: checkIns.selfRating,
      fromMemory: checkIns.fromMemory,
      uploadId: checkIns.uploadId,
      feedback: checkIns.feedback,
      createdAt: checkIns.createdAt,
      reviewedAt: checkIns.reviewedAt,
    })
    .from(checkIns)
    .where(inArray(checkIns.stageStateId, stageStateIds))
    .orderBy(desc(checkIns.createdAt), desc(checkIns.id));
}

/**
 * Check-ins on courses that opened their next stage by themselves (a self-paced course's), newest
 * first, of one teacher's members (everyone's: null), since a time, with the teacher's word if given.
 */
export async function selfCheckIns(db: Db, teacherId: string | null, since: Date, limit: number) {
  return db
    .select({
      checkInId: checkIns.id,
      createdAt: checkIns.createdAt,
      selfRating: checkIns.selfRating,
      fromMemory: checkIns.fromMemory,
      uploadId: checkIns.uploadId,
      feedback: checkIns.feedback,
      commentedAt: checkIns.reviewedAt,
      commentedBy: checkIns.reviewedBy,
      stageIndex: stageStates.stageIndex,
      stageName: tuneStages.name,
      studentId: users.id,
      studentName: users.name,
      tuneId: tunes.id,
      tuneTitle: tunes.title,
      courseTitle: courses.title,
      teacherId: enrolments.teacherId,
    })
    .from(checkIns)
    .innerJoin(stageStates, eq(stageStates.id, checkIns.stageStateId))
    .innerJoin(enrolmentTunes, eq(enrolmentTunes.id, stageStates.enrolmentTuneId))
    .innerJoin(enrolments, eq(enrolments.id, enrolmentTunes.enrolmentId))
    .innerJoin(courses, eq(courses.id, enrolments.courseId))
    .innerJoin(users, eq(users.id, checkIns.studentId))
    .innerJoin(tunes, eq(tunes.id, enrolmentTunes.tuneId))
    .leftJoin(tuneStages, and(eq(tuneStages.tuneId, tunes.id), eq(tuneStages.index, stageStates.stageIndex)))
    .where(
      and(
        eq(checkIns.status, "signed_off"),
        gte(checkIns.createdAt, since),
        eq(checkIns.selfSignedOff, true),
        teacherId === null ? undefined : eq(enrolments.teacherId, teacherId),
      ),
    )
    .orderBy(desc(checkIns.createdAt), desc(checkIns.id))
    .limit(limit);
}
