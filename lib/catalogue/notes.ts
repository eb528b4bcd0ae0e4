// Margin notes on a tune (issue 5 item 6): private to their writer, and only on a tune the writer
// may open. Another person's note answers 404, exactly like a note that does not exist.
import type { Tx as Db } from "@/db/queries/auth";
import { createNote, deleteNote, listNotes, updateNote, type NoteRow } from "@/db/queries/notes";
import { notFound } from "@/lib/auth/errors";
import type { Viewer } from "./access";
import type { NoteJson } from "./api-types";
import { openTune } from "./tune";

const json = (n: NoteRow): NoteJson => ({
  id: n.id,
  bar: n.bar,
  body: n.body,
  createdAt: n.createdAt.toISOString(),
  updatedAt: n.updatedAt.toISOString(),
});
const NO_NOTE = "We couldn't find that note.";

type Writer = NonNullable<Viewer>;

export async function notesOn(db: Db, writer: Writer, tuneId: string): Promise<NoteJson[]> {
  const { tune } = await openTune(db, writer, tuneId);
  return (await listNotes(db, writer.id, tune.id)).map(json);
}

export async function addNote(
  db: Db,
  writer: Writer,
  tuneId: string,
  v: { bar: number; body: string },
): Promise<NoteJson> {
  const { tune } = await openTune(db, writer, tuneId);
  return json(await createNote(db, writer.id, tune.id, v));
}

export async function changeNote(
  db: Db,
  writer: Writer,
  tuneId: string,
  noteId: string,
  v: { bar?: number; body?: string },
): Promise<NoteJson> {
  const { tune } = await openTune(db, writer, tuneId);
  const row = await updateNote(db, writer.id, tune.id, noteId, v);
  if (!row) throw notFound(NO_NOTE);
  return json(row);
}

export async function removeNote(db: Db, writer: Writer, tuneId: string, noteId: string): Promise<void> {
  const { tune } = await openTune(db, writer, tuneId);
  if (!(await deleteNote(db, writer.id, tune.id, noteId))) throw notFound(NO_NOTE);
}
