// Phrase map on tunes written for these tests (tests/fixtures/abc/phrases, invented, no published
// source). The patterns checked are the ones teachers look for: common practice, no published source.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { phraseMap, type PhraseMap } from "../../../lib/abc/phrase-map";
import { skeletonOf } from "../../../lib/abc/skeleton";

const fixture = (name: string): string =>
  readFileSync(new URL(`../../fixtures/abc/phrases/${name}`, import.meta.url), "utf8");
// phrases are compared on the skeleton (issue 3 §5), so the map is built from skeletonOf's bars
const mapOf = (abc: string): PhraseMap => {
  const sk = skeletonOf(abc);
  if (!sk.ok) throw new Error(sk.problems.map((p) => p.message).join("; "));
  return phraseMap(sk.value.bars, sk.value.meter, sk.value.unit);
};
const letters = (m: PhraseMap, part: number): string[] => m.parts[part]?.phrases.map((p) => p.letter) ?? [];
const twin = (m: PhraseMap, a: string, b: string) => m.twins.find((t) => t.first === a && t.second === b);

describe("phrase map of a two-part reel (The Rosin Box)", () => {
  const m = mapOf(fixture("rosin-box.abc"));

  it("finds the parts from the repeats and splits each 8-bar part into four 2-bar phrases", () => {
    expect(m.parts.map((p) => p.label)).toEqual(["A", "B"]);
    expect(m.parts[0]?.foundBy).toBe("repeat marks and double bars");
    expect(m.parts[1]?.phrases.map((p) => [p.id, p.bars])).toEqual([
      ["B1", [9, 10]],
      ["B2", [11, 12]],
      ["B3", [13, 14]],
      ["B4", [15, 16]],
    ]);
    expect(m.parts[0]?.grouping.phraseBars).toEqual([2, 2, 2, 2]);
  });

  it("labels phrase 1 = phrase 3 and a one-note near twin with form letters", () => {
    expect(letters(m, 0)).toEqual(["a", "b", "a", "b′"]);
    expect(letters(m, 1)).toEqual(["c", "d", "c′", "b′"]);
    expect(twin(m, "A1", "A3")).toMatchObject({ kind: "exact", differingNotes: 0 });
  });

  it("says where the near twin differs: bar, beat and both pitches", () => {
    // A2 ends "cAce", A4 ends "cAcd": the last eighth of bar 8, E5 against D5
    expect(twin(m, "A2", "A4")).toMatchObject({
      kind: "near",
      differingNotes: 1,
      differences: [{ firstBar: 4, secondBar: 8, beat: 4.5, firstPitch: 76, secondPitch: 74, notes: 1 }],
    });
  });

  it("reports the cross-part patterns", () => {
    const p = m.patterns.map((x) => [x.pattern, x.first.join(), x.second.join(), x.kind]);
    expect(p).toContainEqual(["phrase1=phrase3", "A1", "A3", "exact"]);
    expect(p).toContainEqual(["phrase1=phrase3", "B1", "B3", "near"]);
    expect(p).toContainEqual(["lastPhraseShared", "A4", "B4", "exact"]);
    expect(p.some((x) => x[0] === "secondHalfShared")).toBe(false);
  });

  it("counts the learning load before and after swapping each near twin to its first occurrence", () => {
    expect(m.swaps).toEqual([
      { phrase: "A4", model: "A2", differingNotes: 1 },
      { phrase: "B3", model: "B1", differingNotes: 1 },
      { phrase: "B4", model: "A2", differingNotes: 1 },
    ]);
    expect(m.learningLoad).toEqual({ distinct: 6, afterSwaps: 4 });
  });
});

describe("phrase map of a jig with a pickup and first/second endings (Lantern Hill)", () => {
  const m = mapOf(fixture("lantern-hill.abc"));
  const a = m.parts[0];

  it("keeps the pickup out of the bar count and runs the phrases through the first ending", () => {
    expect(a?.pickup).toEqual([0]);
    expect(a?.countedBars).toBe(8);
    expect(a?.phrases.map((p) => p.barNumbers)).toEqual([
      [1, 2],
      [3, 4],
      [5, 6],
      [7, 8],
    ]);
    expect(a?.endings).toContain("first ending");
  });

  it("compares the second ending as an alternative last phrase", () => {
    const last = a?.phrases[3];
    expect(last?.bars).toEqual([7, 9]);
    expect(last?.alternatives).toEqual([{ id: "A4/2", ending: "2", bars: [7, 9], barNumbers: [7, 9], letter: "d′" }]);
    expect(twin(m, "A4", "A4/2")?.differingNotes).toBe(1);
  });

  it("finds the shared second half and last phrase of A and B", () => {
    const p = m.patterns.map((x) => [x.pattern, x.first.join(), x.second.join(), x.kind]);
    expect(p).toContainEqual(["secondHalfShared", "A3,A4", "B3,B4", "exact"]);
    expect(p).toContainEqual(["lastPhraseShared", "A4", "B4", "exact"]);
    expect(letters(m, 1)).toEqual(["e", "f", "c", "d"]);
  });
});

describe("a second ending unlike any phrase", () => {
  it("gets a letter of its own after the parts' letters, which it does not shift", () => {
    const m = mapOf(fixture("lantern-hill.abc").replace('|2"G"G3 G2B||', '|2"C"e3 c3||'));
    expect(letters(m, 0)).toEqual(["a", "b", "c", "d"]);
    expect(letters(m, 1)).toEqual(["e", "f", "c", "d"]);
    expect(m.parts[0]?.phrases[3]?.alternatives[0]?.letter).toBe("g");
    expect(m.learningLoad).toEqual({ distinct: 7, afterSwaps: 7 });
  });
});

describe("phrase map of a waltz whose parts do not divide into four (The Short Reed)", () => {
  const m = mapOf(fixture("short-reed.abc"));

  it("states the grouping it used", () => {
    expect(m.parts.map((p) => [p.label, p.foundBy, p.countedBars, p.grouping.phraseBars])).toEqual([
      ["A", "P: label", 6, [2, 2, 2]],
      ["B", "P: label", 10, [2, 2, 2, 2, 2]],
    ]);
    expect(m.parts[1]?.grouping.reason).toMatch(/10 bars do not divide into four.*5 phrases of 2 bars/);
  });

  it("treats the B part's short opening bar as its pickup, not a bar", () => {
    // the model may number the pickup 0 or 7; either way it is not one of the part's ten bars
    const pickup = m.parts[1]?.pickup ?? [];
    expect(pickup).toHaveLength(1);
    const first = (pickup[0] ?? 0) > 0 ? 8 : 7;
    expect(m.parts[1]?.phrases.map((p) => p.bars)).toEqual([0, 2, 4, 6, 8].map((k) => [first + k, first + k + 1]));
    expect(twin(m, "B1", "B3")?.kind).toBe("exact");
  });
});

describe("counting notes, not grid points", () => {
  const tune = (a3: string): string =>
    `X:1\nT:t\nM:4/4\nL:1/8\nK:C\n|:c2ec GcEG|FAcA GECE|B2dB GBDG|ABcd e4|${a3}|B2dB GBDG|ABcd c4:|\n`;

  it("one note changed under a longer note is one note", () => {
    // c2 (one note over two grid points) against cd: only the second point differs
    const m = mapOf(tune("cdec GcEG|FAcA GECE"));
    expect(twin(m, "A1", "A3")).toMatchObject({ kind: "near", differingNotes: 1 });
  });

  it("a longer note replaced by two other notes is two notes", () => {
    const m = mapOf(tune("deec GcEG|FAcA GECE"));
    expect(twin(m, "A1", "A3")).toMatchObject({ kind: "near", differingNotes: 2 });
    expect(m.parts[0]?.phrases[2]?.letter).toBe("a′");
  });

  it("three notes changed is no longer a twin", () => {
    const m = mapOf(tune("deec AcEG|FAcA GECE"));
    expect(twin(m, "A1", "A3")).toBeUndefined();
    expect(letters(m, 0)).toEqual(["a", "b", "c", "b′"]);
  });

  it("a tie continues its note: c2-c2 equals c4", () => {
    const abc =
      "X:1\nT:t\nM:4/4\nL:1/8\nK:C\n|:c4 GcEG|FAcA GECE|B2dB GBDG|ABcd e4|c2-c2 GcEG|FAcA GECE|B2dB GBDG|ABcd c4:|\n";
    const m = mapOf(abc);
    expect(twin(m, "A1", "A3")?.kind).toBe("exact");
  });
});

describe("the comparison grid", () => {
  it("refines a quarter-note unit to eighths when eighths are written, so they are compared", () => {
    // L:1/4 with eighths written as d/2e/2, as many collections do
    const abc =
      "X:1\nT:t\nM:4/4\nL:1/4\nK:D\n|:d/2e/2 fa g|fe d2|d/2f/2 fa g|fe d2|d/2e/2 fa g|fe d2|A B c d|e2 d2:|\n";
    const m = mapOf(abc);
    expect(m.grid).toBe("1/8");
    expect(twin(m, "A1", "A2")).toMatchObject({
      differingNotes: 1,
      differences: [{ firstBar: 1, secondBar: 3, beat: 1.5 }],
    });
    expect(twin(m, "A1", "A3")?.kind).toBe("exact");
  });
});

describe("finding parts without labels, and with a labelled lead-in", () => {
  // eight bars of a plain invented reel strain, L:1/8
  const strain = ["DEFG ABcd", "efge dBAG", "FGAB cdec", "dBAG FDD2", "DFAd fdAF", "GBdg fdec", "dcBA GFED", "E2D2 D4"];
  const head = "X:1\nT:t\nM:4/4\nL:1/8\nK:D\n";

  it("takes a tune with no marks at all as one part when it is 16 bars or fewer", () => {
    const m = mapOf(`${head}|${[...strain, ...strain].join("|")}|]\n`);
    expect(m.parts.map((p) => [p.label, p.countedBars, p.grouping.phraseBars])).toEqual([["A", 16, [4, 4, 4, 4]]]);
    expect(m.parts[0]?.foundBy).toMatch(/no P: labels, repeats or double bars/);
  });

  it("halves a longer stretch without marks into strains (common practice: 8 or 16 bars)", () => {
    const m = mapOf(`${head}|${[...strain, ...strain, ...strain, ...strain].join("|")}|]\n`);
    expect(m.parts.map((p) => [p.label, p.countedBars])).toEqual([
      ["A", 16],
      ["B", 16],
    ]);
    expect(m.parts[1]?.foundBy).toMatch(/halved/);
    expect(m.patterns.map((p) => p.pattern)).toContain("secondHalfShared");
  });

  it("splits at a double bar, and joins a labelled lead-in to the part it leads into", () => {
    const m = mapOf(
      `${head}P:I\nA2|\nP:A\n|:${strain.join("|")}:|\nP:B\n|:${strain.slice(4).join("|")}|${strain.slice(0, 4).join("|")}:|\n`,
    );
    expect(m.parts.map((p) => [p.label, p.pickup, p.countedBars])).toEqual([
      ["A", [0], 8],
      ["B", [], 8],
    ]);
    expect(m.parts[1]?.phrases.map((p) => p.letter)).toEqual(["c", "d", "a", "b"]);
    const twoStrains = mapOf(
      `${head}${strain.join("|")}||${strain.slice(4).join("|")}|${strain.slice(0, 4).join("|")}|]\n`,
    );
    expect(twoStrains.parts.map((p) => [p.label, p.foundBy])).toEqual([
      ["A", "repeat marks and double bars"],
      ["B", "repeat marks and double bars"],
    ]);
  });
});
