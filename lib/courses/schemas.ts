// Inputs of the ladder bench's forms and routes, the same schemas in the browser and the route
// handlers (ENGINEERING.md: zod on both sides).
import { z } from "zod";

const title = (what: string) =>
  z.string().trim().min(1, `Give the ${what} a title.`).max(120, `Keep the ${what}'s title under 120 characters.`);
const id = (what: string) => z.uuid(`Unknown ${what}.`);

export const courseId = z.object({ courseId: id("course") });

export const courseInput = z.object({
  title: title("course"),
  summary: z.string().trim().max(600, "Keep the summary under 600 characters.").default(""),
});

export const coursePatch = courseId.extend({
  title: title("course").optional(),
  summary: z.string().trim().max(600, "Keep the summary under 600 characters.").optional(),
  published: z.boolean().optional(),
  // Course settings: who follows new members, and how stages open.
  leadTeacherId: z.uuid("Choose the lead teacher.").optional(),
  pace: z.enum(["self_paced", "teacher_sign_off"], "Choose how the stages open.").optional(),
});

export const gradeInput = courseId.extend({ title: title("grade") });
export const gradeRef = courseId.extend({ gradeId: id("grade") });
export const gradePatch = gradeRef.extend({ title: title("grade") });

const requiredStage = z.coerce
  .number({ message: "Choose a stage." })
  .int("Choose a stage.")
  .min(1, "Stages start at 1 (the skeleton).")
  .max(8, "No tune has more than 8 stages.");

export const rungInput = courseId.extend({
  gradeId: id("grade"),
  tuneId: z.uuid("Choose a tune for the rung."),
  requiredStage,
  isTaster: z.boolean().default(false),
});
export const rungRef = courseId.extend({ rungId: id("rung") });
export const rungPatch = rungRef
  .extend({ requiredStage: requiredStage.optional(), isTaster: z.boolean().optional() })
  .refine((v) => v.requiredStage !== undefined || v.isTaster !== undefined, { message: "Nothing to change." });

export const orderInput = courseId.extend({
  grades: z.array(z.object({ id: id("grade"), rungs: z.array(id("rung")).max(500) })).max(100),
});
