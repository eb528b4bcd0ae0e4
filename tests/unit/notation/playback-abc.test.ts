import { describe, expect, it } from "vitest";
import abcjs from "abcjs";
import { analyze, buildModel, type TuneShape } from "@/lib/abc";
import { DEMO_TUNE } from "@/app/dev/notation/demo-tune";
import { countInClicks, phraseAbc, practiceBeatsPerMinute } from "@/components/notation/playback-abc";

function model(abc: string): TuneShape {
  const m = buildModel(abc);
  if (!m.ok) throw new Error(m.problems.map((p) => p.message).join("; "));
  return m.value;
}
const pitches = (shape: TuneShape, bars: number[]): (number | null)[] =>
  bars.flatMap((n) => shape.bars.find((b) => b.number === n)?.notes.map((note) => note.pitch) ?? []);

// A jig with a pickup into each part and repeats (written for this test).
const PICKUP_JIG = `X:1
T:Test Jig
M:6/8
L:1/8
K:G
D|G2B d2B|c2A F2A|G2B d2B|c2A G2:|
|:d|g2f e2d|c2A F2A|g2f e2d|c2A G2:|
`;

describe("the ABC of one phrase, for looping it", () => {
  it("holds exactly the phrase's bars and notes, parses cleanly and ends once", () => {
    const source = model(DEMO_TUNE);
    const map = analyze(DEMO_TUNE);
    if (!map.ok) throw new Error("demo tune");
    for (const phrase of map.value.phraseMap.parts.flatMap((p) => p.phrases)) {
      const abc = phraseAbc(DEMO_TUNE, source.bars, phrase.barNumbers);
      const [tune] = abcjs.parseOnly(abc);
      expect(tune.warnings ?? []).toEqual([]);
      const loop = model(abc);
      expect(loop.bars.map((b) => b.number)).toEqual(phrase.barNumbers.map((_, i) => i + 1));
      expect(
        pitches(
          loop,
          loop.bars.map((b) => b.number),
        ),
      ).toEqual(pitches(source, phrase.barNumbers));
      // Repeat signs are gone (ABC 2.1 §4.8), so the phrase plays once and the player repeats it.
      expect(abc.split("K:")[1]).not.toMatch(/:\||\|:/);
      expect(abc).toMatch(/^X:1\nT:The Cedar Stair[\s\S]*\nK:D\n/);
      expect(abc).not.toMatch(/^P:/m);
    }
  });

  it("keeps a part's last bar with its repeat and leaves the pickups out", () => {
    const source = model(PICKUP_JIG);
    const abc = phraseAbc(PICKUP_JIG, source.bars, [3, 4]);
    expect(abc.trim().split("\n").pop()).toBe("G2B d2B | c2A G2 |]");
    const b1 = phraseAbc(PICKUP_JIG, source.bars, [5, 6]);
    expect(b1.trim().split("\n").pop()).toBe("g2f e2d | c2A F2A |]");
  });

  it("carries key changes met before or inside the phrase (ABC 2.1 §3.1.14, inline fields §3.2)", () => {
    const tune = "X:1\nT:Key change\nM:2/4\nL:1/8\nK:G\nGABc|\nK:D\ndedB|\nK:Bb\nBcdB|f2f2|\n";
    expect(phraseAbc(tune, model(tune).bars, [3, 4])).toContain("K:G\nK:D\n[K:Bb] BcdB | f2f2 |]");
    const abc = phraseAbc(tune, model(tune).bars, [2, 3]);
    expect(abc).toContain("K:G\n[K:D] dedB | [K:Bb] BcdB |]");
    expect(abcjs.parseOnly(abc)[0].warnings ?? []).toEqual([]);
  });

  it("strips every kind of closing bar line but not a note's length (ABC 2.1 §4.8)", () => {
    const tune = "X:1\nT:Bars\nM:4/4\nL:1/8\nK:D\n|:d8|e8||f4 g4|]\n";
    expect(phraseAbc(tune, model(tune).bars, [1, 2, 3]).trim().split("\n").pop()).toBe("d8 | e8 | f4 g4 |]");
  });
});

describe("count-in clicks (common practice)", () => {
  it("clicks each beat of one bar, the first accented", () => {
    expect(countInClicks({ num: 4, den: 4 })).toEqual([
      { start: 0, accent: true },
      { start: 0.25, accent: false },
      { start: 0.5, accent: false },
      { start: 0.75, accent: false },
    ]);
    expect(countInClicks({ num: 3, den: 4 }).map((c) => c.start)).toEqual([0, 0.25, 0.5]);
    expect(countInClicks({ num: 2, den: 2 }).map((c) => c.start)).toEqual([0, 0.5]);
  });

  it("counts compound meters in dotted quarters", () => {
    expect(countInClicks({ num: 6, den: 8 }).map((c) => c.start)).toEqual([0, 0.375]);
    expect(countInClicks({ num: 9, den: 8 }).map((c) => c.start)).toEqual([0, 0.375, 0.75]);
    expect(countInClicks({ num: 3, den: 8 }).map((c) => c.start)).toEqual([0, 0.125, 0.25]);
  });

  it("stops before a pickup's first note", () => {
    // 4/4 with a quarter-note pickup: the first note sounds at 3/4, so the fourth click is dropped.
    expect(countInClicks({ num: 4, den: 4 }, 0.25).map((c) => c.start)).toEqual([0, 0.25, 0.5]);
    // 6/8 with an eighth pickup: both dotted-quarter clicks come before it (at 0 and 3/8; note at 5/8).
    expect(countInClicks({ num: 6, den: 8 }, 0.125).map((c) => c.start)).toEqual([0, 0.375]);
  });

  it("picks a practice pace when the tune gives none", () => {
    expect(practiceBeatsPerMinute({ num: 4, den: 4 })).toBe(100);
    expect(practiceBeatsPerMinute({ num: 6, den: 8 })).toBe(80);
  });
});
