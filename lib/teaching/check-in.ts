// The student's check-in on an open stage and its withdrawal before review (issue 6 item 3). The
// state change itself is applyTransition's (./transitions.ts: the stage row locked FOR UPDATE, the
// one-waiting-check-in unique index); here the student's own assignment, the input and the
// membership gate are checked first, so that someone else's assignment or check-in answers 404.
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import type { Tx as Db } from "@/db/queries/auth";
import { checkInOwner } from "@/db/queries/learning";
import { stageStates } from "@/db/schema";
import { forbidden, notFound, unprocessable } from "@/lib/auth/errors";
import { musicGate, ownAssignment, type Person } from "./learn-assignment";
import { applyTransition, type ApplyResult } from "./transitions";
import { scheduleListeningSafely } from "@/lib/jobs/listen";

export type CheckInRequest = {
  assignmentStudentId: string;
  stageIndex: number;
  uploadId: string;
  selfRating: number;
  fromMemory: boolean;
};

const checkInSchema = z.object({
  stageIndex: z
    .number({ error: "Say which stage you are checking in." })
    .int("The stage must be a whole number.")
    .min(1, "The stage must be 1 or more."),
  uploadId: z.uuid("Add a recording: record one or choose a file, and wait for it to upload."),
  selfRating: z
    .number({ error: "Rate how it went, from 1 to 5." })
    .int("Rate how it went with a whole number from 1 to 5.")
    .min(1, "Rate how it went, from 1 to 5.")
    .max(5, "Rate how it went, from 1 to 5."),
  fromMemory: z.boolean({ error: "Say whether you played from memory (yes or no)." }),
});

/** The request body as the route gets it, checked field by field (422 with the field). */
export function parseCheckIn(raw: Record<string, unknown>): Omit<CheckInRequest, "assignmentStudentId"> {
  const v = { ...raw };
  // A form may send numbers as text.
  for (const k of ["stageIndex", "selfRating"] as const)
    if (typeof v[k] === "string" && v[k] !== "") v[k] = Number(v[k]);
  if (v.fromMemory === undefined) v.fromMemory = false;
  const parsed = checkInSchema.safeParse(v);
  if (parsed.success) return parsed.data;
  const fieldErrors: Record<string, string> = {};
  for (const issue of parsed.error.issues) fieldErrors[String(issue.path[0] ?? "form")] ??= issue.message;
  throw unprocessable("Please check the highlighted fields.", fieldErrors);
}

async function stageRowId(db: Db, assignmentStudentId: string, stageIndex: number): Promise<string | null> {
  const rows = await db
    .select({ id: stageStates.id })
    .from(stageStates)
    .where(and(eq(stageStates.assignmentStudentId, assignmentStudentId), eq(stageStates.stageIndex, stageIndex)))
    .limit(1);
  return rows[0]?.id ?? null;
}

/**
 * Checks in a recording on the student's open stage: a check-in waiting for review, or — under the
 * self_check_in rule with enough practice minutes — signed off at once with the next stage opened.
 */
export async function checkIn(db: Db, actor: Person, req: CheckInRequest, now = new Date()): Promise<ApplyResult> {
  const row = await ownAssignment(db, actor, req.assignmentStudentId);
  const stageStateId = await stageRowId(db, row.assignmentStudentId, req.stageIndex);
  if (!stageStateId) throw notFound(`This assignment has no stage ${req.stageIndex}.`);
  const gate = await musicGate(db, actor, row.tuneId, now);
  if (!gate.open) throw forbidden(gate.why);
  const result = await applyTransition(db, {
    stageStateId,
    transition: "checkIn",
    actor,
    checkInInput: { uploadId: req.uploadId, selfRating: req.selfRating, fromMemory: req.fromMemory },
    now,
  });
  // The listening aid hears the recording on the worker; it is queued after the check-in is saved and
  // can never undo it (lib/jobs/listen.ts).
  await scheduleListeningSafely(result.checkInId, db);
  return result;
}

/** Takes back one's own check-in while it still waits for review; the stage is open again. */
export async function withdrawCheckIn(
  db: Db,
  actor: Person,
  checkInId: string,
  now = new Date(),
): Promise<ApplyResult> {
  const owner = await checkInOwner(db, checkInId);
  if (!owner || owner.studentId !== actor.id) throw notFound("We couldn't find that check-in.");
  return applyTransition(db, { stageStateId: owner.stageStateId, transition: "withdraw", actor, checkInId, now });
}
