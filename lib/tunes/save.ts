// Saving a tune (issue 5 item 2): the engine's check, then the tune and its stages in one
// transaction. A hand-edited stage is kept as written; when the source (or the kinds its stage
// adds) changes afterwards it is flagged sourceChanged, and stays so until it is rebuilt or
// edited again (PRODUCT.md §4.4).
import type { Db } from "@/db/client";
import {
  dropStagesAfter,
  insertTune,
  putStage,
  stagesOf,
  updateStage,
  updateTune,
  type TuneFields,
  type TuneRow,
} from "@/db/queries/tunes";
import type { Problem, Stage } from "@/lib/abc/types";
import { checkTune, type CheckedTune } from "./check";
import type { TuneInput } from "./schemas";

export type SaveOutcome =
  | { ok: true; tuneId: string; title: string; droppedSwaps: string[]; flaggedStages: number[]; notes: Problem[] }
  | { ok: false; problems: Problem[]; planReasons: string[]; notes: Problem[] };

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

function fieldsOf(t: CheckedTune): TuneFields {
  return {
    title: t.title,
    tuneType: t.tuneType,
    key: t.key,
    meter: t.meter,
    abc: t.abc,
    stagePlan: t.stagePlan,
    acceptedSwaps: t.acceptedSwaps,
    turnedBars: t.turnedBars,
  };
}

const sameKinds = (a: readonly string[], b: readonly string[]): boolean =>
  a.length === b.length && a.every((k, i) => k === b[i]);

/**
 * Writes the engine's stages, keeping hand edits; returns the indexes newly flagged. The last
 * stage is the full setting, which is the source itself, so it is never kept from a hand edit.
 */
async function writeStages(tx: Tx, tuneId: string, stages: Stage[], sourceChanged: boolean): Promise<number[]> {
  const old = new Map((await stagesOf(tx, tuneId)).map((s) => [s.index, s]));
  const flagged: number[] = [];
  for (const s of stages) {
    const kept = old.get(s.index);
    if (kept?.handEdited && s.index < stages.length) {
      const changed = sourceChanged || !sameKinds(kept.kinds, s.kinds);
      if (changed && !kept.sourceChanged) flagged.push(s.index);
      await updateStage(tx, tuneId, s.index, {
        name: s.name,
        kinds: s.kinds,
        sourceChanged: kept.sourceChanged || changed,
      });
    } else {
      await putStage(tx, tuneId, s);
    }
  }
  await dropStagesAfter(tx, tuneId, stages.length);
  return flagged;
}

function parsed(input: TuneInput) {
  return {
    stagePlan: input.stagePlan ?? null,
    acceptedSwaps: input.acceptedSwaps ?? [],
    turnedBars: input.turnedBars ?? {},
  };
}

export async function createTune(db: Db, teacherId: string, input: TuneInput): Promise<SaveOutcome> {
  const check = checkTune(input.abc, parsed(input));
  if (!check.ok) return check;
  const tuneId = await storeNewTune(db, teacherId, check.value);
  return {
    ok: true,
    tuneId,
    title: check.value.title,
    droppedSwaps: check.value.droppedSwaps,
    flaggedStages: [],
    notes: check.notes,
  };
}

/** A tune that has passed checkTune, with its stages, in one transaction. */
export async function storeNewTune(db: Db, teacherId: string, t: CheckedTune): Promise<string> {
  return db.transaction(async (tx) => {
    const id = await insertTune(tx, teacherId, fieldsOf(t));
    await writeStages(tx, id, t.stages, false);
    return id;
  });
}

export async function saveTune(db: Db, tune: TuneRow, input: TuneInput): Promise<SaveOutcome> {
  const check = checkTune(input.abc, parsed(input));
  if (!check.ok) return check;
  const t = check.value;
  const flaggedStages = await db.transaction(async (tx) => {
    await updateTune(tx, tune.id, fieldsOf(t));
    return writeStages(tx, tune.id, t.stages, tune.abc !== t.abc);
  });
  return { ok: true, tuneId: tune.id, title: t.title, droppedSwaps: t.droppedSwaps, flaggedStages, notes: check.notes };
}
