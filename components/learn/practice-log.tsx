"use client";
// The practice log page's body: the form with the cautions beside it, and one's entries to change or delete.
import { useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import { PracticeCautions } from "./practice-cautions";
import { PracticeForm, type PracticeEntry } from "./practice-form";

type LogJson = { entries: PracticeEntry[]; tunes: { id: string; title: string }[] };
const KEY = ["learn", "practice"];

export function PracticeLog({ today }: { today: string }) {
  const client = useQueryClient();
  const q = useQuery({ queryKey: KEY, queryFn: () => fetchJson<LogJson>("/api/learn/practice") });
  const [editing, setEditing] = useState<PracticeEntry | null>(null);
  const [error, setError] = useState<string | null>(null);
  const refresh = () => void client.invalidateQueries({ queryKey: KEY });

  async function remove(entry: PracticeEntry) {
    setError(null);
    try {
      await fetchJson(`/api/learn/practice/${entry.id}`, { method: "DELETE" });
      if (editing?.id === entry.id) setEditing(null);
      refresh();
    } catch (e) {
      setError(errorWords(e));
    }
  }

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,22rem)]">
      <Card as="section" className="flex flex-col gap-4">
        <CardTitle level={2}>{editing ? "Change an entry" : "Log practice"}</CardTitle>
        {q.data ? (
          <PracticeForm
            today={today}
            tunes={q.data.tunes}
            editing={editing}
            onSaved={() => {
              setEditing(null);
              refresh();
            }}
            onCancel={() => setEditing(null)}
          />
        ) : (
          <p role="status" className="text-bark">
            Loading…
          </p>
        )}
      </Card>
      <PracticeCautions />
      <section className="flex flex-col gap-3 lg:col-span-2" aria-labelledby="entries-h">
        <h2 id="entries-h" className="font-serif text-h3 font-semibold">
          Your entries
        </h2>
        {error ? (
          <Alert tone="error" live>
            {error}
          </Alert>
        ) : null}
        {q.isError ? <Alert tone="error">{errorWords(q.error)}</Alert> : null}
        {q.data && q.data.entries.length === 0 ? <p className="text-bark">Nothing logged yet.</p> : null}
        <ul className="flex flex-col gap-2" aria-label="Practice entries">
          {q.data?.entries.map((e) => (
            <li
              key={e.id}
              className="flex flex-wrap items-center justify-between gap-3 rounded-knot border border-line bg-paper px-4 py-3"
            >
              <div>
                <p className="font-semibold">{`${e.practisedOn} · ${e.minutes} min${e.tuneTitle ? ` · ${e.tuneTitle}` : ""}`}</p>
                {e.note ? <p className="text-small text-bark">{e.note}</p> : null}
              </div>
              <div className="flex gap-2">
                <Button
                  size="sm"
                  variant="secondary"
                  onClick={() => setEditing(e)}
                  aria-label={`Edit the entry of ${e.practisedOn}, ${e.minutes} minutes`}
                >
                  Edit
                </Button>
                <Button
                  size="sm"
                  variant="quiet"
                  onClick={() => void remove(e)}
                  aria-label={`Delete the entry of ${e.practisedOn}, ${e.minutes} minutes`}
                >
                  Delete
                </Button>
              </div>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
