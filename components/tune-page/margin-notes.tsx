"use client";
// Pencil notes pinned to bars of the tune (issue 5 item 6). Private: the list holds only the signed-in
// person's own notes, as the route hands out nobody else's.
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { errorWords } from "@/lib/catalogue/fetch-json";
import { NoteForm } from "./note-form";
import { useNoteMutations, useNotes } from "./use-notes";

export interface MarginNotesProps {
  tuneId: string;
  bar: number | null;
  onBarChange: (bar: number | null) => void;
}

export function MarginNotes({ tuneId, bar, onBarChange }: MarginNotesProps) {
  const notes = useNotes(tuneId, true);
  const { add, change, remove } = useNoteMutations(tuneId);
  const [editing, setEditing] = useState<string | null>(null);
  const [editBar, setEditBar] = useState<number | null>(null);

  return (
    <section aria-labelledby="notes-title" className="flex flex-col gap-4 rounded-knot border border-line bg-paper p-4">
      <div>
        <h2 id="notes-title" className="font-serif text-h4 font-semibold">
          Margin notes
        </h2>
        <p className="text-small text-bark">Only you can see your notes.</p>
      </div>
      <NoteForm
        bar={bar}
        onBarChange={onBarChange}
        submitLabel="Add note"
        busy={add.isPending}
        onSubmit={(v) => add.mutateAsync(v)}
      />
      {notes.isPending ? (
        <p role="status" className="text-small text-bark">
          Loading your notes…
        </p>
      ) : null}
      {notes.isError ? <Alert tone="error">{errorWords(notes.error)}</Alert> : null}
      {notes.data && notes.data.length === 0 ? (
        <p className="text-small text-bark">No notes on this tune yet.</p>
      ) : null}
      {notes.data && notes.data.length > 0 ? (
        <ul className="flex flex-col divide-y divide-line" aria-label="Your notes">
          {notes.data.map((n) => (
            <li key={n.id} className="flex flex-col gap-2 py-3" data-note-bar={n.bar}>
              {editing === n.id ? (
                <NoteForm
                  bar={editBar}
                  body={n.body}
                  submitLabel="Save note"
                  busy={change.isPending}
                  onBarChange={setEditBar}
                  onCancel={() => setEditing(null)}
                  onSubmit={async (v) => {
                    await change.mutateAsync({ id: n.id, ...v });
                    setEditing(null);
                  }}
                />
              ) : (
                <>
                  <p>
                    <span className="mr-2 rounded-sm bg-sawdust px-1.5 text-small font-semibold">
                      {n.bar === 0 ? "Pickup" : `Bar ${n.bar}`}
                    </span>
                    <span className="whitespace-pre-wrap">{n.body}</span>
                  </p>
                  <div className="flex gap-2">
                    <Button
                      variant="quiet"
                      size="sm"
                      aria-label={`Edit the note on bar ${n.bar}`}
                      onClick={() => {
                        setEditing(n.id);
                        setEditBar(n.bar);
                      }}
                    >
                      Edit
                    </Button>
                    <Button
                      variant="quiet"
                      size="sm"
                      aria-label={`Delete the note on bar ${n.bar}`}
                      disabled={remove.isPending}
                      onClick={() => window.confirm("Delete this note?") && remove.mutate(n.id)}
                    >
                      Delete
                    </Button>
                  </div>
                </>
              )}
            </li>
          ))}
        </ul>
      ) : null}
      {remove.isError ? (
        <Alert tone="error" live>
          {errorWords(remove.error)}
        </Alert>
      ) : null}
    </section>
  );
}
