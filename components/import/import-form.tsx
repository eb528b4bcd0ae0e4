"use client";
// Bulk import (issue 5 item 3): choose a .abc file, watch the progress bar move as the server
// reports each tune, and read one result per tune.
import { useQueryClient } from "@tanstack/react-query";
import { useState, type FormEvent } from "react";
import { z } from "zod";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import type { ImportEvent } from "@/lib/tunes/import";
import { IMPORT_MAX_BYTES } from "@/lib/tunes/import-limits";
import { readNdjson } from "./read-ndjson";
import { ImportResults, type TuneResult } from "./import-results";

// The same limits the route enforces, checked here first so a wrong file fails at once.
const fileCheck = z.object({
  name: z.string().regex(/\.abc$/i, "Choose a file whose name ends in .abc."),
  size: z
    .number()
    .min(1, "The file is empty.")
    .max(
      IMPORT_MAX_BYTES,
      `The most one import takes is ${IMPORT_MAX_BYTES / 1024 / 1024} MB. Split the file into smaller ones.`,
    ),
});

type Phase =
  | { kind: "idle" }
  | { kind: "sending" }
  | { kind: "reading"; total: number }
  | { kind: "done"; saved: number; unchanged: number; failed: number };

export function ImportForm() {
  const client = useQueryClient();
  const [file, setFile] = useState<File | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const [results, setResults] = useState<TuneResult[]>([]);
  const busy = phase.kind === "sending" || phase.kind === "reading";

  const onEvent = (value: unknown): void => {
    const e = value as ImportEvent; // our own route's lines (lib/tunes/import.ts)
    if (e.type === "start") setPhase({ kind: "reading", total: e.total });
    else if (e.type === "tune") setResults((r) => [...r, e]);
    else setPhase({ kind: "done", saved: e.saved, unchanged: e.unchanged, failed: e.failed });
  };

  const submit = async (ev: FormEvent): Promise<void> => {
    ev.preventDefault();
    setError(null);
    setResults([]);
    if (!file) return setError("Choose a .abc file first.");
    const checked = fileCheck.safeParse({ name: file.name, size: file.size });
    if (!checked.success) return setError(checked.error.issues[0]?.message ?? "This file cannot be imported.");
    setPhase({ kind: "sending" });
    try {
      const res = await fetch(`/api/teach/import?name=${encodeURIComponent(file.name)}`, {
        method: "POST",
        body: file,
        headers: { "content-type": "text/plain; charset=utf-8" },
      });
      if (!res.ok || !res.body) {
        const body = (await res.json().catch(() => null)) as { error?: string } | null;
        setPhase({ kind: "idle" });
        return setError(body?.error ?? `The import failed (${res.status}).`);
      }
      await readNdjson(res.body, onEvent);
      await client.invalidateQueries({ queryKey: ["teach-tunes"] });
    } catch {
      setPhase({ kind: "idle" });
      setError(
        "The connection broke during the import. Tunes reported as saved are kept; import the file again to finish (saved tunes are not stored twice).",
      );
    }
  };

  const total = phase.kind === "reading" ? phase.total : results.length;
  return (
    <div className="flex flex-col gap-6">
      <form onSubmit={submit} className="flex flex-col gap-3 rounded-knot border border-line bg-paper p-5">
        <label htmlFor="abc-file" className="font-semibold">
          ABC file
        </label>
        <p id="abc-file-hint" className="text-small text-bark">
          One .abc file of up to {IMPORT_MAX_BYTES / 1024 / 1024} MB and 300 tunes. Each tune starts with an X: line; a
          blank line ends it.
        </p>
        <input
          id="abc-file"
          type="file"
          accept=".abc,text/plain"
          aria-describedby="abc-file-hint"
          disabled={busy}
          onChange={(e) => setFile(e.target.files?.[0] ?? null)}
        />
        <div>
          <Button type="submit" needsScript disabled={busy}>
            {busy ? "Importing…" : "Import the tunes"}
          </Button>
        </div>
      </form>
      {error ? (
        <Alert tone="error" live title="Not imported">
          {error}
        </Alert>
      ) : null}
      {phase.kind !== "idle" ? (
        <div className="flex flex-col gap-1">
          <label htmlFor="import-progress" className="font-semibold">
            {phase.kind === "done"
              ? "Import finished"
              : phase.kind === "sending"
                ? "Sending the file…"
                : `Reading tune ${Math.min(results.length + 1, total)} of ${total}`}
          </label>
          <progress
            id="import-progress"
            className="h-3 w-full accent-cedar"
            max={Math.max(total, 1)}
            value={phase.kind === "sending" ? undefined : results.length}
          />
          {phase.kind === "done" ? (
            <p role="status" className="text-small" data-testid="import-summary">
              {phase.saved} saved, {phase.unchanged} already in your tunes, {phase.failed} with problems.
            </p>
          ) : null}
        </div>
      ) : null}
      <ImportResults results={results} />
    </div>
  );
}
