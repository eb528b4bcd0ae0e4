// Stage plans (issue 3 §4, PRODUCT.md §4.4).
import { describe, expect, it } from "vitest";
import { analyze } from "@/lib/abc/analyze";
import { DEFAULT_PLAN, validatePlan } from "@/lib/abc/stages";
import { KINDS } from "@/lib/abc/types";

const abc = "X:1\nT:Stages\nM:4/4\nL:1/8\nK:G\n(GA) ~B2 !p![DB]2 d/c/B|\n";

describe("stage plans", () => {
  it("the default plan is skeleton, + bowing, + ornaments/slides/fills, full setting (PRODUCT.md §4.4)", () => {
    expect(DEFAULT_PLAN.stages.map((s) => s.adds)).toEqual([
      [],
      ["bowing"],
      ["ornaments", "slides", "fills"],
      ["doubleStops", "dynamics", "articulation", "fingerings", "marks"],
    ]);
    expect(validatePlan(DEFAULT_PLAN)).toEqual({ ok: true });
  });

  it("builds each stage from the source, adding kinds back in order", () => {
    const r = analyze(abc);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.stages.map((s) => s.abc.split("\n")[5])).toEqual([
      "GA B2 B2 dB|",
      "(GA) B2 B2 dB|",
      "(GA) ~B2 B2 d/c/B|",
      "(GA) ~B2 !p![DB]2 d/c/B|",
    ]);
    expect(r.value.stages[3].kinds).toEqual([...KINDS]);
  });

  it("fits the default plan to the tune: a stage that would repeat the music before is merged", () => {
    const stagesOf = (body: string) => {
      const r = analyze(`X:1\nT:Fit\nM:4/4\nL:1/8\nK:G\n${body}\n`);
      if (!r.ok) throw new Error(r.problems.map((p) => p.message).join());
      return r.value.stages.map((s) => ({ index: s.index, name: s.name, merged: s.merged, repeats: s.repeats }));
    };
    // no bowing: stage 2 would be the skeleton again
    expect(stagesOf("GA ~B2 !p![DB]2 d/c/B|")).toEqual([
      { index: 1, name: "Skeleton", merged: [], repeats: null },
      { index: 2, name: "Ornaments, slides and fills", merged: ["Bowing"], repeats: null },
      { index: 3, name: "Full setting", merged: [], repeats: null },
    ]);
    // nothing the full setting adds: stage 3 is the full setting
    expect(stagesOf("(GA) ~B2 B2 d/c/B|")).toEqual([
      { index: 1, name: "Skeleton", merged: [], repeats: null },
      { index: 2, name: "Bowing", merged: [], repeats: null },
      { index: 3, name: "Full setting", merged: ["Ornaments, slides and fills"], repeats: null },
    ]);
    // slurs only
    expect(stagesOf("(GA) B2 B2 dB|").map((s) => [s.name, s.merged])).toEqual([
      ["Skeleton", []],
      ["Full setting", ["Bowing", "Ornaments, slides and fills"]],
    ]);
    // no embellishment at all: the skeleton is the full setting
    const bare = analyze("X:1\nT:Bare\nM:4/4\nL:1/8\nK:G\nGA B2 B2 dB|\n");
    expect(
      bare.ok && bare.value.stages.map((s) => [s.index, s.merged, s.kinds.length, s.abc === bare.value.stages[0].abc]),
    ).toEqual([[1, ["Bowing", "Ornaments, slides and fills", "Full setting"], KINDS.length, true]]);
  });

  it("keeps a teacher's own plan as made, naming the stage each repeat repeats", () => {
    const r = analyze("X:1\nT:Own\nM:4/4\nL:1/8\nK:G\nGA ~B2 B2 dB|\n", { plan: DEFAULT_PLAN });
    expect(r.ok && r.value.stages.map((s) => [s.index, s.repeats, s.merged])).toEqual([
      [1, null, []],
      [2, 1, []],
      [3, null, []],
      [4, 3, []],
    ]);
  });

  it("rejects an unknown kind, a kind twice and a missing kind, with reasons", () => {
    const bad = (adds: string[][]): string[] => {
      const r = validatePlan({ stages: adds.map((a, i) => ({ name: `S${i}`, adds: a })) });
      return r.ok ? [] : r.reasons;
    };
    expect(bad([[], ["bowing", "sparkle"], KINDS.filter((k) => k !== "bowing")]).join()).toMatch(
      /unknown kind "sparkle"/,
    );
    expect(bad([[], ["bowing"], [...KINDS]]).join()).toMatch(/"bowing" is added twice/);
    expect(bad([[], ["bowing"]]).join()).toMatch(/"ornaments" is never added back/);
    expect(bad([["bowing"], KINDS.filter((k) => k !== "bowing")]).join()).toMatch(/Stage 1 is the skeleton/);
    const r = analyze(abc, { plan: { stages: [{ name: "x", adds: [] }] } });
    expect(r.ok).toBe(false);
  });
});
