// The skeleton rules of issue 3 §3 on tunes written for these tests.
import { describe, expect, it } from "vitest";
import { skeletonOf } from "@/lib/abc/skeleton";

const tune = (body: string, head = "M:4/4\nL:1/8"): string => `X:1\nT:Skeleton check\n${head}\nK:D\n${body}\n`;
const skel = (abc: string, doubleStop?: "highest" | "lowest"): string => {
  const r = skeletonOf(abc, { doubleStop });
  if (!r.ok) throw new Error(r.problems[0].message);
  return r.value.abc;
};

describe("skeleton (issue 3 §3)", () => {
  it("turns a sixteenth fill into one eighth with the on-beat pitch, in L:1/8 and L:1/16 (issue 3 §3)", () => {
    expect(skel(tune("d/c/B AF d/c/B/A/ F2 A2|"))).toBe(tune("dB AF dB F2 A2|"));
    expect(skel(tune("dcB2 A2F2 dcBA F4 A4|", "M:4/4\nL:1/16"))).toBe(tune("d2B2 A2F2 d2B2 F4 A4|", "M:4/4\nL:1/16"));
  });

  it("does not merge short notes that are off the eighth grid or do not fill exactly one eighth", () => {
    expect(skel(tune("A3/2B/2 A/B c/ d2 e2|"))).toBe(tune("A3/2B/2 A/B c/ d2 e2|"));
  });

  it("keeps the melody note of a double stop (double-stops.test.ts), the highest or lowest on request; a unison is one note", () => {
    // the open A rings over D and F: the moving voice is the tune
    expect(skel(tune("[DA]2 [FA]2 [dd]2 [Ad]2|"))).toBe(tune("D2 F2 d2 d2|"));
    expect(skel(tune("[DA]2 [FA]2 [dd]2 [Ad]2|"), "highest")).toBe(tune("A2 A2 d2 d2|"));
    expect(skel(tune("[DA]2 [FA]2 [dd]2 [Ad]2|"), "lowest")).toBe(tune("D2 F2 d2 A2|"));
  });

  it("drops grace notes (also {/g}), slurs (also dotted), decorations and bowing marks", () => {
    expect(skel(tune("{g}A2 {/a}B2 (AB) .(cd) | ~e2 !mf!f2 uA vB Tc2|"))).toBe(tune("A2 B2 AB cd | e2 f2 A B c2|"));
  });

  it("keeps ties, broken rhythm, chord symbols, annotations, repeats, endings and header fields", () => {
    const src = tune('|:"D"A2-A>B "^slow"c2 d2|1 "G"~B8:|2 "A"B8|]', "M:4/4\nL:1/8\nR:reel\nQ:1/4=100");
    expect(skel(src)).toBe(tune('|:"D"A2-A>B "^slow"c2 d2|1 "G"B8:|2 "A"B8|]', "M:4/4\nL:1/8\nR:reel\nQ:1/4=100"));
  });

  it("writes an accidental that lived on a removed note onto the next note that needs it (ABC 2.1 §4.2)", () => {
    // ^d on the second sixteenth raises the later d of the bar; once the fill is gone the later d
    // must carry the sharp itself.
    expect(skel(tune("c/^d/ d3 e4|", "M:4/4\nL:1/8"))).toBe(tune("c ^d3 e4|", "M:4/4\nL:1/8"));
  });

  it("keeps a triplet that crosses a beat (its held note would sound over the beat)", () => {
    expect(skel(tune("A (3Bcd e2 f4|"))).toBe(tune("A (3Bcd e2 f4|"));
  });

  it("gives the skeleton's bars with offsets into the skeleton text, a pickup as bar 0", () => {
    // The B part's pickup completes the A part's short last bar (bars.ts: common practice).
    const r = skeletonOf(tune("A|:~B2 d/c/B A4|d7:|\nP:B\nB/A/|e8|]"));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const { abc, bars } = r.value;
    expect(bars.map((b) => [b.number, b.part])).toEqual([
      [0, "A"],
      [1, "A"],
      [2, "A"],
      [0, "B"],
      [3, "B"],
    ]);
    expect(abc.slice(bars[1].startChar, bars[1].endChar)).toBe("B2 dB A4|");
    const notes = bars[1].notes.map((n) => abc.slice(n.startChar, n.endChar).trim());
    expect(notes).toEqual(["B2", "dB", "A4"].flatMap((s) => (s === "dB" ? ["d", "B"] : [s])));
  });

  it("is its own skeleton", () => {
    const once = skel(tune("{g}A2 (3Bcd [FA]2 d/c/B|~e8|"));
    expect(skel(once)).toBe(once);
  });
});
