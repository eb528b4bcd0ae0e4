// The teacher's view of check-ins that opened the next stage by themselves (self-paced courses): the
// teacher still sees each one and may leave the student a word. A word changes no stage, so it is no
// transition: it only fills the check-in's feedback once and mails it.
import { z } from "zod";
import { eq } from "drizzle-orm";
import type { Tx } from "@/db/queries/auth";
import { selfCheckIns } from "@/db/queries/climb";
import { lockStage } from "@/db/queries/teaching";
import { checkIns } from "@/db/schema";
import { conflict, notFound } from "@/lib/auth/errors";
import type { Manager } from "./assignments";
import { mailFeedback } from "./teach-feedback-mail";

/** How far back the list looks. */
export const SELF_CHECK_IN_DAYS = 30;

export type SelfCheckIn = {
  checkInId: string;
  createdAt: string;
  student: { id: string; name: string };
  tune: { id: string; title: string };
  courseTitle: string;
  stage: { index: number; name: string };
  selfRating: number;
  fromMemory: boolean;
  uploadId: string | null;
  /** The teacher's word, once given. */
  comment: string | null;
};

export async function selfCheckInList(db: Tx, me: Manager, now: Date): Promise<SelfCheckIn[]> {
  const since = new Date(now.getTime() - SELF_CHECK_IN_DAYS * 86_400_000);
  const rows = await selfCheckIns(db, me.role === "admin" ? null : me.id, since, 50);
  return rows.map((r) => ({
    checkInId: r.checkInId,
    createdAt: r.createdAt.toISOString(),
    student: { id: r.studentId, name: r.studentName },
    tune: { id: r.tuneId, title: r.tuneTitle },
    courseTitle: r.courseTitle,
    stage: { index: r.stageIndex, name: r.stageName ?? `Stage ${r.stageIndex}` },
    selfRating: r.selfRating,
    fromMemory: r.fromMemory,
    uploadId: r.uploadId,
    comment: r.feedback,
  }));
}

export const commentInput = z.object({
  checkInId: z.uuid("Unknown check-in."),
  comment: z
    .string({ error: "Write your word to the student." })
    .trim()
    .min(1, "Write your word to the student.")
    .max(4000, "Keep the word under 4,000 characters."),
});

/** The teacher's one word on a check-in that needed no review; it is mailed to the student. */
export async function commentOnCheckIn(db: Tx, me: Manager, checkInId: string, comment: string, now: Date) {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({
        stageStateId: checkIns.stageStateId,
        selfSignedOff: checkIns.selfSignedOff,
        feedback: checkIns.feedback,
      })
      .from(checkIns)
      .where(eq(checkIns.id, checkInId))
      .for("update");
    const stage = row ? await lockStage(tx, row.stageStateId) : null;
    // Someone else's student's check-in is "not found", as in the review queue.
    if (!row || !stage || (me.role !== "admin" && stage.teacherId !== me.id))
      throw notFound("We couldn't find that check-in.");
    if (!row.selfSignedOff) throw conflict("This check-in is reviewed in the review queue.");
    if (row.feedback) throw conflict("You have already left a word on this check-in.");
    await tx.update(checkIns).set({ feedback: comment, reviewedBy: me.id }).where(eq(checkIns.id, checkInId));
    await mailFeedback(tx, stage, checkInId, comment, "comment", null);
    return { checkInId, comment, at: now.toISOString() };
  });
}
