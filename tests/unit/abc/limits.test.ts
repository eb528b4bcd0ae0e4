// Limits of one tune: each refused as a problem at its place, before anything is made in
// proportion to it (a 99,999,999-eighth note once ran the process out of memory).
import { describe, expect, it } from "vitest";
import { analyze } from "@/lib/abc/analyze";
import { MAX_ABC_BYTES, MAX_BARS, MAX_NOTE_BARS } from "@/lib/abc/limits";
import type { Problem } from "@/lib/abc/types";

const HEAD = "X:1\nT:Test Tune\nM:4/4\nL:1/8\nK:D\n";
const refused = (abc: string): Problem[] => {
  const r = analyze(abc);
  if (r.ok) throw new Error("accepted");
  return r.problems;
};

describe("limits", () => {
  it("a note or rest longer than 64 bars of its meter, at the note", () => {
    expect(MAX_NOTE_BARS).toBe(64);
    expect(refused(`${HEAD}ABcd efga|A99999999|\n`)).toEqual([
      {
        line: 6,
        column: 11,
        message: '"A99999999" lasts 12,500,000 bars of 4/4; a note, rest or bar may last at most 64 bars.',
      },
    ]);
    expect(refused(`${HEAD}Z9999999|\n`)[0]).toMatchObject({
      line: 6,
      column: 1,
      message: expect.stringMatching(/^"Z9999999" lasts 9,999,999 bars/),
    });
    // 64 bars of 4/4 is 512 eighths: the longest note allowed
    expect(analyze(`${HEAD}A512|\n`).ok).toBe(true);
    expect(refused(`${HEAD}A513|\n`)[0].message).toMatch(/^"A513" lasts 64 bars/);
  });

  it("more than 2,000 bars, at the first bar past the limit", () => {
    const line = "ABcd efga|".repeat(10);
    const body = Array.from({ length: MAX_BARS / 10 + 1 }, () => line).join("\n");
    const [p] = refused(`${HEAD}${body}\n`);
    expect(p).toEqual({
      line: 6 + MAX_BARS / 10,
      column: 1,
      message: "The tune has 2,010 bars; one tune may have at most 2,000. Split it into several tunes.",
    });
    expect(
      analyze(
        `${HEAD}${body
          .split("\n")
          .slice(0, MAX_BARS / 10)
          .join("\n")}\n`,
      ).ok,
    ).toBe(true);
  });

  it("more than 200 kB of ABC, where the text passes the limit, before abcjs reads it", () => {
    const line = `${"ABcd efga|".repeat(7)}\n`; // 71 bytes
    const abc = HEAD + line.repeat(Math.ceil(MAX_ABC_BYTES / line.length) + 1);
    const [p] = refused(abc);
    const over = MAX_ABC_BYTES; // the first byte past the limit, as an offset (ASCII: one byte a character)
    const before = abc.slice(0, over).split("\n");
    expect(p).toEqual({
      line: before.length,
      column: before[before.length - 1].length + 1,
      message: expect.stringMatching(/^The tune is 20\d kB of ABC; one tune may be at most 200 kB/),
    });
  });

  it("counts bytes, not characters: 200 kB of accented lyrics is over the limit", () => {
    const words = `w:${"é".repeat(70)}\n`; // 142 bytes in 73 characters
    const abc = `${HEAD}ABcd efga|\n${words.repeat(Math.ceil(MAX_ABC_BYTES / 142) + 1)}`;
    expect(abc.length).toBeLessThan(MAX_ABC_BYTES);
    expect(refused(abc)[0].message).toMatch(/kB of ABC/);
  });

  it("a meter whose bar is longer than four whole notes", () => {
    expect(refused("X:1\nT:Test Tune\nM:99999999/1\nL:1/8\nK:D\nA799999992|\n")).toEqual([
      { line: 3, column: 1, message: expect.stringMatching(/^M:99999999\/1 makes a bar of 99,999,999 whole notes/) },
    ]);
  });
});
