// One tune checked before it is stored: the same function runs in the editor as the teacher types,
// in the route that saves and in the import, so all three refuse a tune with the same problems and
// show the same notes at the same line and column. Pure: no database, no framework.
import { analyze, type Analysis } from "@/lib/abc/analyze";
import { sortProblems } from "@/lib/abc/tune";
import { DEFAULT_PLAN, validatePlan } from "@/lib/abc/stages";
import type { Problem, Stage, StagePlan } from "@/lib/abc/types";
import { codePoint, firstControlCharacter } from "@/lib/validation/text";
import { headerField, tuneTypeOf, type TuneType } from "./header";
import { offeredSwaps } from "./learning";

export interface CheckedTune {
  title: string;
  tuneType: TuneType;
  key: string;
  meter: string;
  abc: string;
  /** null when the teacher keeps the default plan. */
  stagePlan: StagePlan | null;
  stages: Stage[];
  acceptedSwaps: string[];
  /** Bars whose double stops the teacher turned, kept only where the bar still has double stops. */
  turnedBars: Record<string, "upper" | "lower">;
  /** Accepted swaps the phrase map no longer offers (the music changed); they are not kept. */
  droppedSwaps: string[];
  analysis: Analysis;
}

/**
 * `problems` refuse the tune (the music could not be read as written); `notes` go with it either
 * way and do not stop a save (a field ABC 2.1 does not define, a bar longer than the meter …).
 */
export type TuneCheck =
  | { ok: true; value: CheckedTune; notes: Problem[] }
  | { ok: false; problems: Problem[]; planReasons: string[]; notes: Problem[] };

export interface CheckOptions {
  stagePlan?: StagePlan | null;
  acceptedSwaps?: readonly string[];
  /** Bars (melody bar index) whose double stops keep the other voice. */
  turnedBars?: Readonly<Record<string, "upper" | "lower">>;
  /** Lines before this tune in a file of many (bulk import), so problems point into the file. */
  lineOffset?: number;
}

/** A title is a name, not a text: long enough for any tune's, short enough to index and show in a list. */
export const MAX_TITLE_CHARS = 200;

/** A control character (lib/validation/text.ts's rule) where the tune has one, by line and column. */
function controlProblem(abc: string, lineOffset: number): Problem | null {
  const at = firstControlCharacter(abc);
  if (at < 0) return null;
  const before = abc.slice(0, at).split("\n");
  return {
    line: before.length + lineOffset,
    column: before[before.length - 1].length + 1,
    message: `This line holds a control character (${codePoint(abc[at])}), which a tune cannot: delete it.`,
  };
}

/** The line of a header field (1-based, in the tune's own text), for a problem about it. */
function fieldLine(abc: string, letter: string): number {
  const lines = abc.split("\n");
  const i = lines.findIndex((l) => l.startsWith(`${letter}:`));
  return i >= 0 ? i + 1 : 1;
}

export function checkTune(rawAbc: string, opts: CheckOptions = {}): TuneCheck {
  // Windows line ends would shift every column past the first line by nothing but still end up stored.
  const abc = rawAbc.replace(/\r\n?/g, "\n");
  const lineOffset = opts.lineOffset ?? 0;
  const plan = opts.stagePlan ?? DEFAULT_PLAN;
  const planCheck = validatePlan(plan);
  if (!planCheck.ok) return { ok: false, problems: [], planReasons: planCheck.reasons, notes: [] };

  const control = controlProblem(abc, lineOffset);
  if (control) return { ok: false, problems: [control], planReasons: [], notes: [] };
  // A problem means abcjs ignored or guessed at something the teacher wrote: a tune is stored only
  // when its music reads as written, so every stage and the phrase map come from what was meant.
  // no plan of the teacher's: the default plan fitted to the tune (a stage that would repeat the one before is merged)
  const analysed = analyze(abc, { plan: opts.stagePlan ?? undefined, turnedBars: opts.turnedBars, lineOffset });
  const result = analysed.ok
    ? { ...analysed, notes: listed(analysed.notes, "note") }
    : { ...analysed, problems: listed(analysed.problems, "problem"), notes: listed(analysed.notes, "note") };
  if (!result.ok) return { ok: false, problems: result.problems, planReasons: [], notes: result.notes };
  const a = result.value;
  if (a.title.trim() === "") {
    const problem = {
      line: fieldLine(abc, "X") + lineOffset,
      column: 1,
      message: "The tune needs a title: add a T: line under X:.",
    };
    return { ok: false, problems: [problem], planReasons: [], notes: result.notes };
  }
  if (a.title.trim().length > MAX_TITLE_CHARS) {
    const problem = {
      line: fieldLine(abc, "T") + lineOffset,
      column: 1,
      message: `Keep the title under ${MAX_TITLE_CHARS} characters; put more about the tune in a note or an N: line.`,
    };
    return { ok: false, problems: [problem], planReasons: [], notes: result.notes };
  }

  const swaps = offeredSwaps(a.phraseMap, opts.acceptedSwaps ?? []);
  return {
    ok: true,
    value: {
      title: a.title.trim(),
      tuneType: tuneTypeOf(abc),
      key: a.key,
      meter: headerField(abc, "M"),
      abc,
      stagePlan: opts.stagePlan ?? null,
      stages: a.stages,
      acceptedSwaps: swaps.kept,
      turnedBars: turnsKept(a, opts.turnedBars ?? {}),
      droppedSwaps: swaps.dropped,
      analysis: a,
    },
    notes: result.notes,
  };
}

export { sortProblems };

/** A turn outlives a change of the music only where its bar still holds a double stop. */
function turnsKept(
  a: Analysis,
  turned: Readonly<Record<string, "upper" | "lower">>,
): Record<string, "upper" | "lower"> {
  const bars = new Set(a.doubleStops.map((c) => String(c.barIndex)));
  const kept: Record<string, "upper" | "lower"> = {};
  for (const [bar, voice] of Object.entries(turned)) if (bars.has(bar)) kept[bar] = voice;
  return kept;
}

/** Past this many of one kind, one more line says how many were left out (a pasted file of noise). */
const MAX_LISTED = 50;

function listed(list: Problem[], word: string): Problem[] {
  if (list.length <= MAX_LISTED) return list;
  const rest = list.length - MAX_LISTED;
  const next = list[MAX_LISTED] as Problem;
  return [
    ...list.slice(0, MAX_LISTED),
    {
      line: next.line,
      column: next.column,
      message: `… and ${rest} more ${word}${rest === 1 ? "" : "s"} after this one`,
    },
  ];
}

/** "Line 7, column 12: Unknown character ignored: "#"" — one wording for the editor, the import and the API. */
export function problemText(p: Problem): string {
  return `Line ${p.line}, column ${p.column}: ${p.message}`;
}
