// Applies one stage transition in a transaction (shared design of issue 6): the stage_states row is
// locked with SELECT … FOR UPDATE before decide() looks at it, so a double click or two concurrent
// requests see each other's result and the loser gets a 409; the partial unique index "one waiting
// check-in per stage" is the second guard for check-ins.
import type { Tx } from "@/db/queries/auth";
import { checkIns } from "@/db/schema";
import { and, eq } from "drizzle-orm";
import {
  findUpload,
  lastStageIndex,
  lockStage,
  mailPeople,
  openStage,
  practiceMinutesSince,
  raiseTuneProgress,
  setStageState,
  shareAssignmentOfStage,
  waitingCheckIn,
  type LockedStage,
} from "@/db/queries/teaching";
import type { Role } from "@/lib/auth/permissions";
import { conflict, HttpError, unprocessable } from "@/lib/auth/errors";
import { mailFeedback } from "./teach-feedback-mail";
import { decide, type Actor, type CheckInStatus, type StageState, type Transition } from "./state-machine";

export type CheckInInput = {
  uploadId: string;
  selfRating: number;
  fromMemory: boolean;
};

export type ApplyInput = {
  stageStateId: string;
  transition: Transition;
  actor: { id: string; role: Role };
  checkInInput?: CheckInInput;
  /** signOff / needsMoreTime: the teacher's words to the student. */
  feedback?: string;
  /** signOff / needsMoreTime / withdraw: the check-in the person looked at; another one waiting answers 409. */
  checkInId?: string;
  now: Date;
};

export type ApplyResult = {
  stageStateId: string;
  state: StageState;
  checkInId: string;
  checkInStatus: CheckInStatus;
  /** The stage index opened by this transition, or null. */
  openedStage: number | null;
};

/** YYYY-MM-DD of an instant in a time zone (Intl, ECMA-402), for comparing with practice_logs.practised_on. */
function dayIn(instant: Date, timeZone: string): string {
  return new Intl.DateTimeFormat("en-CA", {
    timeZone,
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
  }).format(instant);
}

function actorFor(stage: LockedStage, actor: ApplyInput["actor"]): Actor {
  return {
    ...actor,
    isStudentOwner: actor.id === stage.studentId,
    isAssignmentTeacher: actor.id === stage.teacherId,
  };
}

function isUniqueViolation(e: unknown): boolean {
  const inner = e instanceof Error && e.cause instanceof Error ? e.cause : e;
  return (
    typeof inner === "object" && inner !== null && "code" in inner && (inner as { code: unknown }).code === "23505"
  );
}

async function checkUpload(tx: Tx, stage: LockedStage, input: CheckInInput | undefined): Promise<CheckInInput> {
  if (!input)
    throw unprocessable("A check-in needs a recording, a self-rating and whether you played from memory.", {
      uploadId: "Add a recording.",
    });
  if (!Number.isInteger(input.selfRating) || input.selfRating < 1 || input.selfRating > 5) {
    throw unprocessable("Rate yourself from 1 to 5.", {
      selfRating: "Choose a whole number from 1 to 5.",
    });
  }
  const upload = await findUpload(tx, input.uploadId);
  // Another student's recording answers like a missing one: no hint that it exists.
  if (!upload || upload.ownerId !== stage.studentId || upload.assignmentStudentId !== stage.assignmentStudentId) {
    throw unprocessable("That recording was not found for this assignment.", {
      uploadId: "Upload the recording for this assignment again.",
    });
  }
  if (upload.stageIndex !== null && upload.stageIndex !== stage.stageIndex) {
    throw unprocessable(`That recording was made for stage ${upload.stageIndex}, not stage ${stage.stageIndex}.`, {
      uploadId: "Record or upload this stage's recording.",
    });
  }
  if (upload.status !== "stored")
    throw unprocessable("That recording has not finished uploading.", {
      uploadId: "Wait for the upload to finish.",
    });
  return input;
}

async function minutesFor(tx: Tx, stage: LockedStage, timeZone: string): Promise<number> {
  if (stage.unlockRule !== "self_check_in" || !stage.openedAt) return 0;
  return practiceMinutesSince(tx, stage.studentId, stage.tuneId, dayIn(stage.openedAt, timeZone));
}

async function writeCheckIn(
  tx: Tx,
  stage: LockedStage,
  input: ApplyInput,
  c: CheckInInput,
  status: CheckInStatus,
): Promise<string> {
  try {
    const [row] = await tx
      .insert(checkIns)
      .values({
        stageStateId: stage.id,
        studentId: stage.studentId,
        uploadId: c.uploadId,
        selfRating: c.selfRating,
        fromMemory: c.fromMemory,
        status,
        ...(status === "signed_off" ? { reviewedAt: input.now } : {}),
        createdAt: input.now,
      })
      .returning({ id: checkIns.id });
    return row.id;
  } catch (e) {
    if (isUniqueViolation(e)) throw conflict("This stage is already checked in and waiting for review.");
    throw e;
  }
}

async function closeWaiting(tx: Tx, stage: LockedStage, input: ApplyInput, status: CheckInStatus): Promise<string> {
  const waiting = await waitingCheckIn(tx, stage.id);
  if (!waiting || (input.checkInId && waiting.id !== input.checkInId))
    throw conflict("This check-in has already been dealt with.");
  const review = input.transition !== "withdraw";
  await tx
    .update(checkIns)
    .set({
      status,
      ...(review
        ? {
            feedback: input.feedback ?? "",
            reviewedBy: input.actor.id,
            reviewedAt: input.now,
          }
        : {}),
    })
    .where(and(eq(checkIns.id, waiting.id), eq(checkIns.status, "waiting")));
  return waiting.id;
}

export async function applyTransition(db: Tx, input: ApplyInput): Promise<ApplyResult> {
  return db.transaction(async (tx) => {
    await shareAssignmentOfStage(tx, input.stageStateId);
    const stage = await lockStage(tx, input.stageStateId);
    if (!stage) throw new HttpError(404, "Stage not found.");
    const actor = actorFor(stage, input.actor);
    const people =
      input.transition === "checkIn" ? await mailPeople(tx, stage.studentId, stage.teacherId, stage.tuneId) : null;
    const decision = decide(input.transition, {
      state: stage.state,
      actor,
      assignmentStatus: stage.status,
      unlockRule: stage.unlockRule,
      unlockMinutes: stage.unlockMinutes,
      minutesSinceOpened:
        input.transition === "checkIn" ? await minutesFor(tx, stage, people?.student?.timeZone ?? "UTC") : undefined,
      isLastStage: stage.stageIndex >= (await lastStageIndex(tx, stage.assignmentStudentId)),
    });
    if (!decision.ok) throw new HttpError(decision.status, decision.message);

    let checkInId: string;
    if (input.transition === "checkIn") {
      const checked = await checkUpload(tx, stage, input.checkInInput);
      checkInId = await writeCheckIn(tx, stage, input, checked, decision.checkInStatus);
    } else {
      checkInId = await closeWaiting(tx, stage, input, decision.checkInStatus);
    }
    await setStageState(tx, stage.id, decision.next as "open" | "checked_in" | "signed_off", input.now);

    let openedStage: number | null = null;
    if (decision.opensNext && (await openStage(tx, stage.assignmentStudentId, stage.stageIndex + 1, input.now)))
      openedStage = stage.stageIndex + 1;
    if (decision.next === "signed_off")
      await raiseTuneProgress(tx, stage.studentId, stage.tuneId, stage.stageIndex, input.now);
    if (input.transition === "signOff" || input.transition === "needsMoreTime") {
      await mailFeedback(
        tx,
        stage,
        checkInId,
        input.feedback ?? "",
        decision.checkInStatus as "signed_off" | "needs_more_time",
        openedStage,
      );
    }
    return {
      stageStateId: stage.id,
      state: decision.next,
      checkInId,
      checkInStatus: decision.checkInStatus,
      openedStage,
    };
  });
}
