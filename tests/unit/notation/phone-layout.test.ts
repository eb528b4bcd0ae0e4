import { describe, expect, it } from "vitest";
import abcjs from "abcjs";
import { analyze, buildModel } from "@/lib/abc";
import { DEMO_TUNE } from "@/app/dev/notation/demo-tune";
import { phoneLineBreaks, phoneLineEnds } from "@/components/notation/phone-layout";

const spansOf = (abc: string) => {
  const m = buildModel(abc);
  if (!m.ok) throw new Error("bad tune");
  return m.value.bars;
};

describe("phone layout: a line break after each phrase", () => {
  const analysis = analyze(DEMO_TUNE);
  if (!analysis.ok) throw new Error("demo tune");
  const map = analysis.value.phraseMap;
  const spans = spansOf(DEMO_TUNE);

  it("ends a line at every phrase end but the last bar", () => {
    expect([...phoneLineEnds(spans, map)].sort((a, b) => a - b)).toEqual([2, 4, 6, 8, 10, 12, 14]);
  });

  it("splits a long phrase every two bars, and counts pairs of bars without a phrase map", () => {
    const long = {
      ...map,
      parts: [{ ...map.parts[0], phrases: [{ ...map.parts[0].phrases[0], bars: [1, 8] as [number, number] }] }],
    };
    expect([...phoneLineEnds(spans, long)].sort((a, b) => a - b)).toEqual([2, 4, 6, 8]);
    expect([...phoneLineEnds(spans, null)].sort((a, b) => a - b)).toEqual([2, 4, 6, 8, 10, 12, 14]);
  });

  it("gives abcjs break points that lay the 16 bars out as 8 lines of music", () => {
    const breaks = phoneLineBreaks(abcjs, DEMO_TUNE, spans, phoneLineEnds(spans, map));
    // abcjs reads one list per section of music (node_modules/abcjs/src/parse/wrap_lines.js).
    const [tune] = abcjs.parseOnly(DEMO_TUNE, { lineBreaks: breaks as unknown as number[] });
    expect(tune.lines.filter((l) => l.staff).length).toBe(8);
  });

  it("leaves a pickup bar on the first line", () => {
    const jig = "X:1\nT:Pickup\nM:6/8\nL:1/8\nK:G\nD|G2B d2B|c2A F2A|G2B d2B|c2A G2|]\n";
    const s = spansOf(jig);
    const breaks = phoneLineBreaks(abcjs, jig, s, phoneLineEnds(s, null));
    const [tune] = abcjs.parseOnly(jig, { lineBreaks: breaks as unknown as number[] });
    const lines = tune.lines.filter((l) => l.staff);
    expect(lines.length).toBe(2);
    const notes = (i: number) => (lines[i].staff?.[0]?.voices?.[0] ?? []).filter((e) => e.el_type === "note").length;
    expect([notes(0), notes(1)]).toEqual([1 + 4 + 4, 4 + 3]); // pickup D + bars 1–2, then bars 3–4
  });
});
