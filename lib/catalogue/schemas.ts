// Inputs of the tune page's forms and routes, validated with the same schemas in the browser and
// in the route handlers (ENGINEERING.md: zod on both sides).
import { z } from "zod";
import { COMPARE_MAX, MAX_BAR, NOTE_MAX } from "./limits";

export { COMPARE_MAX, MAX_BAR, NOTE_MAX };

export const noteInput = z.object({
  bar: z.coerce
    .number({ message: "Choose a bar." })
    .int("Choose a whole bar number.")
    .min(0, "Bars start at 0 (the pickup).")
    .max(MAX_BAR, `Bars go up to ${MAX_BAR}.`),
  body: z
    .string()
    .trim()
    .min(1, "Write something in the note.")
    .max(NOTE_MAX, `Keep a note under ${NOTE_MAX} characters.`),
});
export type NoteInput = z.infer<typeof noteInput>;

export const compareInput = z.object({
  abc: z
    .string()
    .trim()
    .min(1, "Paste the other setting's ABC.")
    .max(COMPARE_MAX, `That is longer than one tune (${COMPARE_MAX} characters at most).`)
    // ABC 2.1 §3 "the K: field is always the last field in the tune header".
    .refine((s) => /^K:/m.test(s), "An ABC tune needs a K: (key) line before its music."),
  on: z.enum(["source", "skeleton"]).default("source"),
});
export type CompareInput = z.input<typeof compareInput>;

/** The first message per field, for showing beside each control. */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) out[String(issue.path[0] ?? "form")] ??= issue.message;
  return out;
}
