// Twin swap on tunes written for these tests (tests/fixtures/abc/phrases, invented). The result
// must be ABC that abcjs reads without new warnings (issue 3 §1) with every bar's length kept.
import { readFileSync } from "node:fs";
import abcjs from "abcjs";
import { describe, expect, it } from "vitest";
import { phraseMap, type PhraseMap } from "../../../lib/abc/phrase-map";
import { buildModel, skeletonOf } from "../../../lib/abc/skeleton";
import { planSwaps, twinSwap } from "../../../lib/abc/twin-swap";
import type { Bar } from "../../../lib/abc/types";

const fixture = (name: string): string =>
  readFileSync(new URL(`../../fixtures/abc/phrases/${name}`, import.meta.url), "utf8");

function mapOf(abc: string): PhraseMap {
  const sk = skeletonOf(abc);
  if (!sk.ok) throw new Error(sk.problems.map((p) => p.message).join("; "));
  return phraseMap(sk.value.bars, sk.value.meter, sk.value.unit);
}
function barsOf(abc: string): Bar[] {
  const m = buildModel(abc);
  if (!m.ok) throw new Error(m.problems.map((p) => p.message).join("; "));
  return m.value.bars;
}
// abcjs warnings are HTML strings; the count and text are what "no new warnings" compares
const warnings = (abc: string): string[] => {
  const w: unknown = Reflect.get(abcjs.parseOnly(abc)[0] ?? {}, "warnings");
  return Array.isArray(w) ? w.map(String) : [];
};
const lengths = (bars: Bar[]): string[] => bars.map((b) => `${b.number}:${b.length.num}/${b.length.den}`);
const barText = (abc: string, bars: Bar[], n: number): string => {
  const b = bars.find((x) => x.number === n);
  return b === undefined ? "" : abc.slice(b.startChar, b.endChar);
};

function swapped(name: string, which?: string[]): { src: string; out: string; before: PhraseMap; after: PhraseMap } {
  const src = fixture(name);
  const before = mapOf(src);
  const out = twinSwap(src, barsOf(src), before, which);
  return { src, out, before, after: mapOf(out) };
}

describe("twin swap of The Rosin Box (every near twin)", () => {
  const { src, out, after } = swapped("rosin-box.abc");

  it("re-parses without new warnings and keeps every bar's length", () => {
    expect(warnings(out)).toEqual(warnings(src));
    expect(lengths(barsOf(out))).toEqual(lengths(barsOf(src)));
  });

  it("makes each swapped phrase an exact twin of its model", () => {
    const exact = after.twins.filter((t) => t.kind === "exact").map((t) => `${t.first}=${t.second}`);
    expect(exact).toEqual(expect.arrayContaining(["A2=A4", "B1=B3", "A2=B4"]));
    expect(after.swaps).toEqual([]);
    expect(after.learningLoad).toEqual({ distinct: 4, afterSwaps: 4 });
  });

  it("changes only the bar that differed, keeping its repeat", () => {
    const bars = barsOf(out);
    expect(barText(out, bars, 8)).toBe('"G"gfed "A"cAce:|');
    expect(out.split("\n").length).toBe(src.split("\n").length);
    expect(out.match(/:\|/g)?.length).toBe(src.match(/:\|/g)?.length);
  });
});

describe("choosing which twins to swap", () => {
  it("swaps only the phrases asked for", () => {
    const { after } = swapped("rosin-box.abc", ["B3"]);
    expect(after.parts.map((p) => p.phrases.map((x) => x.letter))).toEqual([
      ["a", "b", "a", "b′"],
      ["c", "d", "c", "b′"],
    ]);
  });
});

describe("endings are not twins to swap (Lantern Hill)", () => {
  // a first and a second ending differ on purpose (common practice): the second ending leads into
  // the B part, the first back to the start, so no swap may turn one into the other
  it("lists the two endings as near twins but offers no swap between them, and keeps both as written", () => {
    const { src, out, before } = swapped("lantern-hill.abc");
    expect(before.twins.find((t) => t.first === "A4" && t.second === "A4/2")).toMatchObject({
      kind: "near",
      differingNotes: 1,
    });
    expect(before.swaps.map((s) => s.phrase)).not.toContain("A4/2");
    expect(before.parts[0]?.phrases[3]?.alternatives[0]?.letter).toBe("d′");
    expect(out).toContain('|1"G"G3 G2D:|2"G"G3 G2B||');
    expect(out).toBe(src);
  });
});

describe("twin swap copies the model's embellishments with its notes (The Tarred Jetty)", () => {
  it("swaps a two-note near twin whose model has a slur, after a P: line", () => {
    const { src, out, before, after } = swapped("tarred-jetty.abc");
    expect(before.swaps).toEqual([{ phrase: "B3", model: "B1", differingNotes: 2 }]);
    expect(barText(out, barsOf(out), 14)).toBe('"C"(ce)gc "G"B2AG|');
    expect(out).toContain("P:B\n");
    expect(out.match(/P:/g)?.length).toBe(2);
    expect(warnings(out)).toEqual(warnings(src));
    expect(lengths(barsOf(out))).toEqual(lengths(barsOf(src)));
    expect(after.parts[1]?.phrases.map((p) => p.letter)).toEqual(["d", "e", "d", "f"]);
  });
});

describe("swaps that cannot be made safely are left out, with the reason", () => {
  it("leaves a twin in another key alone: copied notes would sound different (ABC 2.1 §3.1.14 K: applies to what follows)", () => {
    const src = fixture("two-keys.abc");
    const map = mapOf(src);
    const plan = planSwaps(src, barsOf(src), map);
    expect(plan.made).toEqual([]);
    expect(plan.skipped[0]?.reason).toMatch(/different key/);
    expect(twinSwap(src, barsOf(src), map)).toBe(src);
  });

  it("leaves a twin alone when a bar to copy or replace holds an inline field (ABC 2.1 §3.2: [K:…] in the body)", () => {
    const src = fixture("rosin-box.abc").replace('"G"gfed "A"cAcd:|\n|:', '[K:D]"G"gfed "A"cAcd:|\n|:');
    const plan = planSwaps(src, barsOf(src), mapOf(src));
    expect(plan.skipped.map((s) => [s.swap.phrase, s.reason])).toEqual([
      ["A4", "bar 8 or its model holds a field (K:, L:, M: …)"],
    ]);
    expect(plan.made.map((s) => s.phrase)).toEqual(["B3", "B4"]);
  });

  it("leaves a twin alone when the differing bar is shorter than its model's (a last bar cut for a pickup)", () => {
    const src = fixture("short-reed.abc");
    const map = mapOf(src);
    const lastBar = map.parts[1]?.phrases[4]?.bars[1];
    const plan = planSwaps(src, barsOf(src), map);
    expect(plan.skipped.map((s) => [s.swap.phrase, s.reason])).toEqual([
      ["B5", `bar ${lastBar} differs from its model in length`],
    ]);
    expect(lastBar).toBeGreaterThan(10);
  });
});
