// A member climbing a course's tune stage by stage: where they stand on it (the tune page's check-in
// panel), and their check-in. The course's pace decides what a check-in does: on a self-paced
// course it opens the next stage at once, on a teacher sign-off course it waits in the teacher's
// review queue. The state change itself is applyTransition's (./transitions.ts).
import { z } from "zod";
import type { Tx as Db } from "@/db/queries/auth";
import { coursesByIds, coursesWithTune, stageListOf, type CourseRow } from "@/db/queries/catalogue";
import { ensureEnrolmentTune, findEnrolmentTune, placeCheckIns, placeStages } from "@/db/queries/climb";
import { enrolmentOf } from "@/db/queries/enrolments";
import { forbidden, notFound } from "@/lib/auth/errors";
import { buildLadder } from "@/lib/catalogue/access";
import type { Person } from "./learn-assignment";
import type { StageState } from "./state-machine";
import { applyTransition, type ApplyResult } from "./transitions";

/** The course a member climbs a tune on: enrolled (active) and the tune's rung open to them. */
export type ClimbSpot = { course: CourseRow; enrolmentId: string; reached: number };

export type ClimbStage = {
  index: number;
  name: string;
  state: StageState;
  checkIn: {
    id: string;
    status: "waiting" | "signed_off" | "needs_more_time" | "withdrawn";
    selfRating: number;
    fromMemory: boolean;
    recorded: boolean;
    feedback: string | null;
    createdAt: string;
  } | null;
};

export type ClimbJson = {
  course: { id: string; slug: string; title: string; pace: "self_paced" | "teacher_sign_off"; teacherName: string };
  stages: ClimbStage[];
  /** The stage being worked on (open, or checked in and waiting); null when every stage is signed off. */
  current: number | null;
};

/** Where the member climbs this tune, or null (with why) when they cannot check it in. */
export async function climbSpot(
  db: Db,
  person: Person,
  tuneId: string,
): Promise<{ spot: ClimbSpot } | { spot: null; why: string }> {
  const courses = await coursesByIds(db, await coursesWithTune(db, tuneId));
  let why = "Start a course with this tune to check in its stages.";
  for (const course of courses.filter((c) => c.published)) {
    const enrolment = await enrolmentOf(db, person.id, course.id);
    if (!enrolment) continue;
    if (enrolment.status !== "active") {
      why = `Your enrolment in “${course.title}” is ${enrolment.status}: ask your teacher to resume it.`;
      continue;
    }
    const ladder = await buildLadder(db, person, course);
    const rung = ladder.grades.flatMap((g) => g.rungs).find((r) => r.tuneId === tuneId);
    if (rung?.open) return { spot: { course, enrolmentId: enrolment.id, reached: rung.reached } };
    if (rung?.reason) why = rung.reason;
  }
  return { spot: null, why };
}

/** The tune page's check-in panel: the stages on this course and the one being worked on. */
export async function tuneClimb(db: Db, person: Person, tuneId: string): Promise<ClimbJson | { why: string }> {
  const found = await climbSpot(db, person, tuneId);
  if (!found.spot) return { why: found.why };
  const { course, enrolmentId, reached } = found.spot;
  const [list, placeId] = await Promise.all([stageListOf(db, [tuneId]), findEnrolmentTune(db, enrolmentId, tuneId)]);
  const rows = placeId ? await placeStages(db, placeId) : [];
  const checks = await placeCheckIns(
    db,
    rows.map((r) => r.id),
  );
  const stages: ClimbStage[] = list.map((s) => {
    const row = rows.find((r) => r.index === s.index);
    // Before the first check-in there are no rows yet: they would start from the stage reached.
    const state: StageState =
      row?.state ?? (s.index <= reached ? "signed_off" : s.index === reached + 1 ? "open" : "locked");
    const c = row ? checks.find((k) => k.stageStateId === row.id) : undefined; // newest first
    return {
      index: s.index,
      name: s.name,
      state,
      checkIn: c
        ? {
            id: c.id,
            status: c.status,
            selfRating: c.selfRating,
            fromMemory: c.fromMemory,
            recorded: c.uploadId !== null,
            feedback: c.feedback,
            createdAt: c.createdAt.toISOString(),
          }
        : null,
    };
  });
  return {
    course: {
      id: course.id,
      slug: course.slug,
      title: course.title,
      pace: course.pace,
      teacherName: course.leadTeacherName,
    },
    stages,
    current: stages.find((s) => s.state === "open" || s.state === "checked_in")?.index ?? null,
  };
}

/** The place's stage row for a stage, made with the place at the member's first step. */
export async function climbStageRow(db: Db, person: Person, tuneId: string, stageIndex: number, now: Date) {
  const found = await climbSpot(db, person, tuneId);
  if (!found.spot) throw forbidden(found.why);
  const placeId = await ensureEnrolmentTune(db, {
    enrolmentId: found.spot.enrolmentId,
    tuneId,
    reached: found.spot.reached,
    now,
  });
  const row = (await placeStages(db, placeId)).find((s) => s.index === stageIndex);
  if (!row) throw notFound(`This tune has no stage ${stageIndex}.`);
  return { placeId, stageStateId: row.id, state: row.state };
}

export type RungCheckIn = { stageIndex: number; uploadId: string | null; selfRating: number; fromMemory: boolean };

/** The check-in's body: whether a recording or "played from memory" stands behind it is checked on the stage (422). */
export const rungCheckInInput = z.object({
  tuneId: z.uuid("Unknown tune."),
  stageIndex: z.coerce
    .number({ error: "Say which stage you are checking in." })
    .int("The stage must be a whole number.")
    .min(1, "The stage must be 1 or more."),
  uploadId: z.uuid("Record or upload the recording again.").nullable().default(null),
  selfRating: z.coerce
    .number({ error: "Rate how it went, from 1 to 5." })
    .int("Rate how it went with a whole number from 1 to 5.")
    .min(1, "Rate how it went, from 1 to 5.")
    .max(5, "Rate how it went, from 1 to 5."),
  fromMemory: z.boolean({ error: "Say whether you played from memory (yes or no)." }).default(false),
});

/** Checks in a stage of a course's tune: a recording, or "played from memory", with a self-rating. */
export async function checkInRung(
  db: Db,
  person: Person,
  tuneId: string,
  req: RungCheckIn,
  now = new Date(),
): Promise<ApplyResult> {
  const { stageStateId } = await climbStageRow(db, person, tuneId, req.stageIndex, now);
  return applyTransition(db, {
    stageStateId,
    transition: "checkIn",
    actor: person,
    checkInInput: { uploadId: req.uploadId, selfRating: req.selfRating, fromMemory: req.fromMemory },
    now,
  });
}
