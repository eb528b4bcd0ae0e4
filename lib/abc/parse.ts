// The one place that calls abcjs. parseOnly keeps startChar/endChar offsets into the text, which
// is what lets every later step edit the teacher's ABC instead of regenerating it.
import abcjs from "abcjs";
import type { TuneObject } from "abcjs";
import type { Problem } from "./types";

export interface Parsed {
  tune: TuneObject | null;
  warnings: Problem[];
}

const HTML_TAG = /<[^>]*>/g;
const UNDERLINED = /<span[^>]*>([^<]*)<\/span>/;

/**
 * abcjs warnings read "Music Line:4:7: Unknown character ignored:  context with <span>x</span>";
 * keep the message and the offending character, drop the HTML and the echoed line.
 */
export function warningToProblem(w: string, lineOffset = 0): Problem {
  const m = /^(?:[A-Za-z ]*Line):?\s*(\d+):(\d+):\s*(.*)$/s.exec(w);
  if (!m) return { line: 1 + lineOffset, column: 1, message: plain(w) };
  const body = m[3];
  const bad = UNDERLINED.exec(body)?.[1];
  const head = body.split(/:\s\s/)[0] ?? body;
  const message = plain(bad !== undefined && head !== body ? `${head}: "${decode(bad)}"` : head);
  return { line: Number(m[1]) + lineOffset, column: Number(m[2]), message };
}

function decode(s: string): string {
  return s
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&quot;/g, '"')
    .replace(/&amp;/g, "&");
}
function plain(s: string): string {
  return decode(s.replace(HTML_TAG, "")).replace(/\s+/g, " ").trim();
}

/** Parse one tune. Never throws: a failure inside abcjs becomes a problem at line 1. */
export function parseTune(abc: string, lineOffset = 0): Parsed {
  try {
    const tune = abcjs.parseOnly(abc)[0] ?? null;
    const raw: unknown = tune ? Reflect.get(tune, "warnings") : undefined;
    const warnings = Array.isArray(raw) ? raw.map((w) => warningToProblem(String(w), lineOffset)) : [];
    return { tune, warnings };
  } catch (e) {
    const message = `The ABC could not be read (${e instanceof Error ? e.message : String(e)}).`;
    return { tune: null, warnings: [{ line: 1 + lineOffset, column: 1, message }] };
  }
}

/** Messages without positions, for "no new warnings" checks where edits shift columns. */
export function warningKeys(problems: Problem[]): Map<string, number> {
  const keys = new Map<string, number>();
  for (const p of problems) keys.set(p.message, (keys.get(p.message) ?? 0) + 1);
  return keys;
}
