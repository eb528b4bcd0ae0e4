import { describe, expect, it } from "vitest";
import { analyze } from "@/lib/abc";
import type { PhraseMap } from "@/lib/abc/phrase-types";
import { DEMO_TUNE } from "@/app/dev/notation/demo-tune";
import {
  barsText,
  phraseLabel,
  phraseList,
  phraseOfBar,
  twinMark,
  twinWords,
} from "@/components/notation/phrase-words";

function mapOf(abc: string): PhraseMap {
  const r = analyze(abc);
  if (!r.ok) throw new Error(r.problems.map((p) => p.message).join("; "));
  return r.value.phraseMap;
}

// The demo reel: A1 = A3 exactly, A2 differs from A1 in its last note, A4 = B4, B1 = B3.
const demo = mapOf(DEMO_TUNE);

describe("phrase words for the overlay", () => {
  it("labels each phrase with its id and form letter, in playing order", () => {
    expect(phraseList(demo).map(phraseLabel)).toEqual([
      "A1 · a",
      "A2 · a′",
      "A3 · a",
      "A4 · b",
      "B1 · c",
      "B2 · d",
      "B3 · c",
      "B4 · b",
    ]);
  });

  it("names the earlier twin a phrase repeats, exact before near", () => {
    expect(twinWords(demo, "A1")).toBeNull(); // the first of its kind repeats nothing
    expect(twinWords(demo, "A2")).toBe("like A1 but 1 note");
    // A3 is an exact twin of A1 and a near twin of A2: the exact one is named.
    expect(twinWords(demo, "A3")).toBe("same as A1");
    expect(twinWords(demo, "B4")).toBe("same as A4");
    expect(twinWords(demo, "B2")).toBeNull();
  });

  it("shortens the words to a mark that still names the twin", () => {
    expect(twinMark(demo, "A2")).toBe("≈ A1");
    expect(twinMark(demo, "A3")).toBe("= A1");
    expect(twinMark(demo, "A1")).toBeNull();
  });

  it("counts several differing notes in the plural", () => {
    const map: PhraseMap = {
      ...demo,
      twins: [{ first: "A1", second: "A2", kind: "near", differingNotes: 2, differences: [], partial: false }],
    };
    expect(twinWords(map, "A2")).toBe("like A1 but 2 notes");
  });

  it("finds each bar's phrase and says which bars a phrase spans", () => {
    const byBar = phraseOfBar(demo);
    expect(byBar.get(1)).toBe("A1");
    expect(byBar.get(4)).toBe("A2");
    expect(byBar.get(16)).toBe("B4");
    expect(byBar.has(0)).toBe(false);
    expect(barsText(phraseList(demo)[1])).toBe("bars 3–4");
    expect(barsText({ bars: [5, 5] })).toBe("bar 5");
  });
});
