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
