// Uploads asked for and never completed (the page was closed, the PUT failed) stay "pending" with,
// perhaps, an object in storage that no check-in will ever use. After a day — the presigned PUT
// address lives five minutes (PUT_URL_SECONDS), so nothing can still be on its way — the worker drops
// the row and deletes its object. A day is this project's choice: long enough that no one is mid-way.
import type { Tx as Db } from "@/db/queries/auth";
import { abandonedUploads, dropPendingUpload } from "@/db/queries/uploads";
import { deleteObject } from "./s3";

export const ABANDONED_AFTER_MS = 24 * 60 * 60 * 1000;
const BATCH = 200;

/** Deletes abandoned uploads (objects first, so a failure leaves the row to try again); returns how many. */
export async function cleanAbandonedUploads(db: Db, now: Date): Promise<number> {
  let cleaned = 0;
  for (const u of await abandonedUploads(db, new Date(now.getTime() - ABANDONED_AFTER_MS), BATCH)) {
    await deleteObject(u.storageKey); // S3 answers 204 for a key with no object (AWS S3 API reference: DeleteObject)
    if (await dropPendingUpload(db, u.id)) cleaned++;
  }
  return cleaned;
}
