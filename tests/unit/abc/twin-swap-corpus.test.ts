// Twin swap over the open corpus (../shared/datasets/nottingham/ABC_cleaned, see its README): every
// learning version re-parses with no new abcjs warnings (the README: "no new warnings" is the rule,
// as the Y: field already warns), keeps every bar's length, and each swapped phrase is an exact twin
// of its model afterwards: it takes the model's form letter.
import { existsSync, readdirSync, readFileSync } from "node:fs";
import abcjs from "abcjs";
import { describe, expect, it } from "vitest";
import { phraseMap } from "../../../lib/abc/phrase-map";
import { buildModel, skeletonOf } from "../../../lib/abc/skeleton";
import { splitTunes } from "../../../lib/abc/split";
import { applyEdits, planSwaps } from "../../../lib/abc/twin-swap";
import type { Bar } from "../../../lib/abc/types";

const DIR = new URL("../../../../shared/datasets/nottingham/ABC_cleaned/", import.meta.url);
const warningCount = (abc: string): number => {
  const w: unknown = Reflect.get(abcjs.parseOnly(abc)[0] ?? {}, "warnings");
  return Array.isArray(w) ? w.length : 0;
};
const lengths = (bars: Bar[]): string => bars.map((b) => `${b.length.num}/${b.length.den}`).join(" ");

describe.runIf(existsSync(DIR))("twin swap over every tune in ABC_cleaned", () => {
  it("re-parses cleanly, keeps bar lengths and makes each swapped phrase an exact twin", { timeout: 180_000 }, () => {
    const problems: string[] = [];
    let made = 0;
    for (const file of readdirSync(DIR).filter((f) => f.endsWith(".abc"))) {
      for (const t of splitTunes(readFileSync(new URL(file, DIR), "utf8"))) {
        const sk = skeletonOf(t.abc);
        const src = buildModel(t.abc);
        if (!sk.ok || !src.ok) continue;
        const plan = planSwaps(t.abc, src.value.bars, phraseMap(sk.value.bars, sk.value.meter, sk.value.unit));
        if (plan.made.length === 0) continue;
        made += plan.made.length;
        const title = /^T:(.*)$/m.exec(t.abc)?.[1] ?? file;
        const out = applyEdits(t.abc, plan.edits);
        if (warningCount(out) > warningCount(t.abc)) problems.push(`${title}: new warnings`);
        const outModel = buildModel(out);
        const outSk = skeletonOf(out);
        if (!outModel.ok || !outSk.ok) {
          problems.push(`${title}: the learning version does not read`);
          continue;
        }
        if (lengths(outModel.value.bars) !== lengths(src.value.bars)) problems.push(`${title}: bar lengths changed`);
        const after = phraseMap(outSk.value.bars, outSk.value.meter, outSk.value.unit);
        // an exact twin takes its model's form letter (a′ played like a is a again)
        const letterOf = (id: string): string | undefined =>
          after.parts.flatMap((p) => p.phrases.flatMap((x) => [x, ...x.alternatives])).find((x) => x.id === id)?.letter;
        for (const s of plan.made) {
          if (letterOf(s.phrase) === undefined || letterOf(s.phrase) !== letterOf(s.model))
            problems.push(`${title}: ${s.phrase} is not an exact twin of ${s.model} after the swap`);
        }
      }
    }
    expect(problems).toEqual([]);
    expect(made).toBeGreaterThan(100); // near twins are common in dance tunes (common practice)
  });
});
