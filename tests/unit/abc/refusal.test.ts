// Problems and notes: what refuses a tune (the music could not be read as written) and what is
// only shown beside it. Tunes are written for these tests; the ABC rules cited are ABC 2.1's.
import { describe, expect, it } from "vitest";
import { analyze } from "@/lib/abc/analyze";
import type { Problem } from "@/lib/abc/types";

const HEAD = "X:1\nT:Test Tune\nM:4/4\nL:1/8\nK:D\n";
const tune = (body: string, head = HEAD): string => `${head}${body}\n`;
/** 1-based line and column of `needle` in `text`, found without the engine. */
function where(text: string, needle: string, from = 0): { line: number; column: number } {
  const before = text.slice(0, text.indexOf(needle, from)).split("\n");
  return { line: before.length, column: before[before.length - 1].length + 1 };
}
const refused = (abc: string): Problem[] => {
  const r = analyze(abc);
  if (r.ok) throw new Error(`accepted: ${abc}`);
  return r.problems;
};
const notesOf = (abc: string): Problem[] => {
  const r = analyze(abc);
  if (!r.ok) throw new Error(r.problems.map((p) => p.message).join("; "));
  return r.notes;
};

describe("problems refuse the tune, each at its place", () => {
  it("an unclosed chord symbol (ABC 2.1 §4.18: a chord symbol is in double quotes)", () => {
    const abc = tune('|:"G ABcd efga|ABcd efga:|');
    const [p] = refused(abc);
    expect(p).toEqual({ ...where(abc, '"G'), message: 'The chord symbol "G ABcd efga… has no closing quote (")' });
  });

  it("an unclosed grace group (§4.12: grace notes are in braces)", () => {
    const abc = tune("ABcd {g efga|ABcd efga|");
    expect(refused(abc)).toEqual([
      { ...where(abc, "{g"), message: "The grace notes {g efga|ABcd… have no closing brace (})" },
    ]);
  });

  it("an unclosed chord names the chord, not an empty quote, at its opening bracket (§4.17)", () => {
    const abc = tune("ABcd [Ac efga|ABcd efga|");
    const [p] = refused(abc);
    expect(p).toEqual({ ...where(abc, "[Ac"), message: "The chord [Ac efga|ABc… has no closing bracket (])" });
    expect(p.message).not.toMatch(/""/);
  });

  it("a stray bracket, which abcjs takes silently for an invisible bar line", () => {
    const abc = tune("ABcd e]fga|ABcd efga|");
    expect(refused(abc)).toEqual([{ ...where(abc, "]"), message: expect.stringMatching(/^This "\]" closes nothing/) }]);
  });

  it("a tuplet with no notes after it before the bar line (§4.13), which abcjs drops silently", () => {
    const abc = tune("ABcd efga (3|ABcd efga|");
    expect(refused(abc)).toEqual([
      { ...where(abc, "(3"), message: 'The tuplet "(3" has no notes after it before the bar line' },
    ]);
  });

  it("unknown characters in the music", () => {
    const abc = tune("ABcd e#fga|ABcd efga|");
    expect(refused(abc)).toEqual([{ ...where(abc, "#"), message: 'Unknown character ignored: "#"' }]);
  });

  it("all three slips of one tune together, one line each", () => {
    const abc = tune('|:"G ABcd efga|\n{g ABcd efga|\nAB]cd efga|ABcd efg2:|');
    expect(refused(abc).map((p) => [p.line, p.column])).toEqual([
      [where(abc, '"G').line, where(abc, '"G').column],
      [where(abc, "{g").line, where(abc, "{g").column],
      [where(abc, "]").line, where(abc, "]").column],
    ]);
  });

  it("a missing K: line is named as such, not as a missing title (§3.1.14: K: ends the header)", () => {
    const abc = "X:1\nT:No Key\nM:4/4\nL:1/8\nABcd efga|\n";
    expect(refused(abc)).toEqual([
      { line: 5, column: 1, message: expect.stringMatching(/^The tune has no K: line, so its music cannot be read/) },
    ]);
  });

  it("a length divided by zero and an old-style +chord+ are input errors at their place, not internal errors", () => {
    const zero = tune("A/0Bcd efga|");
    expect(refused(zero)).toEqual([
      { ...where(zero, "A/0"), message: '"A/0" has no length: a note or rest lasts more than 0' },
    ]);
    const plus = tune("[+GB]cd efga|");
    const problems = refused(plus);
    expect(problems).toEqual([
      {
        ...where(plus, "+GB"),
        message: expect.stringMatching(/^"\+GB\]c" is read as a decoration, so its notes are lost/),
      },
    ]);
    for (const p of [...refused(zero), ...problems]) expect(p.message).not.toMatch(/Internal error/);
  });
});

describe("notes go with the tune and do not refuse it", () => {
  it("a header field ABC 2.1 does not define (the corpus's Y:), once for its line", () => {
    const abc = "X:1\nT:Test Tune\nY:AAB\nM:4/4\nL:1/8\nK:D\nABcd efga|ABcd efga|\n";
    expect(notesOf(abc)).toEqual([
      { line: 3, column: 1, message: "Y: is not a field of ABC 2.1, so the line is left out" },
    ]);
  });

  it("a bar of ten eighths in 4/4, by its bar number (a slip teachers make often: common practice)", () => {
    const abc = tune("ABcd efga|ABcd efgabc|ABcd efga|");
    expect(notesOf(abc)).toEqual([
      { ...where(abc, "ABcd efgabc"), message: "Bar 2 lasts 10 eighths, but M:4/4 makes a bar of 8 eighths" },
    ]);
  });

  it("leaves alone a pickup, the closing bar that completes it, and the endings (§4.9)", () => {
    const abc = tune("A|:ABcd efga|ABcd efg:|\n|:[1 ABcd efga|ABcd e2:|[2 ABcd efgabc|]");
    expect(notesOf(abc)).toEqual([]);
  });

  it("a short bar in the middle of a part is noted, with its length in the tune's unit", () => {
    const abc = tune("ABcd efga|ABcd efg|ABcd efga|ABcd efga|", "X:1\nT:Test Tune\nM:3/4\nL:1/4\nK:D\n");
    expect(notesOf(abc).map((n) => n.message)).toEqual([
      "Bar 1 lasts 8 quarter notes, but M:3/4 makes a bar of 3 quarter notes",
      "Bar 2 lasts 7 quarter notes, but M:3/4 makes a bar of 3 quarter notes",
      "Bar 3 lasts 8 quarter notes, but M:3/4 makes a bar of 3 quarter notes",
      "Bar 4 lasts 8 quarter notes, but M:3/4 makes a bar of 3 quarter notes",
    ]);
  });

  it("past ten long bars, one note sums up the rest and asks about the meter", () => {
    const abc = tune(
      Array.from({ length: 14 }, () => "ABcd efga").join("|") + "|",
      "X:1\nT:Test Tune\nM:3/4\nL:1/8\nK:D\n",
    );
    const notes = notesOf(abc);
    expect(notes).toHaveLength(11);
    expect(notes[10].message).toBe(
      "4 more bars (11, 12, 13, 14) are not as long as the meter makes a bar: is M: right?",
    );
  });

  it("a refused tune keeps its notes apart from its problems", () => {
    const r = analyze("X:1\nT:Test Tune\nY:AAB\nM:4/4\nL:1/8\nK:D\nABcd e#fga|\n");
    expect(r.ok).toBe(false);
    expect(r.notes.map((n) => n.message)).toEqual(["Y: is not a field of ABC 2.1, so the line is left out"]);
  });
});
