// The open corpus (../shared/datasets/nottingham/ABC_cleaned, see its README): every invariant of
// PRODUCT.md §4 on every tune.
import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { splitTunes } from "@/lib/abc/split";
import { analyze } from "@/lib/abc/analyze";
import { checkTune } from "./invariants";

const ROOT = "../shared/datasets/nottingham/ABC_cleaned";
// Two cleaned tunes still hold a broken chord, refused with a problem at its place: "Joy of the
// Dance" writes [e2c2 with no closing bracket, "Dance All Night" the old +GB+ chord inside brackets.
const REFUSED: Record<string, RegExp> = {
  "Joy of the Dance": /^rejected: The chord \[e2c2\(3A\/2B\/… has no closing bracket/,
  "Dance All Night": /^rejected: "\+GB\]\[" is read as a decoration, so its notes are lost/,
};
const files = readdirSync(ROOT)
  .filter((f) => f.endsWith(".abc"))
  .sort();

describe("ABC_cleaned corpus (Nottingham Music Database, cleaned)", () => {
  it("has the tunes its README describes (about 1,000)", () => {
    const n = files.reduce((a, f) => a + splitTunes(readFileSync(`${ROOT}/${f}`, "utf8")).length, 0);
    expect(n).toBeGreaterThan(900);
  });

  for (const file of files) {
    it(`${file}: stages re-parse without new warnings, bars keep their length, last stage = source, bare skeleton, on-beat pitches kept, deterministic`, () => {
      const failures: string[] = [];
      for (const t of splitTunes(readFileSync(`${ROOT}/${file}`, "utf8"))) {
        const title = /^T:(.*)$/m.exec(t.abc)?.[1] ?? `line ${t.lineOffset + 1}`;
        const errors = checkTune(t.abc);
        if (REFUSED[title]) {
          if (errors.length !== 1 || !REFUSED[title].test(errors[0]))
            failures.push(`${title}: not refused as expected`);
          continue;
        }
        for (const e of errors) failures.push(`${title}: ${e}`);
        const a = analyze(t.abc);
        const b = analyze(t.abc);
        if (JSON.stringify(a) !== JSON.stringify(b)) failures.push(`${title}: two runs differ`);
      }
      expect(failures).toEqual([]);
    });
  }
});
