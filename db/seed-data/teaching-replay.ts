// Plays a demo assignment's check-ins through the rules of lib/teaching/state-machine.ts (stage 1
// opens when assigned; a check-in needs an open stage; a sign-off opens the next stage; "needs more
// time" opens the same stage again), so the seeded stages are ones the app itself could have made.
// Pure: the seed, its tests and the demo's tune progress read the result.
import type { DemoAssignment, DemoCheckIn } from "./teaching";

export type DemoStageState = "locked" | "open" | "checked_in" | "signed_off";
export type DemoCheckInStatus = "waiting" | "signed_off" | "needs_more_time";

export interface ReplayedStage {
  index: number;
  state: DemoStageState;
  openedDaysAgo: number | null;
  signedOffDaysAgo: number | null;
}

export interface Replayed {
  stages: ReplayedStage[];
  checkIns: (DemoCheckIn & { status: DemoCheckInStatus })[];
  /** The highest stage signed off (0 when none): the student's progress on the tune. */
  reached: number;
}

export function replay(a: DemoAssignment, stageCount: number): Replayed {
  const fail = (why: string): never => {
    throw new Error(`demo assignment ${a.key}: ${why}`);
  };
  if (a.assignedDaysAgo <= 0) fail("it must have been assigned in the past");
  if (a.dueInDays * -1 >= a.assignedDaysAgo) fail("it was due before it was assigned");
  const stages: ReplayedStage[] = Array.from({ length: stageCount }, (_, i) => ({
    index: i + 1,
    state: i === 0 ? "open" : "locked",
    openedDaysAgo: i === 0 ? a.assignedDaysAgo : null,
    signedOffDaysAgo: null,
  }));
  const checkIns: Replayed["checkIns"] = [];
  let clock = a.assignedDaysAgo; // days ago of the latest event so far: time only moves forward
  for (const c of a.checkIns) {
    const stage = stages[c.stage - 1] ?? fail(`it has no stage ${c.stage}`);
    if (stage.state !== "open") fail(`stage ${c.stage} is ${stage.state} when checked in`);
    if (c.daysAgo >= clock) fail(`the check-in on stage ${c.stage} comes before what happened earlier`);
    if (c.daysAgo <= 0) fail("a check-in must be in the past");
    clock = c.daysAgo;
    if (!c.review) {
      stage.state = "checked_in";
      checkIns.push({ ...c, status: "waiting" });
      continue;
    }
    if (c.review.daysAgo >= clock || c.review.daysAgo <= 0)
      fail(`stage ${c.stage} was reviewed before it was checked in`);
    clock = c.review.daysAgo;
    checkIns.push({ ...c, status: c.review.outcome });
    if (c.review.outcome === "needs_more_time") continue; // the stage stays open
    stage.state = "signed_off";
    stage.signedOffDaysAgo = c.review.daysAgo;
    const next = stages[c.stage];
    if (next) {
      next.state = "open";
      next.openedDaysAgo = c.review.daysAgo;
    }
  }
  const waiting = checkIns.filter((c) => c.status === "waiting");
  if (waiting.length > 1 || (waiting.length === 1 && checkIns[checkIns.length - 1].status !== "waiting"))
    fail("only its last check-in may still be waiting");
  const reached = Math.max(0, ...stages.filter((s) => s.state === "signed_off").map((s) => s.index));
  return { stages, checkIns, reached };
}
