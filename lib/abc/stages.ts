// Stage plans are data (issue 3 §4): stage 1 is the skeleton, each later stage adds kinds back.
import { kindMask } from "./decorations";
import { pickStops, type StopPicks } from "./double-stops";
import { emit, emitsSource, kindsIn } from "./emit";
import { KINDS, type Kind, type Stage, type StagePlan } from "./types";
import type { Prepared } from "./tune";

/** PRODUCT.md §4.4: skeleton; + bowing; + ornaments, slides and fills; the full setting. */
export const DEFAULT_PLAN: StagePlan = {
  stages: [
    { name: "Skeleton", adds: [] },
    { name: "Bowing", adds: ["bowing"] },
    { name: "Ornaments, slides and fills", adds: ["ornaments", "slides", "fills"] },
    { name: "Full setting", adds: ["doubleStops", "dynamics", "articulation", "fingerings", "marks"] },
  ],
};

export type PlanCheck = { ok: true } | { ok: false; reasons: string[] };

export function validatePlan(plan: unknown): PlanCheck {
  const reasons: string[] = [];
  const stages: unknown = plan && typeof plan === "object" ? Reflect.get(plan, "stages") : undefined;
  if (!Array.isArray(stages) || stages.length === 0) return { ok: false, reasons: ["A plan needs a list of stages."] };
  const seen = new Map<string, number>();
  stages.forEach((s: unknown, i) => {
    const adds: unknown = s && typeof s === "object" ? Reflect.get(s, "adds") : undefined;
    const name: unknown = s && typeof s === "object" ? Reflect.get(s, "name") : undefined;
    if (typeof name !== "string" || name.trim() === "") reasons.push(`Stage ${i + 1} has no name.`);
    if (!Array.isArray(adds)) {
      reasons.push(`Stage ${i + 1} has no list of kinds to add.`);
      return;
    }
    if (i === 0 && adds.length > 0) reasons.push("Stage 1 is the skeleton and adds no kinds.");
    for (const k of adds) {
      if (typeof k !== "string" || !(KINDS as readonly string[]).includes(k))
        reasons.push(`Stage ${i + 1}: unknown kind "${String(k)}".`);
      else if (seen.has(k)) reasons.push(`Kind "${k}" is added twice (stages ${seen.get(k)} and ${i + 1}).`);
      else seen.set(k, i + 1);
    }
  });
  for (const k of KINDS)
    if (!seen.has(k)) reasons.push(`Kind "${k}" is never added back, so the last stage would not be the full setting.`);
  return reasons.length ? { ok: false, reasons } : { ok: true };
}

/**
 * Every stage's ABC (the plan must be valid). The last stage is the source itself. Emit reads the
 * removed kinds only where the tune holds them, so stages that take out the same kinds of this
 * tune are the same text, written once (a tune without slurs has stage 2 = the skeleton, one
 * without double stops or dynamics has stage 3 = the source). Such a stage says which earlier
 * stage it repeats.
 */
export function buildStages(
  p: Prepared,
  plan: StagePlan = DEFAULT_PLAN,
  picks: StopPicks = pickStops(p.model),
  skeletonAbc?: string,
): Stage[] {
  const present = new Set<Kind>();
  const inTune = kindsIn(p.model, p.groupOf);
  const texts = new Map<number, string>();
  if (skeletonAbc !== undefined) texts.set(inTune, skeletonAbc);
  const out: Stage[] = [];
  plan.stages.forEach((s, i) => {
    s.adds.forEach((k) => present.add(k));
    const removed = new Set(KINDS.filter((k) => !present.has(k)));
    const key = kindMask(removed) & inTune;
    let abc = removed.size === 0 ? p.model.abc : texts.get(key);
    if (abc === undefined) {
      abc = key === 0 && emitsSource(p.model) ? p.model.abc : emit(p.model, removed, p.groupOf, picks).abc;
      texts.set(key, abc);
    }
    const before = out[i - 1];
    const repeats = before && before.abc === abc ? (before.repeats ?? before.index) : null;
    const kinds = KINDS.filter((k) => present.has(k));
    out.push({ index: i + 1, name: s.name, kinds, adds: [...s.adds], abc, merged: [], repeats });
  });
  return out;
}

/**
 * The default plan fitted to one tune: a stage that would repeat the music before it (the tune
 * has none of its kinds) is taken into the next stage, so a student never checks in the same music
 * twice. When the full setting repeats the stage before it, that stage is taken into the full
 * setting; a tune with no embellishment at all has one stage, its skeleton and full setting.
 */
export function withoutRepeats(stages: readonly Stage[]): Stage[] {
  const out: Stage[] = [];
  let carried: { adds: Kind[]; names: string[] } = { adds: [], names: [] };
  stages.forEach((s, i) => {
    const prev = out[out.length - 1];
    const last = i === stages.length - 1;
    if (prev === undefined || s.repeats === null) {
      out.push({ ...s, adds: [...carried.adds, ...s.adds], merged: [...carried.names, ...s.merged], repeats: null });
      carried = { adds: [], names: [] };
    } else if (!last) {
      carried = { adds: [...carried.adds, ...s.adds], names: [...carried.names, s.name] };
    } else if (out.length === 1) {
      // nothing to add back at all: the skeleton is the full setting
      out[0] = {
        ...prev,
        kinds: s.kinds,
        adds: [...prev.adds, ...carried.adds, ...s.adds],
        merged: [...prev.merged, ...carried.names, s.name],
      };
    } else {
      out[out.length - 1] = {
        ...s,
        adds: [...prev.adds, ...carried.adds, ...s.adds],
        merged: [...prev.merged, prev.name, ...carried.names],
        repeats: null,
      };
    }
  });
  return out.map((s, i) => ({ ...s, index: i + 1 }));
}
