// The tune page's data (issue 5 item 6): the tune with its stages (locked ones named, with why)
// and the phrase map; one stage's ABC only when that stage is open.
import type { Tx as Db } from "@/db/queries/auth";
import { stageOf } from "@/db/queries/catalogue";
import { forbidden, notFound } from "@/lib/auth/errors";
import { tuneAccess, type TuneAccess, type Viewer } from "./access";
import type { StageAbcJson, TuneJson } from "./api-types";
import { phraseMapOf } from "./phrase-map";
import { tuneWords } from "./tune-words";

const NOT_FOUND = "We couldn't find that tune.";

/** The tune as the viewer may open it: 404 when it does not exist for them, 403 with why when every stage is locked. */
export async function openTune(db: Db, viewer: Viewer, tuneId: string): Promise<TuneAccess> {
  const access = await tuneAccess(db, viewer, tuneId);
  if (!access) throw notFound(NOT_FOUND);
  if (!access.open) throw forbidden(access.reason ?? "This tune is not open to you yet.");
  return access;
}

export async function tuneJson(db: Db, viewer: Viewer, tuneId: string): Promise<TuneJson> {
  const access = await openTune(db, viewer, tuneId);
  const first = await stageOf(db, access.tune.id, 1);
  return {
    tune: {
      ...access.tune,
      words: `${tuneWords({ tuneType: access.tune.tuneType, tuneKey: access.tune.key })}${access.tune.meter ? `, ${access.tune.meter} time` : ""}`,
    },
    rung: access.rung,
    reached: access.reached,
    stages: access.stages.map((s) => ({
      index: s.index,
      name: s.name,
      kinds: s.kinds,
      allowed: s.allowed,
      ...(s.reason ? { reason: s.reason } : {}),
    })),
    phraseMap: first ? phraseMapOf(first.abc) : null,
  };
}

/** One stage's ABC: 404 for an unknown tune or stage, 403 with the reason for a locked one. */
export async function stageJson(
  db: Db,
  viewer: Viewer,
  tuneId: string,
  index: number,
): Promise<StageAbcJson & { title: string }> {
  const access = await tuneAccess(db, viewer, tuneId);
  const stage = access?.stages.find((s) => s.index === index);
  if (!access || !stage) throw notFound(access ? "This tune has no such stage." : NOT_FOUND);
  if (!stage.allowed) throw forbidden(stage.reason ?? "This stage is not open to you yet.");
  const row = await stageOf(db, access.tune.id, index);
  if (!row) throw notFound("This tune has no such stage.");
  return { index: row.index, name: row.name, kinds: row.kinds, abc: row.abc, title: access.tune.title };
}
