// The one place that calls abcjs. parseOnly keeps startChar/endChar offsets into the text, which
// is what lets every later step edit the teacher's ABC instead of regenerating it.
import abcjs from "abcjs";
import type { TuneObject } from "abcjs";
import type { Problem } from "./types";

export { warningToProblem } from "./warnings";

export interface Parsed {
  tune: TuneObject | null;
  /** abcjs's own warnings, as it wrote them (warnings.ts sorts and words them). */
  raw: readonly unknown[];
  /** abcjs threw: the text could not be read at all. */
  failure: Problem | null;
}

const NONE: readonly unknown[] = [];

/** Parse one tune. Never throws: a failure inside abcjs becomes a problem at line 1. */
export function parseTune(abc: string, lineOffset = 0): Parsed {
  try {
    const tune = abcjs.parseOnly(abc)[0] ?? null;
    const raw: unknown = tune ? Reflect.get(tune, "warnings") : undefined;
    return { tune, raw: Array.isArray(raw) ? raw : NONE, failure: null };
  } catch (e) {
    const message = `The ABC could not be read (${e instanceof Error ? e.message : String(e)}).`;
    return { tune: null, raw: NONE, failure: { line: 1 + lineOffset, column: 1, message } };
  }
}

/** Messages without positions, for "no new notes" checks where edits shift columns. */
export function warningKeys(problems: Problem[]): Map<string, number> {
  const keys = new Map<string, number>();
  for (const p of problems) keys.set(p.message, (keys.get(p.message) ?? 0) + 1);
  return keys;
}
