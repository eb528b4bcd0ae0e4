// Seeded fuzz over the open corpus (../shared/datasets/nottingham, both the cleaned and the first
// published files): thousands of tunes mutated as a typing slip, a pasted fragment or a hostile
// upload might (scripts/abc-mutate.ts). Whatever the input, the engine answers without throwing:
// a refusal with located, plain problems, or versions that abcjs reads again with no problem and
// no new note, bar for bar of the same lengths. How long the slowest input takes is a figure of
// `npm run -s bench:abc`, which runs the same mutants; here it is only reported.
import { describe, expect, it } from "vitest";
import { corpusTunes, FUZZ_COUNT as COUNT, FUZZ_SEED as SEED, mutants } from "../../../scripts/abc-mutate";
import { checkOutputs } from "./invariants";

describe("fuzz: mutated corpus tunes", () => {
  it(
    `${COUNT} mutants (seed ${SEED}): no exception, no unreadable output, every bar's length kept`,
    { timeout: 600_000 },
    () => {
      const tunes = corpusTunes();
      expect(tunes.length).toBeGreaterThan(2000);
      const failures: string[] = [];
      let refused = 0;
      let slowest = 0;
      mutants(tunes, COUNT, SEED).forEach((abc, n) => {
        const t0 = performance.now();
        try {
          const out = checkOutputs(abc);
          if (out.errors.length) failures.push(`mutant ${n}: ${out.errors.join("; ")}`);
          if (out.refused) refused++;
        } catch (e) {
          failures.push(`mutant ${n} threw ${e instanceof Error ? e.message : String(e)}`);
        }
        slowest = Math.max(slowest, performance.now() - t0);
      });
      console.log(`fuzz: ${COUNT} mutants, ${refused} refused with problems, slowest check ${slowest.toFixed(0)} ms`);
      expect(failures).toEqual([]);
      // the mutations are meant to break tunes: many must be refused, and many still read
      expect(refused).toBeGreaterThan(COUNT / 10);
      expect(refused).toBeLessThan(COUNT - COUNT / 10);
    },
  );
});
