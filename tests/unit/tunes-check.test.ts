// Saving rules of the tune editor, checked without a database: lib/tunes/check.ts is what both the
// browser and the save route run, so a tune is refused in both places with the same words.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { tuneTypeEnum } from "@/db/schema";
import { checkTune, problemText } from "@/lib/tunes/check";
import { headerField, TUNE_TYPES, tuneTypeOf } from "@/lib/tunes/header";

const WICKER = readFileSync("tests/fixtures/teach/wicker-gate.abc", "utf8"); // an invented reel (this project's own)

/** 1-based line and column of the first occurrence of `needle`, found independently of the engine. */
function where(text: string, needle: string): { line: number; column: number } {
  const before = text.slice(0, text.indexOf(needle)).split("\n");
  return { line: before.length, column: before[before.length - 1].length + 1 };
}

describe("checkTune", () => {
  it("reads title, type, key and meter from the header and makes the default four stages", () => {
    const r = checkTune(WICKER);
    if (!r.ok) throw new Error(JSON.stringify(r.problems));
    // ABC 2.1 §3.1.2 T: title, §3.1.9 R: rhythm, §3.1.14 K: key, §3.1.6 M: meter
    expect([r.value.title, r.value.tuneType, r.value.key, r.value.meter]).toEqual(["Wicker Gate", "reel", "D", "4/4"]);
    expect(r.value.stages.map((s) => s.name)).toEqual([
      "Skeleton",
      "Bowing",
      "Ornaments, slides and fills",
      "Full setting",
    ]);
    // PRODUCT.md §4 invariant: the last stage equals the source.
    expect(r.value.stages[3].abc).toBe(WICKER);
    expect(r.value.stagePlan).toBeNull();
  });

  it("refuses a stray character with its line and column, as abcjs reports it", () => {
    // '#' alone is not ABC music code (ABC 2.1 §4: accidentals are ^ = _ before a note).
    const bad = WICKER.replace("egfe dBAF|fa", "egfe d#BAF|fa");
    const r = checkTune(bad);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0]).toMatchObject({ ...where(bad, "#"), message: 'Unknown character ignored: "#"' });
    expect(problemText(r.problems[0])).toBe(
      `Line ${where(bad, "#").line}, column ${where(bad, "#").column}: Unknown character ignored: "#"`,
    );
  });

  it("puts problems of a tune inside a file at the file's line", () => {
    const r = checkTune(WICKER.replace("dGBd", "dGB#"), { lineOffset: 40 });
    expect(r.ok ? null : r.problems[0]?.line).toBe(40 + where(WICKER, "dGBd").line);
  });

  it("asks for a title", () => {
    const r = checkTune(WICKER.replace("T:Wicker Gate\n", ""));
    expect(r.ok ? [] : r.problems.map((p) => p.message)).toEqual(["The tune needs a title: add a T: line under X:."]);
  });

  it("refuses a tune with no notes", () => {
    const r = checkTune("X:1\nT:Empty\nM:4/4\nK:D\n");
    expect(r.ok).toBe(false);
  });

  it("gives the plan's reasons apart from the ABC's problems", () => {
    const r = checkTune(WICKER, {
      stagePlan: {
        stages: [
          { name: "Skeleton", adds: [] },
          { name: "Bowing", adds: ["bowing"] },
        ],
      },
    });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toEqual([]);
    expect(r.planReasons).toContain(
      'Kind "ornaments" is never added back, so the last stage would not be the full setting.',
    );
  });

  it("follows a teacher's plan: three stages, the middle one with bowing and ornaments", () => {
    const plan = {
      stages: [
        { name: "Bare tune", adds: [] },
        { name: "Bow and ornament", adds: ["bowing", "ornaments"] as const },
        {
          name: "Everything",
          adds: ["slides", "fills", "doubleStops", "dynamics", "articulation", "fingerings", "marks"] as const,
        },
      ],
    };
    const r = checkTune(WICKER, { stagePlan: { stages: plan.stages.map((s) => ({ ...s, adds: [...s.adds] })) } });
    if (!r.ok) throw new Error("plan refused");
    expect(r.value.stages.map((s) => s.name)).toEqual(["Bare tune", "Bow and ornament", "Everything"]);
    // PRODUCT.md §3: rolls (~, ABC 2.1 §4.14) and grace notes ({g}, ABC 2.1 §4.12) are ornaments, back at stage 2;
    // the triplet is a rhythmic fill and !p! a dynamic, both still out.
    expect(r.value.stages[1].abc).toContain("~G2");
    expect(r.value.stages[1].abc).toContain("{g}a");
    expect(r.value.stages[1].abc).not.toContain("(3");
    expect(r.value.stages[1].abc).not.toContain("!p!");
    expect(r.value.stages[0].abc).not.toContain("~");
  });

  it("keeps the accepted swaps the phrase map offers and lets stale ones go", () => {
    const r = checkTune(WICKER, { acceptedSwaps: ["A3", "B2"] });
    if (!r.ok) throw new Error("refused");
    expect(r.value.acceptedSwaps).toEqual(["A3"]);
    expect(r.value.droppedSwaps).toEqual(["B2"]);
  });

  it("stores Windows line ends as plain newlines", () => {
    const r = checkTune(WICKER.replace(/\n/g, "\r\n"));
    expect(r.ok && r.value.abc).toBe(WICKER);
  });
});

describe("header fields", () => {
  it("knows the same tune types as the database enum", () => {
    expect([...TUNE_TYPES]).toEqual(tuneTypeEnum.enumValues);
  });

  it("reads R: into a type, however it is spelt", () => {
    // ABC 2.1 §3.1.9: R: is free text ("reel", "slip jig"); common practice also writes "slip-jig", "Slipjig".
    expect(tuneTypeOf("X:1\nR:Slip-jig\nK:D\n")).toBe("slip jig");
    expect(tuneTypeOf("X:1\nR:Slipjig\nK:D\n")).toBe("slip jig");
    expect(tuneTypeOf("X:1\nR: Hornpipe % set dance\nK:D\n")).toBe("hornpipe");
    expect(tuneTypeOf("X:1\nK:D\n")).toBe("other");
    expect(headerField("X:1\nM:6/8\nK:D\nM:3/4\n", "M")).toBe("6/8"); // the header's, not a change in the body
  });
});
