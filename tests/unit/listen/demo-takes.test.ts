import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { DEMO_TAKES, takeFile, type DemoTake, type TakeName } from "@/db/seed-data/takes";
import { listenTo } from "@/lib/listen";
import { perform } from "@/lib/listen/perform";
import { stageOf } from "./truth";

// The demo school's shipped check-in recordings, heard as the worker hears them: against the stage as
// the engine writes it today. A take made from music the stage no longer has (the engine changed what
// a stage plays) would show bars to check where nothing was played wrong; re-render it with
// scripts/render-demo-takes.ts. Each take's own faults, known from its performance, are what the
// teacher's review queue is meant to point at.
function faultBars(name: TakeName): number[] {
  const take: DemoTake = DEMO_TAKES[name];
  const p = perform(stageOf(take.tune, take.stage), { ...take, repeats: "skip" });
  const bars = p.truth.filter((t) => t.played !== "right").map((t) => t.bar);
  for (const e of p.extras) bars.push(p.truth.find((t) => t.note === e.afterNote)!.bar);
  return [...new Set(bars)].sort((a, b) => a - b);
}

describe("the demo school's recordings, heard against today's stages", () => {
  for (const name of Object.keys(DEMO_TAKES) as TakeName[])
    it(`${name}: the bars to check are the take's own faults`, async () => {
      const take: DemoTake = DEMO_TAKES[name];
      const faults = faultBars(name);
      expect(readFileSync(takeFile(name)).length).toBeGreaterThan(0);
      const result = await listenTo(stageOf(take.tune, take.stage), fileURLToPath(takeFile(name)));
      const flagged = result.bars.filter((b) => b.verdict !== "clean").map((b) => b.bar);
      if (!take.faults) {
        expect(flagged, "a take played clean").toEqual([]);
        expect(result.stoppedAt).toBeNull();
      }
      for (const bar of faults) expect(flagged, `bar ${bar} has a fault`).toContain(bar);
      // a missed or extra note can pull its neighbour's timing with it: one bar either side, no further
      const far = flagged.filter((bar) => !faults.some((f) => Math.abs(f - bar) <= 1));
      expect(far, "bars flagged away from any fault").toEqual([]);
    });
});
