// The engine's boundary: one parse of one tune, turned into a model, with every surprise caught
// and reported as a located problem instead of thrown. Problems refuse the tune; notes go with it.
import { findGroups, type FillGroup } from "./groups";
import { MAX_ABC_BYTES, modelProblems, sizeProblem } from "./limits";
import { barLengthNotes, lintProblems } from "./lint";
import { AbcInputError, Locator } from "./locate";
import { readModel, type NoteEl, type TuneModel } from "./model";
import { parseTune } from "./parse";
import type { Problem, Result } from "./types";
import type { Tuplet } from "./model";
import { sortWarnings } from "./warnings";

export interface Prepared {
  model: TuneModel;
  groups: FillGroup[];
  crossing: Tuplet[];
  groupOf: Map<NoteEl, FillGroup>;
  notes: Problem[];
}

export function prepareTune(abc: string, lineOffset = 0): Result<Prepared> {
  const loc = new Locator(abc, lineOffset);
  const size = sizeProblem(abc, loc);
  if (size) return refuse([size], []);
  const k = /^K:.*$/m.exec(abc);
  if (!k) return refuse([noKey(abc, loc)], []);
  const { tune, raw, failure } = parseTune(abc, lineOffset);
  if (failure) return refuse([failure], []);
  if (!tune) return refuse([loc.at(0, "No tune found: a tune needs at least a K: field and some notes.")], []);
  const headerLines = lineCount(abc, k.index + k[0].length);
  const sorted = raw.length ? sortWarnings(raw, abc, headerLines, lineOffset) : { problems: [], notes: [] };
  if (sorted.problems.length) return refuse([...sorted.problems, ...lintAnyway(abc, tune, loc)], sorted.notes);
  return guard(loc, () => {
    const model = readModel(abc, tune);
    const limits = modelProblems(model, loc);
    if (limits.length) return refuse(limits, sorted.notes);
    const melody = model.bars.get(model.melody) ?? [];
    const problems = lintProblems(model, loc);
    if (melody.length === 0) problems.push(loc.at(k.index + k[0].length, "The tune has no notes."));
    if (problems.length) return refuse(problems, sorted.notes);
    const notes = [...sorted.notes, ...barLengthNotes(model, loc)];
    const { groups, crossing } = findGroups(model);
    const groupOf = new Map<NoteEl, FillGroup>();
    for (const g of groups) for (const el of g.els) if (!groupOf.has(el)) groupOf.set(el, g);
    return { ok: true, value: { model, groups, crossing, groupOf, notes }, notes };
  });
}

/** abcjs's problems refuse the tune; what the model can still tell (a stray "]") is added when it can be read. */
function lintAnyway(abc: string, tune: Parameters<typeof readModel>[1], loc: Locator): Problem[] {
  try {
    return lintProblems(readModel(abc, tune), loc);
  } catch {
    return []; // the problems already found say what to fix first
  }
}

function refuse<T>(problems: Problem[], notes: Problem[]): Result<T> {
  return { ok: false, problems: sortProblems(problems), notes };
}

export function sortProblems(problems: readonly Problem[]): Problem[] {
  return [...problems].sort((x, y) => x.line - y.line || x.column - y.column);
}

function lineCount(abc: string, end: number): number {
  let n = 1;
  for (let i = abc.indexOf("\n"); i >= 0 && i < end; i = abc.indexOf("\n", i + 1)) n++;
  return n;
}

/** No K: line: the music cannot be told from the header (ABC 2.1 §3.1.14: K: ends the header). */
function noKey(abc: string, loc: Locator): Problem {
  // where the music starts: the first line that is neither a field, a comment nor empty
  const lines = abc.split("\n");
  let at = 0;
  let offset = 0;
  for (const line of lines) {
    if (line.trim() !== "" && !/^([A-Za-z+]:|%)/.test(line)) {
      at = offset;
      break;
    }
    offset += line.length + 1;
    at = offset;
  }
  return loc.at(
    Math.min(at, abc.length),
    "The tune has no K: line, so its music cannot be read: end the header with the key, e.g. K:D (ABC 2.1 §3.1.14).",
  );
}

/** Runs `f`; an exception becomes a problem (the engine never throws past its boundary). */
export function guard<T>(where: Locator | number, f: () => Result<T>): Result<T> {
  try {
    return f();
  } catch (e) {
    const loc = typeof where === "number" ? new Locator("", where) : where;
    if (e instanceof AbcInputError) return refuse([loc.at(e.at, e.message)], []);
    const message = `Internal error while reading the tune: ${e instanceof Error ? e.message : String(e)}`;
    return refuse([loc.at(0, message)], []);
  }
}

export { MAX_ABC_BYTES };
