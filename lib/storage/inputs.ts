// Inputs of the recording routes. Shape only: the 25 MB limit and "audio only" are checked in
// lib/storage/recordings.ts so that they answer 422 naming the field, not a generic 400.
import { z } from "zod";

// For an assignment's stage (assignmentStudentId) or a course's tune the student climbs (tuneId).
export const uploadRequest = z
  .object({
    assignmentStudentId: z.uuid("must be an assignment's id").optional(),
    tuneId: z.uuid("must be a tune's id").optional(),
    stageIndex: z
      .number({ error: "must be a stage number" })
      .int("must be a whole number")
      .min(1, "must be 1 or more")
      .max(50, "must be 50 or less"),
    contentType: z
      .string({ error: "must be the file's type, e.g. audio/wav" })
      .trim()
      .min(1, "must be the file's type, e.g. audio/wav")
      .max(200),
    sizeBytes: z
      .number({ error: "must be the file's size in bytes" })
      .int("must be a whole number of bytes")
      .positive("must be more than 0 bytes"),
  })
  .refine((v) => (v.assignmentStudentId === undefined) !== (v.tuneId === undefined), {
    message: "Say which assignment or which tune the recording is for (one of the two).",
    path: ["assignmentStudentId"],
  });

export const uploadIdInput = z.object({ uploadId: z.uuid("must be an upload's id") });
