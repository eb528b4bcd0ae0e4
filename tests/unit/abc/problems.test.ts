// Bad input: problems with line, column and a plain message; nothing throws.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyze } from "@/lib/abc/analyze";
import { warningToProblem } from "@/lib/abc/parse";
import { splitTunes } from "@/lib/abc/split";
import { skeletonOf } from "@/lib/abc/skeleton";

describe("problems", () => {
  it("turns an abcjs warning into a located plain-text problem", () => {
    const w = 'Music Line:4:7: Unknown character ignored:  @@@ ##<span style="text-decoration:underline;">#</span> |';
    expect(warningToProblem(w, 10)).toEqual({ line: 14, column: 7, message: 'Unknown character ignored: "#"' });
  });

  it("points a bad character at its line and column in the file", () => {
    const file = "% my tunes\n\nX:1\nT:One\nK:G\nABc|\n\nX:2\nT:Two\nK:D\nAB@c|\n";
    const tunes = splitTunes(file);
    expect(tunes.map((t) => t.lineOffset)).toEqual([2, 7]);
    const r = analyze(tunes[1].abc, { lineOffset: tunes[1].lineOffset });
    expect(!r.ok && r.problems).toEqual([{ line: 11, column: 3, message: 'Unknown character ignored: "@"' }]);
  });

  it("rejects a text with no music with a plain reason", () => {
    const r = skeletonOf("X:1\nT:Empty\nK:G\n");
    expect(r.ok).toBe(false);
    expect(!r.ok && r.problems[0].message).toMatch(/no notes/);
    expect(skeletonOf("").ok).toBe(false);
  });

  it("never throws, whatever the input (ABC-like noise)", () => {
    const piece = fc.constantFrom(
      "X:1\n",
      "K:G\n",
      "M:6/8\n",
      "L:1/16\n",
      "(3",
      "[",
      "]",
      "{",
      "}",
      "!",
      "!trill!",
      "~",
      "A",
      "c'",
      "_B,",
      "2",
      "/",
      ">",
      "|",
      ":|",
      "[1",
      '"G"',
      "(",
      ")",
      "-",
      "z",
      "&",
      "\n",
      " ",
      "U:W=!roll!\n",
      "W",
      "[K:D]",
      "(5:",
      "%",
    );
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 40 }), (parts) => {
        const r = analyze(parts.join(""));
        const problems = r.ok ? r.notes : r.problems;
        for (const p of problems) {
          expect(p.line).toBeGreaterThanOrEqual(1);
          expect(p.message).not.toMatch(/<span/);
        }
      }),
      { numRuns: 300, seed: 7 },
    );
  });
});
