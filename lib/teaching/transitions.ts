// Applies one stage transition in a transaction, for an assignment's stage or a course's: the
// stage_states row is locked with SELECT … FOR UPDATE before decide() looks at it, so a double click or
// two concurrent requests see each other's result and the loser gets a 409; the partial unique index
// "one waiting check-in per stage" is the second guard for check-ins.
import type { Tx } from "@/db/queries/auth";
import { checkIns } from "@/db/schema";
import { and, eq } from "drizzle-orm";
import {
  findUpload,
  lastStageIndex,
  latestCheckIn,
  lockStage,
  mailPeople,
  openStage,
  practiceMinutesSince,
  raiseTuneProgress,
  setStageState,
  shareAssignmentOfStage,
  unsendQueued,
  waitingCheckIn,
  type LockedStage,
} from "@/db/queries/teaching";
import type { Role } from "@/lib/auth/permissions";
import { conflict, HttpError, unprocessable } from "@/lib/auth/errors";
import { feedbackKey, mailFeedback } from "./teach-feedback-mail";
import {
  decide,
  UNDO_MINUTES,
  type Actor,
  type CheckInStatus,
  type StageState,
  type Transition,
} from "./state-machine";

export type CheckInInput = {
  /** Required on an assignment; on a course, "played from memory" may stand in for a recording. */
  uploadId: string | null;
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
  /** signOff / needsMoreTime / withdraw / undoNeedsMoreTime: the check-in the person looked at; another one answers 409. */
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
  const course = stage.enrolmentTuneId !== null;
  if (!input)
    throw unprocessable("A check-in needs a recording, a self-rating and whether you played from memory.", {
      uploadId: "Add a recording.",
    });
  if (!Number.isInteger(input.selfRating) || input.selfRating < 1 || input.selfRating > 5) {
    throw unprocessable("Rate yourself from 1 to 5.", {
      selfRating: "Choose a whole number from 1 to 5.",
    });
  }
  if (input.uploadId === null) {
    if (course && input.fromMemory) return input;
    throw unprocessable(
      course ? "Add a recording, or say you played it from memory." : "A check-in needs a recording.",
      { uploadId: course ? "Add a recording, or tick “Played from memory”." : "Add a recording." },
    );
  }
  const upload = await findUpload(tx, input.uploadId);
  const sameHolder = course
    ? upload?.enrolmentTuneId === stage.enrolmentTuneId
    : upload?.assignmentStudentId === stage.assignmentStudentId;
  // Another student's recording answers like a missing one: no hint that it exists.
  if (!upload || upload.ownerId !== stage.studentId || !sameHolder) {
    throw unprocessable(`That recording was not found for this ${course ? "tune" : "assignment"}.`, {
      uploadId: `Upload the recording for this ${course ? "stage" : "assignment"} again.`,
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
        ...(status === "signed_off" ? { reviewedAt: input.now, selfSignedOff: true } : {}),
        createdAt: input.now,
      })
      .returning({ id: checkIns.id });
    return row.id;
  } catch (e) {
    if (isUniqueViolation(e)) throw conflict("This stage is already checked in and waiting for review.");
    throw e;
  }
}

/** Undoing a "needs more time": the check-in waits again and its note, still held back, is not sent. */
async function reopenReview(tx: Tx, checkInId: string): Promise<void> {
  if (!(await unsendQueued(tx, feedbackKey(checkInId))))
    throw conflict("The note has already gone to the student, so this can no longer be undone.");
  await tx
    .update(checkIns)
    .set({ status: "waiting", feedback: null, reviewedBy: null, reviewedAt: null })
    .where(and(eq(checkIns.id, checkInId), eq(checkIns.status, "needs_more_time")));
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
    const last = input.transition === "undoNeedsMoreTime" ? await latestCheckIn(tx, stage.id) : null;
    const decision = decide(input.transition, {
      state: stage.state,
      actor,
      assignmentStatus: stage.status,
      unlockRule: stage.unlockRule,
      unlockMinutes: stage.unlockMinutes,
      minutesSinceOpened:
        input.transition === "checkIn" ? await minutesFor(tx, stage, people?.student?.timeZone ?? "UTC") : undefined,
      isLastStage: stage.stageIndex >= (await lastStageIndex(tx, stage)),
      holder: stage.enrolmentTuneId ? "course" : "assignment",
      feedback: input.feedback,
      lastReview: last,
      now: input.now,
    });
    if (!decision.ok)
      throw new HttpError(
        decision.status,
        decision.message,
        decision.field ? { [decision.field]: decision.message } : undefined,
      );

    let checkInId: string;
    if (input.transition === "checkIn") {
      const checked = await checkUpload(tx, stage, input.checkInInput);
      checkInId = await writeCheckIn(tx, stage, input, checked, decision.checkInStatus);
    } else if (input.transition === "undoNeedsMoreTime" && last) {
      if (input.checkInId && input.checkInId !== last.id) throw conflict("This check-in has already been dealt with.");
      checkInId = last.id;
      await reopenReview(tx, checkInId);
    } else {
      checkInId = await closeWaiting(tx, stage, input, decision.checkInStatus);
    }
    await setStageState(tx, stage.id, decision.next as "open" | "checked_in" | "signed_off", input.now);

    let openedStage: number | null = null;
    if (decision.opensNext && (await openStage(tx, stage, stage.stageIndex + 1, input.now)))
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
        {
          // "Needs more time" can be undone for a while: its note waits that long before it goes.
          sendAfter:
            input.transition === "needsMoreTime" ? new Date(input.now.getTime() + UNDO_MINUTES * 60_000) : undefined,
        },
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
