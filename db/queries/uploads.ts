// SQL for recordings' upload rows that lib/storage/cleanup.ts tidies away.
import { and, asc, eq, lt } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { uploads } from "../schema";

/** Uploads still pending (never completed) that were asked for before `before`, oldest first. */
export async function abandonedUploads(db: Db, before: Date, limit: number) {
  return db
    .select({ id: uploads.id, storageKey: uploads.storageKey })
    .from(uploads)
    .where(and(eq(uploads.status, "pending"), lt(uploads.createdAt, before)))
    .orderBy(asc(uploads.createdAt))
    .limit(limit);
}

/** Drops one upload row if it is still pending (a completion in between keeps it). */
export async function dropPendingUpload(db: Db, id: string): Promise<boolean> {
  const gone = await db
    .delete(uploads)
    .where(and(eq(uploads.id, id), eq(uploads.status, "pending")))
    .returning({ id: uploads.id });
  return gone.length > 0;
}
