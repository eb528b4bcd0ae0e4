// Margin notes: every query names the writer, so a note is only ever read or changed by the
// person who wrote it (another person's note id finds nothing).
import { and, asc, eq } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { marginNotes } from "../schema";
import { isUuid } from "./catalogue";

export type NoteRow = { id: string; tuneId: string; bar: number; body: string; createdAt: Date; updatedAt: Date };

const columns = {
  id: marginNotes.id,
  tuneId: marginNotes.tuneId,
  bar: marginNotes.bar,
  body: marginNotes.body,
  createdAt: marginNotes.createdAt,
  updatedAt: marginNotes.updatedAt,
};

export async function listNotes(db: Db, userId: string, tuneId: string): Promise<NoteRow[]> {
  return db
    .select(columns)
    .from(marginNotes)
    .where(and(eq(marginNotes.userId, userId), eq(marginNotes.tuneId, tuneId)))
    .orderBy(asc(marginNotes.bar), asc(marginNotes.createdAt));
}

export async function createNote(
  db: Db,
  userId: string,
  tuneId: string,
  v: { bar: number; body: string },
): Promise<NoteRow> {
  const rows = await db.insert(marginNotes).values({ userId, tuneId, bar: v.bar, body: v.body }).returning(columns);
  return rows[0];
}

const mine = (userId: string, tuneId: string, noteId: string) =>
  and(eq(marginNotes.id, noteId), eq(marginNotes.userId, userId), eq(marginNotes.tuneId, tuneId));

/** Null when the note is not this writer's (or not on this tune). */
export async function updateNote(
  db: Db,
  userId: string,
  tuneId: string,
  noteId: string,
  v: { bar?: number; body?: string },
): Promise<NoteRow | null> {
  if (!isUuid(noteId)) return null;
  const rows = await db
    .update(marginNotes)
    .set({ ...v, updatedAt: new Date() })
    .where(mine(userId, tuneId, noteId))
    .returning(columns);
  return rows[0] ?? null;
}

export async function deleteNote(db: Db, userId: string, tuneId: string, noteId: string): Promise<boolean> {
  if (!isUuid(noteId)) return false;
  const rows = await db
    .delete(marginNotes)
    .where(mine(userId, tuneId, noteId))
    .returning({ id: marginNotes.id });
  return rows.length > 0;
}
