// Property tests (fast-check) on generated reels: whatever the notes, a phrase written twice is an
// exact twin, a copy with one note changed is a near twin found at that note, and the twin swap
// makes it exact again. The forms tested are the ones teachers look for (common practice).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { phraseMap, type PhraseMap } from "../../../lib/abc/phrase-map";
import { buildModel, skeletonOf } from "../../../lib/abc/skeleton";
import { twinSwap } from "../../../lib/abc/twin-swap";

const LETTERS = ["D", "E", "F", "G", "A", "B", "c", "d", "e", "f", "g"];
interface Tok {
  letter: number; // index into LETTERS
  len: 1 | 2; // eighths
}
// a bar of 4/4 in eighths (L:1/8): notes of one or two eighths filling exactly eight
const bar = fc
  .array(fc.record({ letter: fc.integer({ min: 0, max: LETTERS.length - 1 }), len: fc.constantFrom<1 | 2>(1, 2) }), {
    minLength: 8,
    maxLength: 8,
  })
  .map((toks) => {
    const out: Tok[] = [];
    let used = 0;
    for (const t of toks) {
      const len = used + t.len <= 8 ? t.len : 1;
      if (used + len > 8) break;
      out.push({ letter: t.letter, len });
      used += len;
    }
    while (used < 8) {
      out.push({ letter: 0, len: 1 });
      used++;
    }
    return out;
  });
const phrase = fc.tuple(bar, bar);
const text = (bars: Tok[][]): string =>
  bars.map((b) => b.map((t) => (LETTERS[t.letter] ?? "D") + (t.len === 2 ? "2" : "")).join("")).join("|");

function mapOf(abc: string): PhraseMap {
  const sk = skeletonOf(abc);
  if (!sk.ok) throw new Error(sk.problems.map((p) => p.message).join("; "));
  return phraseMap(sk.value.bars, sk.value.meter, sk.value.unit);
}
const twin = (m: PhraseMap, a: string, b: string) => m.twins.find((t) => t.first === a && t.second === b);

describe("phrase map on generated two-part reels", () => {
  it("finds phrase 1 = phrase 3, the shared last phrase, and a one-note near twin where it is", () => {
    fc.assert(
      fc.property(
        phrase,
        phrase,
        phrase,
        phrase,
        phrase,
        phrase,
        fc.nat(),
        fc.integer({ min: 1, max: 10 }),
        (p1, p2, p4, q1, q2, q3, at, shift) => {
          // B4 is A4 with one note changed: the note at token `at` of the whole phrase
          const flat = p4.flatMap((b, bi) => b.map((t, ti) => ({ bi, ti, t })));
          const pick = flat[at % flat.length] ?? { bi: 0, ti: 0, t: { letter: 0, len: 1 as const } };
          const changed = p4.map((b, bi) =>
            b.map((t, ti) =>
              bi === pick.bi && ti === pick.ti ? { ...t, letter: (t.letter + shift) % LETTERS.length } : t,
            ),
          );
          const a = [p1, p2, p1, p4].map((p) => text(p)).join("|");
          const b = [q1, q2, q3, changed].map((p) => text(p)).join("|");
          const abc = `X:1\nT:Generated\nM:4/4\nL:1/8\nK:C\n|:${a}:|\n|:${b}:|\n`;
          const m = mapOf(abc);
          expect(twin(m, "A1", "A3")?.kind).toBe("exact");
          const near = twin(m, "A4", "B4");
          const onset = (p4[pick.bi] ?? []).slice(0, pick.ti).reduce((s, t) => s + t.len, 0); // in eighths
          expect(near).toMatchObject({ kind: "near", differingNotes: 1 });
          expect(near?.differences[0]).toMatchObject({
            firstBar: 7 + pick.bi,
            secondBar: 15 + pick.bi,
            beat: 1 + onset / 2,
          });
          expect(
            m.patterns.some((p) => p.pattern === "lastPhraseShared" && p.kind === "near" && p.differingNotes === 1),
          ).toBe(true);

          // the learning version plays B4 exactly like A4
          const model = buildModel(abc);
          if (!model.ok) throw new Error("model");
          const after = mapOf(twinSwap(abc, model.value.bars, m, ["B4"]));
          expect(twin(after, "A4", "B4")?.kind).toBe("exact");
        },
      ),
      { numRuns: 60 },
    );
  });
});
