// The embellishments listing names each bar's part as the phrase map does (a tune without P:
// fields has its parts found from repeats), so a teacher reads "B" in both places.
import { describe, expect, it } from "vitest";
import { analyze } from "@/lib/abc/analyze";

// An invented two-part reel without P: fields: the parts are found from the repeat marks.
const REEL =
  "X:1\nT:Test Reel\nM:4/4\nL:1/8\nK:G\n" +
  "|:~G2BG dGBG|A2AB cBAG|~G2BG dGBG|A2AB c2BA:|\n" +
  "|:gfga bgdB|!p!c2ec BcAF|gfga bgdB|(3cBA GE D4:|\n";

describe("embellishments listing", () => {
  it("labels the second part's bars B, as the phrase map does", () => {
    const r = analyze(REEL);
    if (!r.ok) throw new Error(r.problems.map((p) => p.message).join("; "));
    expect(r.value.phraseMap.parts.map((p) => p.label)).toEqual(["A", "B"]);
    const at = (what: string) => r.value.embellishments.filter((e) => e.what === what).map((e) => e.position);
    expect(at("roll")).toEqual([
      { part: "A", bar: 1, beat: 1 },
      { part: "A", bar: 3, beat: 1 },
    ]);
    expect(at("p")).toEqual([{ part: "B", bar: 6, beat: 1 }]);
    expect(at("triplet")).toEqual([{ part: "B", bar: 8, beat: 1 }]);
  });
});
