// The demo tunes (db/seed-data/tunes, originals written for the invented Larchmoor Fiddle School)
// and the demo catalogue that places them (issue 5, item 8). The twins listed below are the ones
// the tunes were written to have; the phrase map must find exactly those.
import { readdirSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyze, type Analysis } from "@/lib/abc/index";
import { DEFAULT_PLAN } from "@/lib/abc/stages";
import { demoTuneAbc, headerField, tuneTypeOf } from "@/db/seed-catalogue";
import { DEMO_COURSES, DEMO_TUNES } from "@/db/seed-data/catalogue";
import { SCHOOL_NAME, STUDENTS, TEACHERS } from "@/db/seed-data/people";
import { checkTune } from "./abc/invariants";

const FILES = readdirSync(new URL("../../db/seed-data/tunes/", import.meta.url))
  .filter((f) => f.endsWith(".abc"))
  .sort();

type Expect = [first: string, second: string, kind: "exact" | "near", differingNotes: number];
// "phrase 1 = phrase 3", "last phrase of A = last phrase of B" (A4/2 is A's last phrase through its
// second ending) and near twins of one or two notes, as designed when the tunes were written.
const DESIGNED: Record<string, Expect[]> = {
  "gatepost-wren.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "near", 1],
    ["B4", "A4/2", "exact", 0],
  ],
  "upturned-barrow.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "near", 1],
    ["B4", "A4/2", "exact", 0],
  ],
  "quenbys-crossing.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "near", 1],
    ["B4", "A4/2", "exact", 0],
  ],
  "frost-cold-frame.abc": [
    ["A1", "A3", "exact", 0],
    ["A2", "A4", "near", 2],
    ["B1", "B3", "exact", 0],
    ["B4", "A4/2", "exact", 0],
  ],
  "slate-roof.abc": [
    ["A1", "A3", "exact", 0],
    ["A2", "A4", "near", 1],
    ["A4", "B4", "exact", 0],
  ],
  "kettle-nobody-watched.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "near", 1],
    ["B4", "A4/2", "exact", 0],
  ],
  "pennywort-hill.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "exact", 0],
    ["B4", "A4/2", "exact", 0],
  ],
  "lamplighters-shortcut.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "near", 1],
    ["A4", "B4", "exact", 0],
  ],
  "greaveys-goat.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "exact", 0],
    ["B4", "A4/2", "exact", 0],
  ],
  "tarred-ropewalk.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "near", 1],
    ["B4", "A4/2", "exact", 0],
  ],
  "brass-bedknob.abc": [
    ["A1", "A3", "exact", 0],
    ["A2", "A4", "near", 1],
    ["B1", "B3", "near", 1],
    ["B4", "A4/2", "exact", 0],
  ],
  "clockmakers-stairs.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "exact", 0],
    ["A4", "B4", "near", 1],
    ["B4", "A4/2", "exact", 0],
  ],
  "little-biscuit.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "exact", 0],
    ["A4", "B4", "near", 1],
  ],
  "hop-the-puddle.abc": [
    ["A1", "A3", "exact", 0],
    ["A2", "A4", "near", 2],
    ["B1", "B3", "near", 1],
  ],
  "rattling-gate.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "near", 1],
    ["A4", "B4", "exact", 0],
  ],
  "thornsby-weir.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "exact", 0],
    ["A4", "B4", "exact", 0],
  ],
  "lamp-in-the-attic.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "near", 1],
    ["A4", "B4", "exact", 0],
  ],
  "slow-boats-marle.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "exact", 0],
    ["B4", "A4/2", "exact", 0],
  ],
  "herons-second-thought.abc": [
    ["A1", "A3", "exact", 0],
    ["B1", "B3", "near", 2],
    ["A4", "B4", "exact", 0],
  ],
};

// Common practice: the meter each dance type is written in.
const METER: Record<string, string> = {
  reel: "4/4",
  jig: "6/8",
  hornpipe: "4/4",
  polka: "2/4",
  waltz: "3/4",
  "slip jig": "9/8",
};

const analyses = new Map<string, Analysis>();
function analysed(file: string): Analysis {
  let a = analyses.get(file);
  if (!a) {
    const r = analyze(demoTuneAbc(file));
    if (!r.ok) throw new Error(`${file}: ${r.problems.map((p) => p.message).join("; ")}`);
    analyses.set(file, (a = r.value));
  }
  return a;
}
const twinOf = (a: Analysis, x: string, y: string) =>
  a.phraseMap.twins.find((t) => (t.first === x && t.second === y) || (t.first === y && t.second === x));

describe("the demo tunes", () => {
  it("are at least 15, with unique titles, covering every genre in its usual meter", () => {
    expect(FILES.length).toBeGreaterThanOrEqual(15);
    const titles = FILES.map((f) => analysed(f).title.toLowerCase());
    expect(new Set(titles).size).toBe(titles.length);
    const types = FILES.map((f) => tuneTypeOf(demoTuneAbc(f)));
    for (const genre of ["reel", "jig", "hornpipe", "polka", "waltz"]) expect(types).toContain(genre);
    FILES.forEach((f, i) => expect([f, headerField(demoTuneAbc(f), "M")]).toEqual([f, METER[types[i] ?? ""]]));
  });

  it.each(FILES)("%s says it is an invented demo tune of the school and names its teacher", (file) => {
    const abc = demoTuneAbc(file);
    expect(headerField(abc, "S")).toMatch(new RegExp(`Invented demo tune of the ${SCHOOL_NAME}`));
    const owner = DEMO_TUNES.find((t) => t.file === file);
    expect(headerField(abc, "C")).toBe(TEACHERS[owner?.teacher ?? -1]?.name);
  });

  it.each(FILES)("%s parses with no problems or abcjs warnings and keeps the engine's invariants", (file) => {
    const r = analyze(demoTuneAbc(file));
    expect(r.ok && r.notes).toEqual([]);
    // PRODUCT.md §4: stages re-parse without new warnings, bars keep their length, the last stage is the source
    expect(checkTune(demoTuneAbc(file))).toEqual([]);
  });

  it.each(FILES)("%s changes at every stage of the default plan", (file) => {
    const stages = analysed(file).stages;
    expect(stages.map((s) => s.name)).toEqual(DEFAULT_PLAN.stages.map((s) => s.name));
    stages.slice(1).forEach((s, i) => expect([s.name, s.abc === stages[i]?.abc]).toEqual([s.name, false]));
  });

  it.each(FILES)("%s stays in first-position fiddle range, G3 to B5 (common practice)", (file) => {
    const pitches = analysed(file)
      .skeleton.bars.flatMap((b) => b.notes.map((n) => n.pitch))
      .filter((p): p is number => p !== null);
    expect(Math.min(...pitches)).toBeGreaterThanOrEqual(55);
    expect(Math.max(...pitches)).toBeLessThanOrEqual(83);
  });

  it("every tune has the twins it was written with, and each is named in the expectations", () => {
    expect(Object.keys(DESIGNED).sort()).toEqual(FILES);
    for (const [file, expected] of Object.entries(DESIGNED)) {
      const a = analysed(file);
      for (const [x, y, kind, differingNotes] of expected) {
        expect([file, x, y, twinOf(a, x, y)]).toMatchObject([file, x, y, { kind, differingNotes }]);
      }
    }
  });

  it("most tunes have a near twin for the twin swap to offer", () => {
    const withNear = FILES.filter((f) => analysed(f).phraseMap.twins.some((t) => t.kind === "near"));
    expect(withNear.length).toBeGreaterThanOrEqual(Math.ceil(FILES.length / 2));
    expect(FILES.filter((f) => analysed(f).phraseMap.swaps.length > 0).length).toBe(withNear.length);
  });

  it("says where a near twin differs (The Gatepost Wren: a triplet holds the E where B1 climbs to G)", () => {
    const t = twinOf(analysed("gatepost-wren.abc"), "B1", "B3");
    expect(t?.differences).toMatchObject([{ secondBar: 15, beat: 1.5, firstNote: "G5", secondNote: "E5", notes: 1 }]);
  });

  it("finds the cross-part patterns teachers look for (common practice)", () => {
    const names = (f: string) => analysed(f).phraseMap.patterns.map((p) => p.pattern);
    expect(names("slate-roof.abc")).toEqual(expect.arrayContaining(["phrase1=phrase3", "lastPhraseShared"]));
    expect(names("thornsby-weir.abc")).toEqual(expect.arrayContaining(["phrase1=phrase3", "lastPhraseShared"]));
  });
});

describe("the demo catalogue", () => {
  const rungs = DEMO_COURSES.flatMap((c) => c.grades.flatMap((g) => g.rungs.map((r) => ({ course: c, rung: r }))));

  it("places every demo tune file on a rung of its owner's course, each tune once", () => {
    expect(DEMO_TUNES.map((t) => t.file).sort()).toEqual(FILES);
    expect(rungs.map((r) => r.rung.tune).sort()).toEqual(FILES);
    for (const { course, rung } of rungs) {
      expect([rung.tune, DEMO_TUNES.find((t) => t.file === rung.tune)?.teacher]).toEqual([rung.tune, course.teacher]);
    }
  });

  it("has three courses, each over at least two grades, opening with a taster and nothing else a taster", () => {
    expect(DEMO_COURSES).toHaveLength(3);
    expect(new Set(DEMO_COURSES.map((c) => c.slug)).size).toBe(3);
    for (const c of DEMO_COURSES) {
      expect(c.grades.length).toBeGreaterThanOrEqual(2);
      const flat = c.grades.flatMap((g) => g.rungs);
      expect(flat.map((r) => r.isTaster === true)).toEqual(flat.map((_, i) => i === 0));
    }
  });

  it("asks for no stage a tune does not have, and never less as the grades rise", () => {
    for (const { rung } of rungs) expect(rung.requiredStage).toBeLessThanOrEqual(analysed(rung.tune).stages.length);
    for (const c of DEMO_COURSES) {
      const req = c.grades.flatMap((g) => g.rungs.map((r) => r.requiredStage));
      expect(req).toEqual([...req].sort((a, b) => a - b));
    }
  });

  it("enrols existing demo students, once per course", () => {
    for (const c of DEMO_COURSES) {
      const ids = c.enrolments.map((e) => e.student);
      expect(new Set(ids).size).toBe(ids.length);
      for (const id of ids) expect(STUDENTS[id]).toBeDefined();
    }
  });
});
