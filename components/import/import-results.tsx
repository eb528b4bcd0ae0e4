// One result per tune of the file: saved (with a link to it), already there, or its problems at
// line and column in the file; and its notes, which did not stop the save.
import Link from "next/link";
import type { ImportEvent } from "@/lib/tunes/import";

export type TuneResult = Extract<ImportEvent, { type: "tune" }>;

export function ImportResults({ results }: { results: readonly TuneResult[] }) {
  if (results.length === 0) return null;
  return (
    <ol className="flex flex-col gap-2" aria-label="Result per tune">
      {results.map((r) => (
        <li key={r.n} className="rounded-knot border border-line bg-paper px-4 py-2" data-import-status={r.status}>
          <p>
            <span className="text-bark">
              {r.n}. (line {r.line})
            </span>{" "}
            {r.status === "problems" ? (
              <strong>{r.title}</strong>
            ) : (
              <Link href={`/teach/tunes/${r.tuneId}`} className="font-semibold">
                {r.title}
              </Link>
            )}{" "}
            <span className={r.status === "problems" ? "font-semibold text-berry" : "text-spruce"}>
              —{" "}
              {r.status === "saved"
                ? "saved"
                : r.status === "unchanged"
                  ? "already in your tunes, not saved twice"
                  : "not saved"}
            </span>
          </p>
          {r.status === "problems" ? (
            <ul className="mt-1 list-disc pl-5 text-small" data-testid="import-problems">
              {r.problems.map((p, i) => (
                <li key={i}>{`Line ${p.line}, column ${p.column}: ${p.message}`}</li>
              ))}
            </ul>
          ) : null}
          {r.notes.length ? (
            <ul className="mt-1 list-disc pl-5 text-small text-slate" data-testid="import-notes">
              {r.notes.map((p, i) => (
                <li key={i}>{`Note, line ${p.line}, column ${p.column}: ${p.message}`}</li>
              ))}
            </ul>
          ) : null}
        </li>
      ))}
    </ol>
  );
}
