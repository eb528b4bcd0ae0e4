"use client";
// The ABC text and, under it, every problem and note at its line and column; choosing one puts the
// caret there, so the teacher goes straight to the mistake. Problems stop a save (the music could
// not be read as written); notes do not (a bar longer than the meter, a field ABC does not define).
import { useRef, useState } from "react";
import { controlClasses } from "@/components/ui/input";
import { cx } from "@/components/ui/cx";
import type { Problem } from "@/lib/abc/types";

export interface AbcSourceProps {
  value: string;
  onChange: (abc: string) => void;
  problems: readonly Problem[];
  notes: readonly Problem[];
  checking: boolean;
}

/** Offset of a 1-based line and column in the text (clamped to the text). */
function offsetOf(text: string, line: number, column: number): number {
  const lines = text.split("\n");
  let offset = 0;
  for (let i = 0; i < Math.min(line - 1, lines.length - 1); i++) offset += (lines[i]?.length ?? 0) + 1;
  return Math.min(offset + Math.max(0, column - 1), text.length);
}

function caretAt(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset).split("\n");
  return { line: before.length, column: (before[before.length - 1]?.length ?? 0) + 1 };
}

const plural = (n: number, word: string): string => `${n} ${word}${n === 1 ? "" : "s"}`;

export function AbcSource({ value, onChange, problems, notes, checking }: AbcSourceProps) {
  const area = useRef<HTMLTextAreaElement>(null);
  const [caret, setCaret] = useState({ line: 1, column: 1 });
  const track = (): void => {
    const el = area.current;
    if (el) setCaret(caretAt(el.value, el.selectionStart));
  };
  const goTo = (p: Problem): void => {
    const el = area.current;
    if (!el) return;
    const at = offsetOf(value, p.line, p.column);
    el.focus();
    el.setSelectionRange(at, Math.min(at + 1, value.length));
    track();
  };
  const lines = value.split("\n").length;
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor="abc-source" className="font-semibold">
        ABC
      </label>
      <textarea
        id="abc-source"
        ref={area}
        value={value}
        spellCheck={false}
        autoCapitalize="off"
        autoCorrect="off"
        rows={Math.min(28, Math.max(12, lines + 1))}
        aria-describedby="abc-caret abc-problems"
        aria-invalid={problems.length ? true : undefined}
        className={cx(controlClasses, "font-mono text-small leading-relaxed")}
        onChange={(e) => {
          onChange(e.target.value);
          track();
        }}
        onSelect={track}
        onKeyUp={track}
        onClick={track}
      />
      <p id="abc-caret" className="text-caption text-bark">
        Caret at line {caret.line}, column {caret.column}
      </p>
      <div id="abc-problems" role="status" aria-live="polite" className="flex flex-col gap-1">
        {checking ? <p className="text-small text-bark">Reading the tune…</p> : null}
        {!checking && problems.length === 0 && notes.length === 0 ? (
          <p className="text-small font-semibold text-spruce">No problems found in the ABC.</p>
        ) : null}
        {problems.length ? (
          <>
            <p className="text-small font-semibold text-berry">
              {plural(problems.length, "problem")} in the ABC: the tune cannot be saved until{" "}
              {problems.length === 1 ? "it is" : "they are"} fixed.
            </p>
            <ProblemList list={problems} testId="abc-problems" tone="problem" onChoose={goTo} />
          </>
        ) : null}
        {notes.length ? (
          <>
            <p className="text-small font-semibold text-slate">
              {plural(notes.length, "note")} on the ABC{problems.length ? "" : ": the tune can be saved as it is"}.
            </p>
            <ProblemList list={notes} testId="abc-notes" tone="note" onChoose={goTo} />
          </>
        ) : null}
      </div>
    </div>
  );
}

function ProblemList({
  list,
  testId,
  tone,
  onChoose,
}: {
  list: readonly Problem[];
  testId: string;
  tone: "problem" | "note";
  onChoose: (p: Problem) => void;
}) {
  return (
    <ul className="flex flex-col gap-1" data-testid={testId}>
      {list.map((p, i) => (
        <li key={`${p.line}:${p.column}:${i}`}>
          <button
            type="button"
            onClick={() => onChoose(p)}
            className={cx(
              "w-full rounded-knot border-l-4 px-3 py-1.5 text-left text-small hover:underline",
              tone === "problem" ? "border-berry bg-berry-tint" : "border-slate bg-slate-tint",
            )}
          >
            <span className="font-semibold">
              {tone === "note" ? "Note, line" : "Line"} {p.line}, column {p.column}:
            </span>{" "}
            {p.message}
          </button>
        </li>
      ))}
    </ul>
  );
}
