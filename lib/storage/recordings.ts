// Check-in recordings: who may upload to which assignment, and who may listen. The browser sends the
// bytes straight to storage through a presigned PUT; the app only sees them again at "complete",
// where they are copied out of the upload's reach and the copy's first bytes decide whether it is
// audio at all (never the file name or declared type).
import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { assignments, assignmentStudents, enrolments, enrolmentTunes, stageStates, uploads } from "@/db/schema";
import { notFound, unprocessable } from "@/lib/auth/errors";
import type { CurrentUser } from "@/lib/auth/current-user";
import { judgeAudio, MAX_RECORDING_BYTES, megabytes, SNIFF_BYTES } from "./audio";
import { climbStageRow } from "@/lib/teaching/course-check-in";
import { copyObject, deleteObject, GET_URL_SECONDS, headObject, presignGet, presignPut, readStart } from "./s3";

export { MAX_RECORDING_BYTES };

export type UploadTicket = { uploadId: string; url: string; method: "PUT"; headers: Record<string, string> };

const NOT_YOURS = "We couldn't find that assignment.";

/** Where the browser's PUT goes: a key of its own, never the one played back. */
const incomingKey = (ownerId: string, uploadId: string) => `incoming/${ownerId}/${uploadId}`;
/** Where the checked recording lives: no presigned PUT is ever made for it, so nobody can replace it. */
const storedKey = (ownerId: string, uploadId: string) => `recordings/${ownerId}/${uploadId}`;

type Holder = { assignmentStudentId: string | null; enrolmentTuneId: string | null };

/** The assignment's stage the upload is for: the caller's own, active, and the stage open. */
async function assignmentHolder(
  db: Db,
  me: CurrentUser,
  assignmentStudentId: string,
  stageIndex: number,
): Promise<Holder> {
  const [row] = await db
    .select({ status: assignments.status, state: stageStates.state })
    .from(assignmentStudents)
    .innerJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .leftJoin(
      stageStates,
      and(eq(stageStates.assignmentStudentId, assignmentStudents.id), eq(stageStates.stageIndex, stageIndex)),
    )
    .where(and(eq(assignmentStudents.id, assignmentStudentId), eq(assignmentStudents.studentId, me.id)));
  // Someone else's assignment is "not found", not "forbidden": its existence is not the caller's business.
  if (!row) throw notFound(NOT_YOURS);
  if (row.status !== "active")
    throw unprocessable("This assignment was withdrawn by your teacher.", { assignmentStudentId: "is withdrawn" });
  if (!row.state) throw unprocessable(`This assignment has no stage ${stageIndex}.`, { stageIndex: "does not exist" });
  if (row.state !== "open") throw notOpen(stageIndex, row.state);
  return { assignmentStudentId, enrolmentTuneId: null };
}

const notOpen = (stageIndex: number, state: string) =>
  unprocessable(`Stage ${stageIndex} is not open for a check-in (it is ${state.replace("_", " ")}).`, {
    stageIndex: "is not open",
  });

/** A presigned upload address for the caller's own assignment or course tune, at a stage that is open. */
export async function startUpload(
  db: Db,
  me: CurrentUser,
  input: { assignmentStudentId?: string; tuneId?: string; stageIndex: number; contentType: string; sizeBytes: number },
): Promise<UploadTicket> {
  let holder: Holder;
  if (input.assignmentStudentId) holder = await assignmentHolder(db, me, input.assignmentStudentId, input.stageIndex);
  else {
    const row = await climbStageRow(db, me, input.tuneId ?? "", input.stageIndex, new Date());
    if (row.state !== "open") throw notOpen(input.stageIndex, row.state);
    holder = { assignmentStudentId: null, enrolmentTuneId: row.placeId };
  }
  if (input.sizeBytes > MAX_RECORDING_BYTES) {
    throw unprocessable(`The recording is ${megabytes(input.sizeBytes)}; the limit is 25 MB.`, {
      sizeBytes: "is larger than 25 MB",
    });
  }
  if (!/^audio\//i.test(input.contentType)) {
    throw unprocessable("Only audio recordings can be uploaded.", {
      contentType: `must be an audio type, not ${input.contentType}`,
    });
  }

  const uploadId = randomUUID();
  const storageKey = incomingKey(me.id, uploadId);
  const contentType = input.contentType.toLowerCase();
  await db.insert(uploads).values({
    id: uploadId,
    ownerId: me.id,
    storageKey,
    contentType,
    sizeBytes: input.sizeBytes,
    ...holder,
    stageIndex: input.stageIndex,
    status: "pending",
  });
  const signed = await presignPut(storageKey, contentType, input.sizeBytes);
  return { uploadId, url: signed.url, method: "PUT", headers: signed.headers };
}

type StoredUpload = { uploadId: string; contentType: string; sizeBytes: number };

/**
 * After the browser's PUT: the bytes are copied to a key no upload address names, and that copy is
 * checked (audio within the limit) — so what is checked is what is played, and the upload address,
 * still valid for a few minutes, can only write to a key nobody reads. A refused copy is deleted.
 */
export async function completeUpload(db: Db, me: CurrentUser, uploadId: string): Promise<StoredUpload> {
  // One completion at a time per upload (the row locked): a second one waits and finds it decided.
  const outcome = await db.transaction(async (tx): Promise<StoredUpload | { refused: string }> => {
    const [upload] = await tx
      .select()
      .from(uploads)
      .where(and(eq(uploads.id, uploadId), eq(uploads.ownerId, me.id)))
      .for("update");
    if (!upload) throw notFound("We couldn't find that upload.");
    if (upload.status === "stored") return { uploadId, contentType: upload.contentType, sizeBytes: upload.sizeBytes };
    if (upload.status === "rejected")
      throw unprocessable("This upload was refused; please choose the recording again.", { uploadId: "was refused" });

    const stored = storedKey(upload.ownerId, upload.id);
    // Copied unless an earlier completion copied it and stopped before saying so.
    if (await headObject(upload.storageKey)) {
      await copyObject(upload.storageKey, stored, upload.contentType);
      await deleteObject(upload.storageKey);
    }
    const head = await headObject(stored);
    if (!head)
      throw unprocessable("The recording has not arrived yet; please upload it again.", { file: "was not received" });
    const verdict =
      head.sizeBytes > MAX_RECORDING_BYTES
        ? ({ ok: false, reason: "larger than 25 MB" } as const)
        : await judgeAudio(await readStart(stored, SNIFF_BYTES), upload.contentType);
    if (!verdict.ok) {
      await deleteObject(stored);
      await tx.update(uploads).set({ status: "rejected", sizeBytes: head.sizeBytes }).where(eq(uploads.id, uploadId));
      // Said after the transaction commits the refusal.
      return { refused: verdict.reason };
    }
    await tx
      .update(uploads)
      .set({ status: "stored", storageKey: stored, contentType: verdict.contentType, sizeBytes: head.sizeBytes })
      .where(eq(uploads.id, uploadId));
    return { uploadId, contentType: verdict.contentType, sizeBytes: head.sizeBytes };
  });
  if ("refused" in outcome) throw unprocessable(`The file was refused: ${outcome.refused}.`, { file: outcome.refused });
  return outcome;
}

/** A presigned playback address: the recording's student, their teacher (assignment or enrolment) or an admin. */
export async function playbackUrl(
  db: Db,
  me: CurrentUser,
  uploadId: string,
): Promise<{ url: string; expiresInSeconds: number }> {
  const [row] = await db
    .select({
      ownerId: uploads.ownerId,
      key: uploads.storageKey,
      contentType: uploads.contentType,
      status: uploads.status,
      teacherId: sql<string | null>`coalesce(${assignments.teacherId}, ${enrolments.teacherId})`,
    })
    .from(uploads)
    .leftJoin(assignmentStudents, eq(assignmentStudents.id, uploads.assignmentStudentId))
    .leftJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .leftJoin(enrolmentTunes, eq(enrolmentTunes.id, uploads.enrolmentTuneId))
    .leftJoin(enrolments, eq(enrolments.id, enrolmentTunes.enrolmentId))
    .where(eq(uploads.id, uploadId));
  const allowed =
    row && (me.role === "admin" || row.ownerId === me.id || (row.teacherId !== null && row.teacherId === me.id));
  if (!row || !allowed || row.status !== "stored") throw notFound("We couldn't find that recording.");
  return { url: await presignGet(row.key, row.contentType), expiresInSeconds: GET_URL_SECONDS };
}
