// `compare` for the tune-engine CLI, kept apart so the main CLI stays small. Each file's first
// tune is compared; each side is checked alone first so a problem names the right file.
import { compareSettings } from "../lib/abc/compare";
import { prepareTune, splitTunes, type Problem } from "../lib/abc/index";

type Sides = { a: Problem[]; b: Problem[] };
export type CompareOutcome = ({ ok: true; value: unknown } | { ok: false; problems: Sides }) & { notes: Sides };

function firstTune(text: string): { abc: string; problems: Problem[]; notes: Problem[] } {
  const t = splitTunes(text)[0];
  if (!t)
    return {
      abc: "",
      problems: [
        { line: 1, column: 1, message: "No tune found: a tune starts with an X: field and needs a K: field." },
      ],
      notes: [],
    };
  const r = prepareTune(t.abc, t.lineOffset);
  return { abc: t.abc, problems: r.ok ? [] : r.problems, notes: r.notes };
}

export function runCompare(a: string, b: string): CompareOutcome {
  const first = firstTune(a);
  const second = firstTune(b);
  const notes = { a: first.notes, b: second.notes };
  if (first.problems.length || second.problems.length)
    return { ok: false, problems: { a: first.problems, b: second.problems }, notes };
  const r = compareSettings(first.abc, second.abc);
  return r.ok ? { ok: true, value: r.value, notes } : { ok: false, problems: { a: r.problems, b: [] }, notes };
}
