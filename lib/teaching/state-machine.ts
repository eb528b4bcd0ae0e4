// The stage state machine: which transition is allowed from which state for whom, for a stage of an
// assignment or of a tune a member climbs on a course. Pure: the database side (row locks, inserts,
// e-mail) is in transitions.ts, which asks decide() under a SELECT … FOR UPDATE so the answer holds.
import type { Role } from "@/lib/auth/permissions";

export type StageState = "locked" | "open" | "checked_in" | "signed_off";
export type Transition = "checkIn" | "withdraw" | "signOff" | "needsMoreTime" | "undoNeedsMoreTime";
export type CheckInStatus = "waiting" | "signed_off" | "needs_more_time" | "withdrawn";
/**
 * How a check-in is answered. An assignment's own rule: teacher_sign_off, or self_check_in (after
 * enough practice minutes). A course's pace: teacher_sign_off, or self_paced (the check-in opens the
 * next stage at once).
 */
export type UnlockRule = "teacher_sign_off" | "self_check_in" | "self_paced";
/** An assignment's status; a course stage passes "withdrawn" while its enrolment is not active. */
export type AssignmentStatus = "active" | "withdrawn";

export const TRANSITIONS: readonly Transition[] = [
  "checkIn",
  "withdraw",
  "signOff",
  "needsMoreTime",
  "undoNeedsMoreTime",
];

/** How long a teacher can take back a "needs more time"; the student's e-mail waits as long (transitions.ts). */
export const UNDO_MINUTES = 10;

/** Who asks, and how they relate to this stage's assignment (worked out by the caller from the rows). */
export type Actor = {
  id: string;
  role: Role;
  /** The student this assignment_student row belongs to. */
  isStudentOwner: boolean;
  /** The teacher who made the assignment, or who follows the student's enrolment on a course stage. */
  isAssignmentTeacher: boolean;
};

/** The stage's latest check-in as reviewed, for undoing a "needs more time". */
export type LastReview = { status: CheckInStatus; reviewedAt: Date | null; reviewedBy: string | null };

export type DecideContext = {
  state: StageState;
  actor: Actor;
  assignmentStatus: AssignmentStatus;
  unlockRule: UnlockRule;
  unlockMinutes: number | null;
  /** Practice minutes the student logged on this tune since the stage opened (self_check_in only). */
  minutesSinceOpened?: number;
  /** True when this is the assignment's last stage: signing it off opens nothing. */
  isLastStage: boolean;
  /** Whose stage this is: an assignment's (the default) or a course's, for the words of a refusal. */
  holder?: "assignment" | "course";
  /** needsMoreTime: the teacher's words to the student, which it requires. */
  feedback?: string;
  /** undoNeedsMoreTime: the stage's latest check-in, and the time now. */
  lastReview?: LastReview | null;
  now?: Date;
};

export type Decision =
  | {
      ok: true;
      next: StageState;
      checkInStatus: CheckInStatus;
      opensNext: boolean;
    }
  | { ok: false; status: 403 | 404 | 409 | 422; message: string; field?: string };

const refuse = (status: 403 | 404 | 409 | 422, message: string, field?: string): Decision => ({
  ok: false,
  status,
  message,
  ...(field ? { field } : {}),
});

/** Someone with no tie to the assignment must not learn it exists: 404 (ENGINEERING.md, per-record rules). */
function canSee(actor: Actor): boolean {
  return actor.isStudentOwner || actor.isAssignmentTeacher || actor.role === "admin";
}

function reviewer(actor: Actor): boolean {
  return actor.isAssignmentTeacher || actor.role === "admin";
}

const STATE_WORDS: Record<StageState, string> = {
  locked: "still locked",
  open: "open and not checked in",
  checked_in: "checked in and waiting for review",
  signed_off: "already signed off",
};

/** Signed off (by the reviewer, or by the student's own check-in): the next stage opens unless this is the last. */
const signedOff = (ctx: DecideContext): Decision => ({
  ok: true,
  next: "signed_off",
  checkInStatus: "signed_off",
  opensNext: !ctx.isLastStage,
});
/** A stage that stays where it is, or returns to open: nothing else opens. */
const moved = (next: StageState, checkInStatus: CheckInStatus): Decision => ({
  ok: true,
  next,
  checkInStatus,
  opensNext: false,
});

function checkIn(ctx: DecideContext): Decision {
  if (!ctx.actor.isStudentOwner) return refuse(403, "Only the student of this assignment can check in.");
  if (ctx.state === "checked_in") return refuse(409, "This stage is already checked in and waiting for review.");
  if (ctx.state !== "open") return refuse(409, `You can't check in: this stage is ${STATE_WORDS[ctx.state]}.`);
  if (ctx.unlockRule === "self_paced") return signedOff(ctx);
  const needed = ctx.unlockMinutes ?? 0;
  const selfUnlock = ctx.unlockRule === "self_check_in" && (ctx.minutesSinceOpened ?? 0) >= needed;
  return selfUnlock ? signedOff(ctx) : moved("checked_in", "waiting");
}

function withdraw(ctx: DecideContext): Decision {
  if (!ctx.actor.isStudentOwner) return refuse(403, "Only the student who checked in can withdraw the check-in.");
  if (ctx.state === "signed_off") return refuse(409, "This check-in has already been reviewed and signed off.");
  if (ctx.state !== "checked_in")
    return refuse(409, "There is no check-in waiting for review on this stage to withdraw.");
  return moved("open", "withdrawn");
}

/** A sentence at least: "needs more time" without a word of what to work on leaves the student guessing. */
function hasSentence(feedback: string | undefined): boolean {
  return (feedback ?? "").trim().split(/\s+/).filter(Boolean).length >= 3;
}

function review(transition: "signOff" | "needsMoreTime", ctx: DecideContext): Decision {
  if (!reviewer(ctx.actor)) return refuse(403, "Only the student's teacher or an admin can review a check-in.");
  if (ctx.state === "signed_off") return refuse(409, "This stage has already been signed off.");
  if (ctx.state !== "checked_in")
    return refuse(409, `There is no check-in to review: this stage is ${STATE_WORDS[ctx.state]}.`);
  if (transition === "signOff") return signedOff(ctx);
  if (!hasSentence(ctx.feedback))
    return refuse(422, "Tell the student in a sentence what to work on before sending it back.", "feedback");
  return moved("open", "needs_more_time");
}

/** Takes back a "needs more time" within UNDO_MINUTES, by whoever gave it: the check-in waits for review again. */
function undo(ctx: DecideContext): Decision {
  if (!reviewer(ctx.actor)) return refuse(403, "Only the student's teacher or an admin can undo a review.");
  const last = ctx.lastReview;
  if (ctx.state !== "open" || !last || last.status !== "needs_more_time" || !last.reviewedAt)
    return refuse(409, "There is no “needs more time” to undo on this stage: the student has moved on since.");
  if (last.reviewedBy !== ctx.actor.id) return refuse(403, "Only the teacher who sent it back can undo it.");
  const now = ctx.now ?? new Date();
  if (now.getTime() - last.reviewedAt.getTime() >= UNDO_MINUTES * 60_000)
    return refuse(409, `A “needs more time” can be undone for ${UNDO_MINUTES} minutes; this one is older.`);
  return moved("checked_in", "waiting");
}

export function decide(transition: Transition, ctx: DecideContext): Decision {
  const course = ctx.holder === "course";
  if (!canSee(ctx.actor)) return refuse(404, course ? "Stage not found." : "Assignment not found.");
  if (ctx.assignmentStatus === "withdrawn")
    return refuse(
      409,
      course
        ? "This enrolment is not active; its stages can't change."
        : "This assignment has been withdrawn; its stages can't change.",
    );
  switch (transition) {
    case "checkIn":
      return checkIn(ctx);
    case "withdraw":
      return withdraw(ctx);
    case "signOff":
    case "needsMoreTime":
      return review(transition, ctx);
    case "undoNeedsMoreTime":
      return undo(ctx);
  }
}
