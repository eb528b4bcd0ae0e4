// The stage state machine of issue 6 (shared design, /tmp/issue6-design.md): which transition is
// allowed from which state for whom. Pure: the database side (row locks, inserts, e-mail) is in
// transitions.ts, which asks decide() under a SELECT … FOR UPDATE so the answer holds.
import type { Role } from "@/lib/auth/permissions";

export type StageState = "locked" | "open" | "checked_in" | "signed_off";
export type Transition = "checkIn" | "withdraw" | "signOff" | "needsMoreTime";
export type CheckInStatus = "waiting" | "signed_off" | "needs_more_time" | "withdrawn";
export type UnlockRule = "teacher_sign_off" | "self_check_in";
export type AssignmentStatus = "active" | "withdrawn";

export const TRANSITIONS: readonly Transition[] = ["checkIn", "withdraw", "signOff", "needsMoreTime"];

/** Who asks, and how they relate to this stage's assignment (worked out by the caller from the rows). */
export type Actor = {
  id: string;
  role: Role;
  /** The student this assignment_student row belongs to. */
  isStudentOwner: boolean;
  /** The teacher who made the assignment. */
  isAssignmentTeacher: boolean;
};

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
};

export type Decision =
  | {
      ok: true;
      next: StageState;
      checkInStatus: CheckInStatus;
      opensNext: boolean;
    }
  | { ok: false; status: 403 | 404 | 409; message: string };

const refuse = (status: 403 | 404 | 409, message: string): Decision => ({
  ok: false,
  status,
  message,
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

function review(transition: "signOff" | "needsMoreTime", ctx: DecideContext): Decision {
  if (!reviewer(ctx.actor)) return refuse(403, "Only the assignment's teacher or an admin can review a check-in.");
  if (ctx.state === "signed_off") return refuse(409, "This stage has already been signed off.");
  if (ctx.state !== "checked_in")
    return refuse(409, `There is no check-in to review: this stage is ${STATE_WORDS[ctx.state]}.`);
  return transition === "signOff" ? signedOff(ctx) : moved("open", "needs_more_time");
}

export function decide(transition: Transition, ctx: DecideContext): Decision {
  if (!canSee(ctx.actor)) return refuse(404, "Assignment not found.");
  if (ctx.assignmentStatus === "withdrawn")
    return refuse(409, "This assignment has been withdrawn; its stages can't change.");
  switch (transition) {
    case "checkIn":
      return checkIn(ctx);
    case "withdraw":
      return withdraw(ctx);
    case "signOff":
    case "needsMoreTime":
      return review(transition, ctx);
  }
}
