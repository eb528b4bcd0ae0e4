// The engine's boundary: one parse of one tune, turned into a model, with every surprise caught
// and reported as a problem instead of thrown.
import { findGroups, type FillGroup } from "./groups";
import { readModel, type NoteEl, type TuneModel } from "./model";
import { parseTune } from "./parse";
import type { Problem, Result } from "./types";
import type { Tuplet } from "./model";

export interface Prepared {
  model: TuneModel;
  groups: FillGroup[];
  crossing: Tuplet[];
  groupOf: Map<NoteEl, FillGroup>;
  warnings: Problem[];
}

export function prepareTune(abc: string, lineOffset = 0): Result<Prepared> {
  const { tune, warnings } = parseTune(abc, lineOffset);
  if (!tune) {
    return {
      ok: false,
      problems: warnings.length
        ? warnings
        : [
            {
              line: 1 + lineOffset,
              column: 1,
              message: "No tune found: a tune needs at least a K: field and some notes.",
            },
          ],
    };
  }
  return guard(lineOffset, () => {
    const model = readModel(abc, tune);
    const melody = model.bars.get(model.melody) ?? [];
    if (melody.length === 0) {
      const problem = {
        line: 1 + lineOffset,
        column: 1,
        message: /^K:/m.test(abc) ? "The tune has no notes." : "The tune has no K: field, so its music cannot be read.",
      };
      return { ok: false, problems: [...warnings, problem] };
    }
    const { groups, crossing } = findGroups(model);
    const groupOf = new Map<NoteEl, FillGroup>();
    for (const g of groups) for (const el of g.els) if (!groupOf.has(el)) groupOf.set(el, g);
    return { ok: true, value: { model, groups, crossing, groupOf, warnings }, warnings };
  });
}

/** Runs `f`; an exception becomes a problem (the engine never throws past its boundary). */
export function guard<T>(lineOffset: number, f: () => Result<T>): Result<T> {
  try {
    return f();
  } catch (e) {
    const message = `Internal error while reading the tune: ${e instanceof Error ? e.message : String(e)}`;
    return { ok: false, problems: [{ line: 1 + lineOffset, column: 1, message }] };
  }
}
