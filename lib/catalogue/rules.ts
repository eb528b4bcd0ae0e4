// The pure part of access to courses, rungs and stages (issue 5 items 4–6): given a course's rungs
// in ladder order, how the person stands in the course and how far they have come on each tune,
// decide which rungs and stages are open and, when not, why — in words a student can act on.
// lib/catalogue/access.ts loads the facts from the database and calls these.

/**
 * How a person may walk a course. The one place a later issue widens: a paid membership will make
 * "ladder" reachable without an enrolment (lib/catalogue/access.ts courseStanding).
 * - staff: the course's teacher or an admin; every rung and stage is open.
 * - ladder: an active enrolment; rungs open one after another.
 * - taster: anyone else; only taster rungs open. `why` says what would open the rest.
 */
export type Standing = { pathway: "staff" } | { pathway: "ladder" } | { pathway: "taster"; why: string };

export interface LadderRung {
  rungId: string;
  tuneId: string;
  tuneTitle: string;
  gradeTitle: string;
  position: number; // 1-based within its grade
  requiredStage: number;
  isTaster: boolean;
  /** Names of the tune's stages by index (1-based), for the reasons. */
  stageNames: Record<number, string>;
}

/** The stage reached on a tune; absent when the student has not started it. */
export type Progress = ReadonlyMap<string, number>;

export type RungState = "open" | "inProgress" | "done" | "locked";

export interface RungDecision {
  rungId: string;
  state: RungState;
  open: boolean;
  /** Stage reached on the tune (0 when not started). */
  reached: number;
  /** Why the rung is locked; absent when open. */
  reason?: string;
}

export function stageWords(index: number, names: Record<number, string>): string {
  const name = names[index];
  return name ? `stage ${index} (${name})` : `stage ${index}`;
}

function rungWords(r: LadderRung): string {
  return `“${r.tuneTitle}” (${r.gradeTitle}, rung ${r.position})`;
}

/** A rung's state from its openness and the progress on its tune. */
function stateOf(open: boolean, rung: LadderRung, progress: Progress): RungState {
  if (!open) return "locked";
  const reached = progress.get(rung.tuneId);
  if (reached === undefined) return "open";
  if (reached >= rung.requiredStage) return "done";
  return "inProgress";
}

/**
 * Every rung of one course, in ladder order (grade by grade, rung by rung). On the ladder the first
 * rung is open and each next rung opens when the previous rung's tune has reached that rung's
 * required stage; taster rungs are open to everyone.
 */
export function decideLadder(rungs: readonly LadderRung[], standing: Standing, progress: Progress): RungDecision[] {
  return rungs.map((rung, i) => {
    const reached = progress.get(rung.tuneId) ?? 0;
    let reason: string | undefined;
    if (standing.pathway === "taster" && !rung.isTaster) reason = standing.why;
    if (standing.pathway === "ladder" && !rung.isTaster && i > 0) {
      const prev = rungs[i - 1];
      const prevReached = progress.get(prev.tuneId) ?? 0;
      if (prevReached < prev.requiredStage) {
        reason = `Opens when you reach ${stageWords(prev.requiredStage, prev.stageNames)} on ${rungWords(prev)}.`;
      }
    }
    const open = reason === undefined;
    return { rungId: rung.rungId, state: stateOf(open, rung, progress), open, reached, ...(open ? {} : { reason }) };
  });
}

export interface StageDecision {
  index: number;
  allowed: boolean;
  reason?: string;
}

/**
 * One stage of an open rung's tune: stage k is open once stage k−1 is reached (stage 1 at once);
 * staff see every stage. `signedIn` words the reason for a visitor, whose progress is never kept.
 */
export function decideStage(
  index: number,
  names: Record<number, string>,
  o: { staff: boolean; reached: number; signedIn: boolean },
): StageDecision {
  if (o.staff || index <= 1 || o.reached >= index - 1) return { index, allowed: true };
  const need = stageWords(index - 1, names);
  const reason = o.signedIn
    ? `Opens when you have reached ${need} of this tune.`
    : `Opens when you have reached ${need} of this tune: join the school to learn it stage by stage.`;
  return { index, allowed: false, reason };
}

/** Of several rungs that hold one tune, the decision that lets the most through (an open one first). */
export function bestRung<T extends { open: boolean; reached: number }>(decisions: readonly T[]): T | undefined {
  let best: T | undefined;
  for (const d of decisions) {
    if (!best || (d.open && !best.open) || (d.open === best.open && d.reached > best.reached)) best = d;
  }
  return best;
}
