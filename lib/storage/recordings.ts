// Check-in recordings: who may upload to which assignment, and who may listen. The browser sends the
// bytes straight to storage through a presigned PUT; the app only sees them again at "complete",
// where the first bytes decide whether it is audio at all (never the file name or declared type).
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { assignments, assignmentStudents, stageStates, uploads } from "@/db/schema";
import { notFound, unprocessable } from "@/lib/auth/errors";
import type { CurrentUser } from "@/lib/auth/current-user";
import { judgeAudio, MAX_RECORDING_BYTES, megabytes, SNIFF_BYTES } from "./audio";
import { deleteObject, GET_URL_SECONDS, headObject, presignGet, presignPut, readStart } from "./s3";

export { MAX_RECORDING_BYTES };

export type UploadTicket = { uploadId: string; url: string; method: "PUT"; headers: Record<string, string> };

const NOT_YOURS = "We couldn't find that assignment.";

/** A presigned upload address for the caller's own active assignment, at a stage that is open. */
export async function startUpload(
  db: Db,
  me: CurrentUser,
  input: { assignmentStudentId: string; stageIndex: number; contentType: string; sizeBytes: number },
): Promise<UploadTicket> {
  const [row] = await db
    .select({ status: assignments.status, state: stageStates.state })
    .from(assignmentStudents)
    .innerJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .leftJoin(
      stageStates,
      and(eq(stageStates.assignmentStudentId, assignmentStudents.id), eq(stageStates.stageIndex, input.stageIndex)),
    )
    .where(and(eq(assignmentStudents.id, input.assignmentStudentId), eq(assignmentStudents.studentId, me.id)));
  // Someone else's assignment is "not found", not "forbidden": its existence is not the caller's business.
  if (!row) throw notFound(NOT_YOURS);
  if (row.status !== "active")
    throw unprocessable("This assignment was withdrawn by your teacher.", { assignmentStudentId: "is withdrawn" });
  if (!row.state)
    throw unprocessable(`This assignment has no stage ${input.stageIndex}.`, { stageIndex: "does not exist" });
  if (row.state !== "open")
    throw unprocessable(
      `Stage ${input.stageIndex} is not open for a check-in (it is ${row.state.replace("_", " ")}).`,
      { stageIndex: "is not open" },
    );
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
  const storageKey = `recordings/${me.id}/${uploadId}`;
  const contentType = input.contentType.toLowerCase();
  await db.insert(uploads).values({
    id: uploadId,
    ownerId: me.id,
    storageKey,
    contentType,
    sizeBytes: input.sizeBytes,
    assignmentStudentId: input.assignmentStudentId,
    stageIndex: input.stageIndex,
    status: "pending",
  });
  const signed = await presignPut(storageKey, contentType, input.sizeBytes);
  return { uploadId, url: signed.url, method: "PUT", headers: signed.headers };
}

/** After the browser's PUT: keep the object if it is audio within the limit, otherwise delete it. */
export async function completeUpload(
  db: Db,
  me: CurrentUser,
  uploadId: string,
): Promise<{ uploadId: string; contentType: string; sizeBytes: number }> {
  const [upload] = await db
    .select()
    .from(uploads)
    .where(and(eq(uploads.id, uploadId), eq(uploads.ownerId, me.id)));
  if (!upload) throw notFound("We couldn't find that upload.");
  if (upload.status === "stored") return { uploadId, contentType: upload.contentType, sizeBytes: upload.sizeBytes };
  if (upload.status === "rejected")
    throw unprocessable("This upload was refused; please choose the recording again.", { uploadId: "was refused" });

  const head = await headObject(upload.storageKey);
  if (!head)
    throw unprocessable("The recording has not arrived yet; please upload it again.", { file: "was not received" });
  const verdict =
    head.sizeBytes > MAX_RECORDING_BYTES
      ? ({ ok: false, reason: "larger than 25 MB" } as const)
      : await judgeAudio(await readStart(upload.storageKey, SNIFF_BYTES), upload.contentType);
  if (!verdict.ok) {
    await deleteObject(upload.storageKey);
    await db.update(uploads).set({ status: "rejected", sizeBytes: head.sizeBytes }).where(eq(uploads.id, uploadId));
    throw unprocessable(`The file was refused: ${verdict.reason}.`, { file: verdict.reason });
  }
  await db
    .update(uploads)
    .set({ status: "stored", contentType: verdict.contentType, sizeBytes: head.sizeBytes })
    .where(eq(uploads.id, uploadId));
  return { uploadId, contentType: verdict.contentType, sizeBytes: head.sizeBytes };
}

/** A presigned playback address: the recording's student, the assignment's teacher or an admin. */
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
      teacherId: assignments.teacherId,
    })
    .from(uploads)
    .leftJoin(assignmentStudents, eq(assignmentStudents.id, uploads.assignmentStudentId))
    .leftJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .where(eq(uploads.id, uploadId));
  const allowed =
    row && (me.role === "admin" || row.ownerId === me.id || (row.teacherId !== null && row.teacherId === me.id));
  if (!row || !allowed || row.status !== "stored") throw notFound("We couldn't find that recording.");
  return { url: await presignGet(row.key, row.contentType), expiresInSeconds: GET_URL_SECONDS };
}
