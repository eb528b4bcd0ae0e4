// The shared rules for text from outside: one place that says which characters text input may hold
// and which calendar days the app accepts. The guard (lib/auth/guard.ts) applies the first to every
// route handler's and server action's input; schemas use `day` and `text` for their own fields.
import { z } from "zod";

// C0 controls and DEL, but tab, line feed and carriage return (a textarea sends CR LF; HTML Standard,
// "constructing the entry list"): PostgreSQL text cannot hold NUL, and the others only hide or
// garble what a person reads (terminal escapes, bells).
const CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;

export const CONTROL_MESSAGE = "must not contain control characters";

/** Where the first control character of `s` is, or -1. */
export const firstControlCharacter = (s: string): number => s.search(CONTROL);

/** "U+0000" for a character, as a message names it. */
export const codePoint = (c: string) => `U+${c.charCodeAt(0).toString(16).toUpperCase().padStart(4, "0")}`;

/**
 * The first field of `input` whose text (a value, or a key, at any depth) holds a control character:
 * its top-level name and the character's code point; null when there is none.
 */
export function findControlCharacter(input: unknown): { field: string; char: string } | null {
  const visit = (v: unknown, field: string, depth: number): { field: string; char: string } | null => {
    if (typeof v === "string") {
      const m = CONTROL.exec(v);
      return m ? { field, char: codePoint(m[0]) } : null;
    }
    if (depth > 32 || !v || typeof v !== "object") return null;
    for (const [k, x] of Object.entries(v as Record<string, unknown>)) {
      const name = depth === 0 ? k : field;
      const inKey = CONTROL.exec(k);
      if (inKey)
        return {
          field: depth === 0 ? k.replace(/[\u0000-\u001f\u007f]/g, "") || "form" : field,
          char: codePoint(inKey[0]),
        };
      const found = visit(x, name, depth + 1);
      if (found) return found;
    }
    return null;
  };
  return visit(input, "form", 0);
}

/** The text without its control characters (what a refused form shows back to its sender). */
export const withoutControlCharacters = (s: string) => s.replace(new RegExp(CONTROL.source, "g"), "");

/** A text field under the same rule, for schemas used outside the guard (e.g. in the browser). */
export const text = () => z.string().refine((s) => !CONTROL.test(s), CONTROL_MESSAGE);

// Years the app takes in any date it is given: wide enough for any real lesson, payment or report, and
// inside what every part (PostgreSQL's date, JavaScript's Date, ISO 8601 without a sign) handles alike.
export const MIN_YEAR = 1900;
export const MAX_YEAR = 2999;

/** A real calendar day written YYYY-MM-DD with its year in MIN_YEAR..MAX_YEAR. */
export function isSaneDay(s: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(s)) return false;
  const year = Number(s.slice(0, 4));
  if (year < MIN_YEAR || year > MAX_YEAR) return false;
  const d = new Date(`${s}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
}

export const DAY_MESSAGE = `must be a real day written YYYY-MM-DD, in the years ${MIN_YEAR}–${MAX_YEAR}`;

/** A calendar day field (YYYY-MM-DD, years 1900–2999). */
export const day = (message: string = DAY_MESSAGE) => z.string({ error: message }).refine(isSaneDay, message);
