// The ladder bench's rules (issue 5 item 1), pure so they can be tested alone and shown in the
// browser as the teacher works:
// - a published course is never empty: it has at least one rung (an empty grade is only a hint,
//   so a teacher can add a grade to a published course and then fill it);
// - every rung names a tune;
// - "no cycle": a ladder is one line from the first rung to the last, and a rung opens when the
//   rung before it reaches its required stage. It could only loop back on itself if a tune came
//   round again (reaching a stage on it would open and close rungs at once) or if a rung asked for
//   a stage its tune does not have (it could never open the next). So: a tune appears at most once
//   in a course's ladder, and a rung's required stage lies within its tune's stage count.

export interface RungFacts {
  id: string;
  tuneId: string | null;
  tuneTitle: string;
  requiredStage: number;
  stageCount: number;
  isTaster: boolean;
}

export interface GradeFacts {
  id: string;
  title: string;
  rungs: RungFacts[];
}

export interface RuleProblem {
  message: string;
  gradeId?: string;
  rungId?: string;
}

const where = (g: GradeFacts, i: number): string => `${g.title}, rung ${i + 1}`;

/** Everything wrong with a ladder; `published` adds the rules a published course must keep. */
export function courseProblems(grades: readonly GradeFacts[], opts: { published: boolean }): RuleProblem[] {
  const out: RuleProblem[] = [];
  const seen = new Map<string, string>();
  for (const g of grades) {
    g.rungs.forEach((r, i) => {
      if (!r.tuneId) {
        out.push({
          gradeId: g.id,
          rungId: r.id,
          message: `${where(g, i)} has no tune: choose one or remove the rung.`,
        });
        return;
      }
      const first = seen.get(r.tuneId);
      if (first)
        out.push({
          gradeId: g.id,
          rungId: r.id,
          message: `“${r.tuneTitle}” is already on this ladder (${first}); a tune appears once in a course.`,
        });
      else seen.set(r.tuneId, where(g, i));
      if (r.requiredStage < 1 || r.requiredStage > r.stageCount) {
        out.push({
          gradeId: g.id,
          rungId: r.id,
          message: `${where(g, i)} asks for stage ${r.requiredStage}, but “${r.tuneTitle}” has ${r.stageCount} stage${r.stageCount === 1 ? "" : "s"}.`,
        });
      }
    });
  }
  if (opts.published && grades.every((g) => g.rungs.length === 0))
    out.push({ message: "A published course needs at least one rung with a tune." });
  return out;
}

/** Problems in `after` that were not already in `before`: what one change would cause. */
export function newProblems(before: readonly RuleProblem[], after: readonly RuleProblem[]): RuleProblem[] {
  const old = new Set(before.map((p) => p.message));
  return after.filter((p) => !old.has(p.message));
}

/** Notes that do not stop publishing but that a teacher would want to know. */
export function courseHints(grades: readonly GradeFacts[]): string[] {
  const out = grades
    .filter((g) => g.rungs.length === 0)
    .map((g) => `${g.title} has no rungs yet: students will see it empty.`);
  const rungs = grades.flatMap((g) => g.rungs);
  if (rungs.length > 0 && !rungs.some((r) => r.isTaster))
    out.push("No taster rung yet: visitors and students without a membership will see titles only.");
  return out;
}

/** The ladder's order as the ladder bench sends it: every grade with its rungs, top to bottom. */
export interface LadderOrder {
  grades: { id: string; rungs: string[] }[];
}

/** The same grades and rungs as the course has now, only moved; null when they are, else why not. */
export function orderMismatch(current: readonly GradeFacts[], order: LadderOrder): string | null {
  const sorted = (xs: string[]): string => [...xs].sort().join(",");
  const sameGrades = sorted(current.map((g) => g.id)) === sorted(order.grades.map((g) => g.id));
  const sameRungs =
    sorted(current.flatMap((g) => g.rungs.map((r) => r.id))) === sorted(order.grades.flatMap((g) => g.rungs));
  return sameGrades && sameRungs
    ? null
    : "The course changed since this page loaded; reload it and move the rungs again.";
}

/**
 * One step up or down the ladder for a rung, crossing into the next grade at a grade's edge (the
 * ladder is one line, cut into grades). Returns the new order, or null when it cannot move.
 */
export function moveRung(order: LadderOrder, rungId: string, step: -1 | 1): LadderOrder | null {
  const gi = order.grades.findIndex((g) => g.rungs.includes(rungId));
  if (gi < 0) return null;
  const grades = order.grades.map((g) => ({ id: g.id, rungs: [...g.rungs] }));
  const list = grades[gi].rungs;
  const ri = list.indexOf(rungId);
  const to = ri + step;
  if (to >= 0 && to < list.length) {
    [list[ri], list[to]] = [list[to], list[ri]];
    return { grades };
  }
  const next = grades[gi + step];
  if (!next) return null;
  list.splice(ri, 1);
  if (step < 0) next.rungs.push(rungId);
  else next.rungs.unshift(rungId);
  return { grades };
}

/** One step up or down for a grade, with its rungs. */
export function moveGrade(order: LadderOrder, gradeId: string, step: -1 | 1): LadderOrder | null {
  const i = order.grades.findIndex((g) => g.id === gradeId);
  const to = i + step;
  if (i < 0 || to < 0 || to >= order.grades.length) return null;
  const grades = [...order.grades];
  [grades[i], grades[to]] = [grades[to], grades[i]];
  return { grades };
}

/** An item dragged from one place to another within a list (what a drop does). */
export function moved<T>(list: readonly T[], from: number, to: number): T[] {
  const out = [...list];
  const [item] = out.splice(from, 1);
  if (item !== undefined) out.splice(Math.max(0, Math.min(to, out.length)), 0, item);
  return out;
}

export function orderOf(grades: readonly GradeFacts[]): LadderOrder {
  return { grades: grades.map((g) => ({ id: g.id, rungs: g.rungs.map((r) => r.id) })) };
}
