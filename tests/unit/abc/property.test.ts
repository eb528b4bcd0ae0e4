// Property tests (fast-check) on generated tunes: the invariants of PRODUCT.md §4 hold, the
// skeleton of a skeleton is itself, and the same tunes mutated (scripts/abc-mutate.ts) are either
// refused at a place or give versions that read again with every bar's length kept.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { skeletonOf } from "@/lib/abc/skeleton";
import { mutants } from "../../../scripts/abc-mutate";
import { checkOutputs, checkTune } from "./invariants";

const pitch = fc.constantFrom("D", "E", "F", "G", "A", "B", "c", "d", "e", "f", "g", "a", "^c", "=F", "_B");
const deco = fc.constantFrom("", "", "", "~", ".", "T", "!p!", "!slide!", "{g}", "{/a}", "u", "v", "!accent!", '"G"');
// One quarter-note beat of 4/4 with L:1/8, in one of the shapes the engine must handle.
const beat = fc.oneof(
  fc.tuple(deco, pitch).map(([d, p]) => `${d}${p}2`),
  fc.tuple(deco, pitch, pitch).map(([d, p, q]) => `${d}${p}${q}`),
  fc.tuple(pitch, pitch, pitch).map(([p, q, r]) => `${p}/${q}/${r}`),
  fc.tuple(pitch, pitch, pitch, pitch).map(([p, q, r, s]) => `${p}/${q}/${r}/${s}/`),
  fc.tuple(pitch, pitch, pitch).map(([p, q, r]) => `(3${p}${q}${r}`),
  fc.tuple(pitch, pitch).map(([p, q]) => `(${p}${q})`),
  fc.tuple(pitch, pitch).map(([p, q]) => `[${p}${q}]2`),
  fc.tuple(pitch, pitch).map(([p, q]) => `${p}>${q}`),
);
const bar = fc.array(beat, { minLength: 4, maxLength: 4 }).map((b) => b.join(" "));
const tuneArb = fc
  .array(bar, { minLength: 1, maxLength: 6 })
  .map((bars) => `X:1\nT:Generated\nM:4/4\nL:1/8\nK:D\n|:${bars.join("|")}:|\n`);

describe("generated tunes", () => {
  it("keep every invariant (PRODUCT.md §4)", () => {
    fc.assert(
      fc.property(tuneArb, (abc) => {
        expect(checkTune(abc)).toEqual([]);
      }),
      { numRuns: 150, seed: 31 },
    );
  });

  it("the skeleton of a skeleton is itself", () => {
    fc.assert(
      fc.property(tuneArb, (abc) => {
        const once = skeletonOf(abc);
        if (!once.ok) throw new Error("rejected");
        const twice = skeletonOf(once.value.abc);
        expect(twice.ok && twice.value.abc).toBe(once.value.abc);
      }),
      { numRuns: 150, seed: 32 },
    );
  });

  it("mutated, are refused with located problems or keep their bars in every version", () => {
    fc.assert(
      fc.property(tuneArb, fc.integer(), (abc, seed) => {
        const [mutant] = mutants([abc], 1, seed);
        expect(checkOutputs(mutant ?? abc).errors).toEqual([]);
      }),
      { numRuns: 400, seed: 33 },
    );
  });
});
