// Comparing two settings of one tune, on tunes written for these tests (tests/fixtures/abc/phrases,
// invented) and settings of them changed here by hand.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { compareSettings, type Comparison } from "../../../lib/abc/compare";

const fixture = (name: string): string =>
  readFileSync(new URL(`../../fixtures/abc/phrases/${name}`, import.meta.url), "utf8");
const rosin = fixture("rosin-box.abc");
const lantern = fixture("lantern-hill.abc");

function compare(a: string, b: string, on?: "source" | "skeleton"): Comparison {
  const r = compareSettings(a, b, { on });
  if (!r.ok) throw new Error(r.problems.map((p) => p.message).join("; "));
  return r.value;
}
const changed = (c: Comparison) => c.bars.filter((b) => b.status !== "equal");

describe("compareSettings", () => {
  it("finds a one-note difference at the right bar and beat", () => {
    // bar 6 ends AFED in the first setting, AFAD in the second: the 7th eighth, beat 4 of 4/4
    const other = rosin.replace('"A"AFED|"D"d2fd Adfa|"G"gfed "A"cAcd:|', '"A"AFAD|"D"d2fd Adfa|"G"gfed "A"cAcd:|');
    const c = compare(rosin, other);
    expect(c.summary).toMatchObject({ equal: 15, different: 1, onlyInFirst: 0, onlyInSecond: 0 });
    expect(changed(c)).toEqual([
      {
        part: "A",
        place: "bar 6",
        firstBar: 6,
        secondBar: 6,
        status: "different",
        lengthDiffers: false,
        differences: [
          {
            beat: 4,
            kind: "pitch",
            first: { pitch: 64, note: "E4", duration: "1/8" },
            second: { pitch: 69, note: "A4", duration: "1/8" },
          },
        ],
      },
    ]);
  });

  it("says so clearly when one setting has a bar more, and keeps the rest aligned", () => {
    const other = rosin.replace('|"D"fdad "A"fedB|', '|"D"fdad "A"fedB|"D"fdad "A"fedB|');
    const c = compare(rosin, other);
    expect(c.summary).toMatchObject({ equal: 16, different: 0, onlyInFirst: 0, onlyInSecond: 1 });
    expect(changed(c)).toMatchObject([{ part: "B", firstBar: null, secondBar: 14, status: "onlyInSecond" }]);
    expect(c.summary.notes.join()).toContain("part B has 8 bars in the first setting and 9 in the second");
  });

  it("reports rhythm as well as pitch: a sixteenth fill against a held note", () => {
    const other = rosin.replace('|:"D"f2af', '|:"D"f/g/f af');
    const [bar] = changed(compare(rosin, other));
    expect(bar?.firstBar).toBe(9);
    expect(bar?.differences.map((d) => [d.beat, d.kind])).toEqual([
      [1, "duration"],
      [1.25, "onlyInSecond"],
    ]);
  });

  it("can compare the core melodies instead, where the fill is gone (issue 3 §3: a fill becomes its on-beat note)", () => {
    const other = rosin.replace('|:"D"f2af', '|:"D"f/g/f af');
    const [bar] = changed(compare(rosin, other, "skeleton"));
    expect(bar?.differences.map((d) => d.kind)).toEqual(["duration"]);
  });

  it("lines up pickups and second endings by their place", () => {
    const noPickup = lantern.replace("D|:", "|:").replace('|2"G"G3 G2B||', '|2"G"G3 G2d||');
    const c = compare(lantern, noPickup);
    expect(changed(c)).toMatchObject([
      { part: "A", place: "pickup", firstBar: 0, secondBar: null, status: "onlyInFirst" },
      {
        part: "A",
        place: "ending 2, bar 1",
        firstBar: 9,
        secondBar: 9,
        status: "different",
        differences: [{ beat: 2.667, kind: "pitch", first: { note: "B4" }, second: { note: "D5" } }],
      },
    ]);
  });

  it("returns the problems of a setting it cannot read, saying which one", () => {
    const r = compareSettings(rosin, "X:1\nK:C\n|:[");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]?.message).toMatch(/^second setting: /);
  });
});
