// abcjs's warnings sorted into the two kinds a teacher sees: a problem refuses the tune (abcjs
// ignored or guessed at some of the music, so no stage could be trusted), a note is shown and the
// tune is kept (something outside the notes, such as a field ABC 2.1 does not define).
import type { Problem } from "./types";

export interface Sorted {
  problems: Problem[];
  notes: Problem[];
}

const HTML_TAG = /<[^>]*>/g;
const UNDERLINED = /<span[^>]*>([^<]*)<\/span>/;
const WARNING = /^(?:[A-Za-z ]*Line):?\s*(\d+):(\d+):\s*(.*)$/s;

export function decode(s: string): string {
  return s
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&quot;/g, '"')
    .replace(/&amp;/g, "&");
}
export function plain(s: string): string {
  return decode(s.replace(HTML_TAG, "")).replace(/\s+/g, " ").trim();
}

interface Read {
  line: number; // 1-based, in the tune's own text
  column: number;
  head: string; // abcjs's message without the echoed line
  bad: string | undefined; // the underlined text
}

function read(w: string): Read | null {
  const m = WARNING.exec(w);
  if (!m) return null;
  const body = m[3];
  const head = plain(body.split(/:\s\s/)[0] ?? body);
  const bad = UNDERLINED.exec(body)?.[1];
  return { line: Number(m[1]), column: Number(m[2]), head, bad: bad === undefined ? undefined : decode(bad) };
}

/**
 * abcjs warnings read "Music Line:4:7: Unknown character ignored:  context with <span>x</span>";
 * keep the message and the offending character, drop the HTML and the echoed line.
 */
export function warningToProblem(w: string, lineOffset = 0): Problem {
  const r = read(w);
  if (!r) return { line: 1 + lineOffset, column: 1, message: plain(w) };
  const message = r.bad !== undefined && r.head !== plain(w) ? `${r.head}: "${r.bad}"` : r.head;
  return { line: r.line + lineOffset, column: r.column, message };
}

/** A few characters of the source from a column, for a message that quotes what was written. */
function quote(text: string, column: number, n = 12): string {
  const s = text.slice(column - 1).trimEnd();
  return s.length > n ? `${s.slice(0, n)}…` : s;
}

// Fields of ABC 2.1 §3 (from memory of the standard's field table).
const FIELDS = new Set("ABCDFGHIKLMmNOPQRrSsTUVWwXZ");
// A field whose value decides how every note sounds or lasts: a problem there is a problem in the music.
const MUSIC_FIELDS = new Set("KLMV");
const FIELD_LINE = /^([A-Za-z+]):/;
const NOTES_ONLY = /^[A-Ga-gz^_=,'/0-9 ]+$/;

type Verdict = { fatal: boolean; message: string; line?: number; column?: number } | null;

/** The verdict on one warning in a line of music (or a field inside the music). */
function musicVerdict(r: Read, text: string): Verdict {
  const { head, bad } = r;
  const at = (s: string): string => quote(text, r.column) || s;
  if (head.startsWith("Missing the closing quote"))
    return { fatal: true, message: `The chord symbol ${at('"')} has no closing quote (")` };
  if (head.startsWith("Missing the closing '}'"))
    return { fatal: true, message: `The grace notes ${at("{")} have no closing brace (})` };
  if (head.startsWith("Expected ']' to end the chords")) {
    // abcjs reports where it gave up; the teacher needs the bracket that was opened
    const open = text.lastIndexOf("[", r.column - 1);
    const column = open >= 0 ? open + 1 : r.column;
    return { fatal: true, column, message: `The chord ${quote(text, column)} has no closing bracket (])` };
  }
  if (head.startsWith("Spaces are not allowed in chords"))
    return { fatal: true, message: "A chord holds a space: write its notes together, as in [GB]" };
  if (head.startsWith("Unknown decoration: ")) {
    const name = head.slice("Unknown decoration: ".length);
    const delim = text.charAt(r.column - 1) || "!";
    if (NOTES_ONLY.test(name) || /[[\]|]/.test(name))
      return {
        fatal: true,
        message: `"${delim}${name}" is read as a decoration, so its notes are lost: a chord of notes is written in brackets, as in [GB] (ABC 2.1 §4.17)`,
      };
    return {
      fatal: false,
      message: `Unknown decoration "${delim}${name}${delim}" is left out (ABC 2.1 §4.14 lists the decorations)`,
    };
  }
  if (head.startsWith("Duration not representable"))
    return {
      fatal: false,
      message: `No single written note has the length of "${head.slice(head.indexOf(":") + 1).trim()}": it is kept, but tied notes would show it`,
    };
  if (head.startsWith("Unknown bar")) {
    // abcjs reads ":|:" as ":|" and a stray ":": only the repeat's start is lost
    if (bad === ":" && text.slice(0, r.column - 1).endsWith("|"))
      return {
        fatal: false,
        message: `"${text.slice(r.column - 3, r.column)}" is read as ":|" without the repeat start: "::" ends one repeat and starts the next (ABC 2.1 §4.8)`,
      };
    return { fatal: true, message: `"${bad ?? at("")}" is not a bar line ABC knows` };
  }
  if (head.startsWith("Can't nest triplets")) return { fatal: true, message: "A tuplet starts inside another tuplet" };
  if (head.startsWith("Unknown character ignored") && bad !== undefined)
    return { fatal: true, message: `Unknown character ignored: "${bad}"` };
  return { fatal: true, message: bad !== undefined ? `${head}: "${bad}"` : head };
}

/**
 * Sorts abcjs's warnings. `headerLines` is the number of lines up to and including K:. On a
 * header line (and a directive, %%) a warning is a note, except on K:, L:, M: and V:; a line
 * whose field ABC 2.1 does not define (the corpus's Y:) gives one note for the whole line. In
 * the music every warning is a problem (abcjs skipped or guessed at what was written) but for an
 * unknown decoration name and a length no single note shows, which leave the notes intact.
 */
export function sortWarnings(raw: readonly unknown[], abc: string, headerLines: number, lineOffset: number): Sorted {
  const lines = abc.split("\n", Math.max(headerLines, maxLine(raw)) + 1);
  const problems: Problem[] = [];
  const notes: Problem[] = [];
  const seen = new Set<string>();
  const refused = new Set<string>();
  const push = (list: Problem[], line: number, column: number, message: string): void => {
    const key = `${line}:${column}:${message}`;
    // one mistake often gives two warnings at one place ("Missing '}'" then "Unknown character '{'")
    const place = `${line}:${column}`;
    if (seen.has(key) || (list === problems && refused.has(place))) return;
    seen.add(key);
    if (list === problems) refused.add(place);
    list.push({ line: line + lineOffset, column, message });
  };
  const unknownField = new Set<number>();
  // a pasted file of noise makes thousands: past MAX_READ the rest are counted, not read
  for (const w of raw.length > MAX_READ ? raw.slice(0, MAX_READ) : raw) {
    const r = read(String(w));
    if (!r) {
      problems.push({ line: 1 + lineOffset, column: 1, message: plain(String(w)) });
      continue;
    }
    const text = lines[r.line - 1] ?? "";
    const field = FIELD_LINE.exec(text)?.[1];
    const inHeader = r.line <= headerLines;
    if (field !== undefined && !FIELDS.has(field)) {
      if (unknownField.has(r.line)) continue;
      unknownField.add(r.line);
      if (inHeader) push(notes, r.line, 1, `${field}: is not a field of ABC 2.1, so the line is left out`);
      else
        push(
          problems,
          r.line,
          1,
          `${field}: is not a field of ABC 2.1: inside the music its text is read as notes (make it a comment with %)`,
        );
      continue;
    }
    if (text.startsWith("%%") || (field !== undefined && (inHeader || !MUSIC_FIELDS.has(field)))) {
      const fatal = field !== undefined && MUSIC_FIELDS.has(field);
      push(fatal ? problems : notes, r.line, r.column, r.bad !== undefined ? `${r.head}: "${r.bad}"` : r.head);
      continue;
    }
    const v = musicVerdict(r, text);
    if (v) push(v.fatal ? problems : notes, v.line ?? r.line, v.column ?? r.column, v.message);
  }
  if (raw.length > MAX_READ) {
    const r = read(String(raw[MAX_READ]));
    problems.push({
      line: (r?.line ?? 1) + lineOffset,
      column: r?.column ?? 1,
      message: `… and ${raw.length - MAX_READ} more places abcjs could not read`,
    });
  }
  return { problems: withoutEchoes(problems), notes };
}

const MAX_READ = 500;

const SWALLOWED = / is read as a decoration, so its notes are lost/;
/** After "+GB]" is read as a decoration, abcjs's complaints about the chord it ate say nothing new. */
function withoutEchoes(problems: Problem[]): Problem[] {
  const lines = new Set(problems.filter((p) => SWALLOWED.test(p.message)).map((p) => p.line));
  if (lines.size === 0) return problems;
  return problems.filter(
    (p) => !lines.has(p.line) || !/^(The chord .* has no closing bracket|A chord holds a space)/.test(p.message),
  );
}

function maxLine(raw: readonly unknown[]): number {
  let n = 0;
  for (const w of raw) {
    const m = /Line:?\s*(\d+):/.exec(String(w));
    if (m) n = Math.max(n, Number(m[1]));
  }
  return n;
}
