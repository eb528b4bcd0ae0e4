// One tune checked before it is stored (issue 5 item 2): the same function runs in the editor as
// the teacher types and in the route that saves, so the browser and the server refuse a tune with
// the same messages at the same line and column. Pure: no database, no framework.
import { analyze, type Analysis } from "@/lib/abc/analyze";
import { DEFAULT_PLAN, validatePlan } from "@/lib/abc/stages";
import type { Problem, Stage, StagePlan } from "@/lib/abc/types";
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
  /** Accepted swaps the phrase map no longer offers (the music changed); they are not kept. */
  droppedSwaps: string[];
  analysis: Analysis;
}

export type TuneCheck = { ok: true; value: CheckedTune } | { ok: false; problems: Problem[]; planReasons: string[] };

export interface CheckOptions {
  stagePlan?: StagePlan | null;
  acceptedSwaps?: readonly string[];
  /** Lines before this tune in a file of many (bulk import), so problems point into the file. */
  lineOffset?: number;
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
  if (!planCheck.ok) return { ok: false, problems: [], planReasons: planCheck.reasons };

  const result = analyze(abc, { plan, lineOffset });
  if (!result.ok) return { ok: false, problems: result.problems, planReasons: [] };
  // abcjs warnings mean it ignored or guessed at something the teacher wrote: a tune is stored
  // only when it reads cleanly, so every stage and the phrase map come from what was meant.
  const problems: Problem[] = [...result.warnings];
  const a = result.value;
  if (a.title.trim() === "") {
    problems.push({
      line: fieldLine(abc, "X") + lineOffset,
      column: 1,
      message: "The tune needs a title: add a T: line under X:.",
    });
  }
  if (problems.length) return { ok: false, problems: sortProblems(problems), planReasons: [] };

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
      droppedSwaps: swaps.dropped,
      analysis: a,
    },
  };
}

export function sortProblems(problems: Problem[]): Problem[] {
  return [...problems].sort((x, y) => x.line - y.line || x.column - y.column);
}

/** "Line 7, column 12: Unknown character ignored: "#"" — one wording for the editor, the import and the API. */
export function problemText(p: Problem): string {
  return `Line ${p.line}, column ${p.column}: ${p.message}`;
}
