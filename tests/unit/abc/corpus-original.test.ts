// The open corpus as first published (../shared/datasets/nottingham/ABC_original): malformed
// tunes by design (its README). Every tune is handled: an analysis or a clear problem list.
import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { splitTunes } from "@/lib/abc/split";
import { analyze } from "@/lib/abc/analyze";

const ROOT = "../shared/datasets/nottingham/ABC_original";
const files = readdirSync(ROOT)
  .filter((f) => f.endsWith(".abc"))
  .sort();

describe("ABC_original corpus", () => {
  for (const file of files) {
    it(`${file}: every tune analysed or rejected with located, plain problems`, () => {
      const text = readFileSync(`${ROOT}/${file}`, "utf8");
      const lines = text.split("\n").length;
      for (const t of splitTunes(text)) {
        const r = analyze(t.abc, { lineOffset: t.lineOffset });
        const problems = r.ok ? r.notes : r.problems;
        for (const p of problems) {
          expect(p.line).toBeGreaterThanOrEqual(t.lineOffset + 1);
          expect(p.line).toBeLessThanOrEqual(lines);
          expect(p.column).toBeGreaterThanOrEqual(1);
          expect(p.message).not.toMatch(/<[a-z]/i);
          expect(p.message.length).toBeGreaterThan(0);
        }
        if (r.ok) expect(r.value.stages[r.value.stages.length - 1].abc).toBe(t.abc);
      }
    });
  }
});
