// SQL for the teacher's tunes (issue 5 items 2–3). Whose tune it is and what the engine makes of
// it are decided in lib/tunes/*; these only read and write rows.
import { and, asc, desc, eq, gt, sql } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { courses, grades, rungs, tunes, tuneStages, users, type StagePlanJson } from "../schema";
import type { Stage } from "@/lib/abc/types";
import type { TuneType } from "@/lib/tunes/header";

export interface TuneFields {
  title: string;
  tuneType: TuneType;
  key: string;
  meter: string;
  abc: string;
  stagePlan: StagePlanJson | null;
  acceptedSwaps: string[];
  turnedBars: Record<string, "upper" | "lower">;
}

export type TuneRow = typeof tunes.$inferSelect;
export type StageRow = typeof tuneStages.$inferSelect;

/** A teacher's tunes (every tune when teacherId is null: an admin), newest change first. */
export async function listTunes(db: Db, teacherId: string | null) {
  return db
    .select({
      id: tunes.id,
      title: tunes.title,
      tuneType: tunes.tuneType,
      key: tunes.key,
      meter: tunes.meter,
      teacherId: tunes.teacherId,
      teacherName: users.name,
      updatedAt: tunes.updatedAt,
      stageCount: sql<number>`(select count(*)::int from ${tuneStages} where ${tuneStages.tuneId} = ${tunes.id})`,
    })
    .from(tunes)
    .innerJoin(users, eq(users.id, tunes.teacherId))
    .where(teacherId === null ? undefined : eq(tunes.teacherId, teacherId))
    .orderBy(desc(tunes.updatedAt), asc(tunes.title));
}

export async function findTune(db: Db, id: string): Promise<TuneRow | null> {
  return (await db.select().from(tunes).where(eq(tunes.id, id)).limit(1))[0] ?? null;
}

/** For the import: the same text already stored for this teacher (a file imported twice). */
export async function findTuneByAbc(db: Db, teacherId: string, abc: string): Promise<{ id: string } | null> {
  const rows = await db
    .select({ id: tunes.id })
    .from(tunes)
    .where(and(eq(tunes.teacherId, teacherId), eq(tunes.abc, abc)))
    .limit(1);
  return rows[0] ?? null;
}

export async function stagesOf(db: Db, tuneId: string): Promise<StageRow[]> {
  return db.select().from(tuneStages).where(eq(tuneStages.tuneId, tuneId)).orderBy(asc(tuneStages.index));
}

export async function insertTune(db: Db, teacherId: string, f: TuneFields): Promise<string> {
  return (
    await db
      .insert(tunes)
      .values({ teacherId, ...f })
      .returning({ id: tunes.id })
  )[0].id;
}

export async function updateTune(db: Db, id: string, f: TuneFields): Promise<void> {
  await db
    .update(tunes)
    .set({ ...f, updatedAt: new Date() })
    .where(eq(tunes.id, id));
}

/** An engine-made stage, written over whatever was there (hand edits are the caller's business). */
export async function putStage(db: Db, tuneId: string, s: Stage): Promise<void> {
  const values = {
    name: s.name,
    kinds: s.kinds,
    abc: s.abc,
    handEdited: false,
    sourceChanged: false,
    updatedAt: new Date(),
  };
  await db
    .insert(tuneStages)
    .values({ tuneId, index: s.index, ...values })
    .onConflictDoUpdate({ target: [tuneStages.tuneId, tuneStages.index], set: values });
}

export async function updateStage(
  db: Db,
  tuneId: string,
  index: number,
  set: Partial<Omit<StageRow, "id" | "tuneId" | "index">>,
): Promise<void> {
  await db
    .update(tuneStages)
    .set({ ...set, updatedAt: new Date() })
    .where(and(eq(tuneStages.tuneId, tuneId), eq(tuneStages.index, index)));
}

/** Stages past the plan's end (the teacher made the plan shorter). */
export async function dropStagesAfter(db: Db, tuneId: string, count: number): Promise<void> {
  await db.delete(tuneStages).where(and(eq(tuneStages.tuneId, tuneId), gt(tuneStages.index, count)));
}

/** The courses whose ladders hold this tune, for the editor ("used in") and the ladder bench. */
export async function coursesUsingTune(db: Db, tuneId: string) {
  return db
    .selectDistinct({ id: courses.id, title: courses.title })
    .from(rungs)
    .innerJoin(grades, eq(grades.id, rungs.gradeId))
    .innerJoin(courses, eq(courses.id, grades.courseId))
    .where(eq(rungs.tuneId, tuneId))
    .orderBy(asc(courses.title));
}

export async function deleteTune(db: Db, id: string): Promise<void> {
  await db.delete(tunes).where(eq(tunes.id, id));
}
