// Inputs of the teacher's assignment and review routes, checked with the same schemas in the form and
// the route handlers (ENGINEERING.md: zod on both sides). What the rows say (roster, own tune, a
// past date in the chosen zone) is checked in assignments.ts.
import { z } from "zod";
import { stagePlanInput } from "@/lib/tunes/schemas";
import { isSaneDay, MAX_YEAR, MIN_YEAR } from "@/lib/validation/text";

export const MAX_STUDENTS_PER_ASSIGNMENT = 60;
export const MAX_NOTE_CHARS = 2000;
export const MAX_FEEDBACK_CHARS = 4000;
/** Ten hours: a week of long days' practice is already far past what a stage needs (common practice). */
export const MAX_UNLOCK_MINUTES = 600;

const dueLocal = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, "Give the due date and time.")
  .refine(
    (s) => isSaneDay(s.slice(0, 10)) && Number(s.slice(11, 13)) < 24 && Number(s.slice(14, 16)) < 60,
    `Give a real date and time, in the years ${MIN_YEAR}–${MAX_YEAR}.`,
  );
const unlockRule = z.enum(["teacher_sign_off", "self_check_in"], "Choose how the next stage unlocks.");
const unlockMinutes = z.coerce
  .number("Give the practice minutes as a number.")
  .int("Give whole minutes.")
  .min(1, "At least 1 minute.")
  .max(MAX_UNLOCK_MINUTES, `At most ${MAX_UNLOCK_MINUTES} minutes.`)
  .nullable()
  .default(null);
const note = z.string().max(MAX_NOTE_CHARS, `Keep the note under ${MAX_NOTE_CHARS} characters.`);

export const assignmentCreateInput = z.object({
  tuneId: z.uuid("Choose a tune."),
  studentIds: z
    .array(z.uuid("Unknown student."), "Choose at least one student.")
    .min(1, "Choose at least one student.")
    .max(MAX_STUDENTS_PER_ASSIGNMENT, `At most ${MAX_STUDENTS_PER_ASSIGNMENT} students in one assignment.`),
  dueLocal,
  stagePlan: stagePlanInput.nullable().default(null),
  unlockRule: unlockRule.default("teacher_sign_off"),
  unlockMinutes,
  note: note.default(""),
});
export type AssignmentCreateInput = z.output<typeof assignmentCreateInput>;

export const assignmentId = z.object({ id: z.uuid("Unknown assignment.") });

/** The assignment lists, a page at a time: the teacher's (GET /api/teach/assignments?page=N) and the student's (/learn/assignments?page=N). */
export const ASSIGNMENTS_PAGE_SIZE = 20;
export const assignmentsPage = z.object({
  page: z.coerce
    .number("The page must be a number.")
    .int("The page must be a whole number.")
    .min(1, "Pages start at 1.")
    .max(100_000, "There are not that many pages.")
    .default(1),
});

export const assignmentEditInput = assignmentId.extend({
  dueLocal: dueLocal.optional(),
  stagePlan: stagePlanInput.nullable().optional(),
  unlockRule: unlockRule.optional(),
  unlockMinutes: unlockMinutes.optional(),
  note: note.optional(),
});
export type AssignmentEditInput = z.output<typeof assignmentEditInput>;

export const reviewInput = z.object({
  checkInId: z.uuid("Unknown check-in."),
  outcome: z.enum(["signed_off", "needs_more_time"], "Choose sign off or needs more time."),
  feedback: z
    .string()
    .trim()
    .max(MAX_FEEDBACK_CHARS, `Keep the feedback under ${MAX_FEEDBACK_CHARS} characters.`)
    .default(""),
});
