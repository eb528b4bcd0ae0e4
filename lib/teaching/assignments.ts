// Assign, edit and withdraw (issue 6 item 1). A teacher assigns their own tunes to students on their
// own roster; an admin any tune to any student. Someone else's assignment answers 404 like a
// missing one (lib/tunes/access.ts makes the same choice for tunes).
import type { Tx } from "@/db/queries/auth";
import { findTune, type TuneRow } from "@/db/queries/tunes";
import {
  assignableStudents,
  countCheckIns,
  deleteStageStates,
  findAssignment,
  insertAssignment,
  insertAssignmentStudents,
  insertStageStates,
  lockAssignment,
  studentsOfAssignment,
  updateAssignment,
  withdrawWaitingCheckIns,
  type AssignmentRow,
} from "@/db/queries/teaching-assign";
import { findUserById } from "@/db/queries/auth";
import { conflict, notFound, unprocessable } from "@/lib/auth/errors";
import { appLink } from "@/lib/auth/links";
import type { Role } from "@/lib/auth/permissions";
import { enqueueEmail } from "@/lib/mail/outbox";
import { checkTune } from "@/lib/tunes/check";
import { storedTurns } from "@/lib/tunes/schemas";
import type { AssignmentCreateInput, AssignmentEditInput } from "./teach-schemas";
import { assignmentStages } from "./teach-stages";
import { dueForMail, isTimeZone, zonedLocalToInstant } from "./teach-time";

export type Manager = { id: string; role: Role };
type Errors = Record<string, string>;

const scopeOf = (me: Manager) => (me.role === "admin" ? null : me.id);

/** The zone a due date is typed in: the student's own when there is one, else the teacher's (shared design). */
export function formZone(students: { timeZone: string }[], teacherZone: string): string {
  const zone = students.length === 1 ? students[0].timeZone : teacherZone;
  return isTimeZone(zone) ? zone : "UTC";
}

export async function managedAssignment(db: Tx, me: Manager, id: string): Promise<AssignmentRow> {
  const row = await findAssignment(db, id);
  if (!row || (me.role !== "admin" && row.teacherId !== me.id))
    throw notFound("We couldn't find that assignment among yours.");
  return row;
}

function checkDue(dueLocal: string, zone: string, now: Date, errors: Errors): Date | null {
  const due = zonedLocalToInstant(dueLocal, zone);
  if (!due) errors.dueLocal = "Give a real date and time.";
  else if (due.getTime() <= now.getTime()) errors.dueLocal = `The due date is in the past (times are in ${zone}).`;
  return due;
}

function checkPlan(tune: TuneRow, plan: AssignmentCreateInput["stagePlan"], errors: Errors): void {
  if (!plan) return;
  const check = checkTune(tune.abc, {
    stagePlan: plan,
    acceptedSwaps: tune.acceptedSwaps,
    turnedBars: storedTurns(tune.turnedBars),
  });
  if (!check.ok)
    errors.stagePlan = check.planReasons.join(" ") || "This stage plan doesn't make clean stages of this tune.";
}

function checkRule(rule: "teacher_sign_off" | "self_check_in", minutes: number | null, errors: Errors): number | null {
  if (rule === "teacher_sign_off") return null;
  if (minutes === null)
    errors.unlockMinutes = "Give the practice minutes a student needs before their own check-in opens the next stage.";
  return minutes;
}

/** jsonb keeps its own key order, so plans are compared by their stages' names and kinds. */
function samePlan(
  a: { stages: { name: string; adds: readonly string[] }[] } | null,
  b: { stages: { name: string; adds: readonly string[] }[] } | null,
): boolean {
  const text = (p: typeof a) => (p ? p.stages.map((s) => `${s.name}:${[...s.adds].sort().join(",")}`).join("|") : "");
  return text(a) === text(b);
}

function fail(errors: Errors): void {
  const fields = Object.keys(errors);
  if (fields.length) throw unprocessable(errors[fields[0]], errors);
}

async function mailNew(
  tx: Tx,
  s: { email: string; name: string; timeZone: string },
  asId: string,
  a: { teacherName: string; tuneTitle: string; dueAt: Date; note: string },
) {
  await enqueueEmail(tx, {
    to: s.email,
    template: "assignment-new",
    data: {
      studentName: s.name,
      teacherName: a.teacherName,
      tuneTitle: a.tuneTitle,
      dueLocal: dueForMail(a.dueAt, isTimeZone(s.timeZone) ? s.timeZone : "UTC"),
      note: a.note,
      assignmentUrl: appLink(`/learn/assignments/${asId}`),
    },
    dedupeKey: `assignment-new:${asId}`,
  });
}

export async function createAssignment(
  db: Tx,
  me: Manager,
  input: AssignmentCreateInput,
  now: Date,
): Promise<{ id: string; assignmentStudentIds: string[] }> {
  const errors: Errors = {};
  const tune = await findTune(db, input.tuneId);
  if (!tune || (me.role !== "admin" && tune.teacherId !== me.id)) errors.tuneId = "Choose one of your own tunes.";
  const ids = [...new Set(input.studentIds)];
  const students = await assignableStudents(db, scopeOf(me), ids);
  if (students.length !== ids.length) {
    const missing = ids.length - students.length;
    errors.studentIds =
      missing === 1
        ? "One of the chosen students is not on your roster."
        : `${missing} of the chosen students are not on your roster.`;
  }
  const teacher = await findUserById(db, me.id);
  const due = checkDue(input.dueLocal, formZone(students, teacher?.timeZone ?? "UTC"), now, errors);
  if (tune) checkPlan(tune, input.stagePlan, errors);
  const unlockMinutes = checkRule(input.unlockRule, input.unlockMinutes, errors);
  fail(errors);
  if (!tune || !due) throw new Error("unreachable: errors were raised above");

  return db.transaction(async (tx) => {
    const stages = await assignmentStages(tx, tune.id, input.stagePlan);
    if (!stages.length)
      throw unprocessable("This tune has no stages yet; save it in the tune editor first.", {
        tuneId: "This tune has no stages yet.",
      });
    const id = await insertAssignment(tx, {
      teacherId: me.id,
      tuneId: tune.id,
      dueAt: due,
      stagePlan: input.stagePlan,
      unlockRule: input.unlockRule,
      unlockMinutes,
      note: input.note,
      createdAt: now,
      updatedAt: now,
    });
    // Every student's row, then every stage row, each in one statement; then one e-mail each.
    const assignmentStudentIds = await insertAssignmentStudents(
      tx,
      id,
      students.map((s) => s.id),
    );
    await insertStageStates(tx, assignmentStudentIds, stages.length, now);
    for (const [i, s] of students.entries()) {
      await mailNew(tx, s, assignmentStudentIds[i], {
        teacherName: teacher?.name ?? "Your teacher",
        tuneTitle: tune.title,
        dueAt: due,
        note: input.note,
      });
    }
    return { id, assignmentStudentIds };
  });
}

export async function editAssignment(db: Tx, me: Manager, input: AssignmentEditInput, now: Date): Promise<void> {
  await db.transaction(async (tx) => {
    const found = await managedAssignment(tx, me, input.id);
    const a = (await lockAssignment(tx, found.id)) as AssignmentRow;
    if (a.status === "withdrawn") throw conflict("This assignment has been withdrawn; it can't be changed.");
    const errors: Errors = {};
    const set: Partial<AssignmentRow> = { updatedAt: now };
    if (input.dueLocal !== undefined) {
      const teacher = await findUserById(tx, a.teacherId);
      const due = checkDue(
        input.dueLocal,
        formZone(await studentsOfAssignment(tx, a.id), teacher?.timeZone ?? "UTC"),
        now,
        errors,
      );
      if (due) set.dueAt = due;
    }
    if (input.note !== undefined) set.note = input.note;
    const rule = input.unlockRule ?? a.unlockRule;
    if (input.unlockRule !== undefined || input.unlockMinutes !== undefined) {
      set.unlockRule = rule;
      set.unlockMinutes = checkRule(
        rule,
        input.unlockMinutes === undefined ? a.unlockMinutes : input.unlockMinutes,
        errors,
      );
    }
    const planChanged = input.stagePlan !== undefined && !samePlan(input.stagePlan, a.stagePlan);
    if (planChanged) {
      const tune = (await findTune(tx, a.tuneId)) as TuneRow;
      checkPlan(tune, input.stagePlan ?? null, errors);
      // Stages already checked in would lose their meaning if the plan changed under them.
      if (!errors.stagePlan && (await countCheckIns(tx, a.id)) > 0)
        errors.stagePlan = "Students have checked in already, so the stage plan stays as it is.";
      set.stagePlan = input.stagePlan ?? null;
    }
    fail(errors);
    await updateAssignment(tx, a.id, set);
    if (planChanged) {
      const stages = await assignmentStages(tx, a.tuneId, input.stagePlan ?? null);
      await deleteStageStates(tx, a.id);
      const students = await studentsOfAssignment(tx, a.id);
      await insertStageStates(
        tx,
        students.map((s) => s.assignmentStudentId),
        stages.length,
        now,
      );
    }
  });
}

/**
 * Withdrawn assignments stay for the record; their stages no longer change (state-machine.ts refuses),
 * and a check-in still waiting for review is withdrawn with them: no one will review it now.
 */
export async function withdrawAssignment(db: Tx, me: Manager, id: string, now: Date): Promise<void> {
  await db.transaction(async (tx) => {
    const found = await managedAssignment(tx, me, id);
    const a = (await lockAssignment(tx, found.id)) as AssignmentRow;
    if (a.status === "withdrawn") throw conflict("This assignment is already withdrawn.");
    await updateAssignment(tx, a.id, { status: "withdrawn", updatedAt: now });
    await withdrawWaitingCheckIns(tx, a.id);
  });
}
