// The engine against the ABC 2.1 standard. Expected values are written from the standard's text
// as remembered (no copy at hand): each check names its section.
import { describe, expect, it } from "vitest";
import { classify } from "@/lib/abc/classify";
import { kindOfDecoration } from "@/lib/abc/decorations";
import { frac, eq, sum } from "@/lib/abc/fraction";
import { defaultUnit, parseMeter } from "@/lib/abc/header";
import { skeletonOf } from "@/lib/abc/skeleton";
import { prepareTune, type Prepared } from "@/lib/abc/tune";
import type { Fraction, Kind } from "@/lib/abc/types";
import { melodyBars } from "./invariants";

const tune = (body: string, head = "M:4/4\nL:1/8"): string => `X:1\nT:t\n${head}\nK:C\n${body}\n`;
function prep(abc: string): Prepared {
  const r = prepareTune(abc);
  if (!r.ok) throw new Error(r.problems.map((p) => p.message).join("; "));
  return r.value;
}
const durations = (abc: string): Fraction[] => melodyBars(prep(abc)).flatMap((b) => b.notes.map((n) => n.duration));
const same = (a: Fraction[], b: Fraction[]): boolean => a.length === b.length && a.every((x, i) => eq(x, b[i]));

describe("ABC 2.1 §4.14 decorations", () => {
  // Names from the §4.14 table (from memory); kinds from PRODUCT.md §3.
  const table: [string, Kind][] = [
    ["trill", "ornaments"],
    ["lowermordent", "ornaments"],
    ["uppermordent", "ornaments"],
    ["mordent", "ornaments"],
    ["pralltriller", "ornaments"],
    ["roll", "ornaments"],
    ["turn", "ornaments"],
    ["turnx", "ornaments"],
    ["invertedturn", "ornaments"],
    ["invertedturnx", "ornaments"],
    ["arpeggio", "ornaments"],
    ["trill(", "ornaments"],
    ["trill)", "ornaments"],
    ["slide", "slides"],
    ["upbow", "bowing"],
    ["downbow", "bowing"],
    ["p", "dynamics"],
    ["pp", "dynamics"],
    ["ppp", "dynamics"],
    ["pppp", "dynamics"],
    ["mp", "dynamics"],
    ["mf", "dynamics"],
    ["f", "dynamics"],
    ["ff", "dynamics"],
    ["fff", "dynamics"],
    ["ffff", "dynamics"],
    ["sfz", "dynamics"],
    ["crescendo(", "dynamics"],
    ["<(", "dynamics"],
    ["crescendo)", "dynamics"],
    ["<)", "dynamics"],
    ["diminuendo(", "dynamics"],
    [">(", "dynamics"],
    ["diminuendo)", "dynamics"],
    [">)", "dynamics"],
    [">", "articulation"],
    ["accent", "articulation"],
    ["emphasis", "articulation"],
    ["fermata", "articulation"],
    ["invertedfermata", "articulation"],
    ["tenuto", "articulation"],
    ["breath", "articulation"],
    ["wedge", "articulation"],
    ["+", "articulation"],
    ["plus", "articulation"],
    ["snap", "articulation"],
    ["0", "fingerings"],
    ["1", "fingerings"],
    ["2", "fingerings"],
    ["3", "fingerings"],
    ["4", "fingerings"],
    ["5", "fingerings"],
    ["open", "fingerings"],
    ["thumb", "fingerings"],
    ["segno", "marks"],
    ["coda", "marks"],
    ["D.S.", "marks"],
    ["D.C.", "marks"],
    ["dacoda", "marks"],
    ["dacapo", "marks"],
    ["fine", "marks"],
    ["shortphrase", "marks"],
    ["mediumphrase", "marks"],
    ["longphrase", "marks"],
  ];
  it.each(table)("!%s! is %s", (name, kind) => {
    expect(kindOfDecoration(name)).toBe(kind);
  });

  it("classifies !…! decorations on notes and bar lines, and the skeleton drops them", () => {
    const abc = tune("!p!A !trill!B !slide!c !<(!d !<)!e !fermata!f !upbow!g !3!a !segno!|");
    const found = classify(prep(abc)).map((e) => [e.kind, e.source]);
    expect(found).toEqual([
      ["dynamics", "!p!"],
      ["ornaments", "!trill!"],
      ["slides", "!slide!"],
      ["dynamics", "!<(!"],
      ["dynamics", "!<)!"],
      ["articulation", "!fermata!"],
      ["bowing", "!upbow!"],
      ["fingerings", "!3!"],
      ["marks", "!segno!"],
    ]);
    const sk = skeletonOf(abc);
    expect(sk.ok && sk.value.abc).toBe(tune("A B c d e f g a |"));
  });
});

describe("ABC 2.1 §4.16 shorthand decorations", () => {
  // §4.16 defaults (from memory): . staccato, ~ Irish roll, H fermata, L accent, M lowermordent,
  // O coda, P uppermordent, S segno, T trill, u upbow, v downbow.
  it("reads each default shorthand as its decoration", () => {
    const abc = tune(".A ~B Hc Ld Me Of Pg Sa | Tb uc vd e4 |");
    const found = classify(prep(abc)).map((e) => [e.source, e.what, e.kind]);
    expect(found).toEqual([
      [".", "staccato", "articulation"],
      ["~", "roll", "ornaments"],
      ["H", "fermata", "articulation"],
      ["L", "accent", "articulation"],
      ["M", "lowermordent", "ornaments"],
      ["O", "coda", "marks"],
      ["P", "uppermordent", "ornaments"],
      ["S", "segno", "marks"],
      ["T", "trill", "ornaments"],
      ["u", "upbow", "bowing"],
      ["v", "downbow", "bowing"],
    ]);
  });

  it("follows U: redefinitions (§4.16: U: assigns a decoration to a letter)", () => {
    const abc = tune("TA WB c2 d4|", "M:4/4\nL:1/8\nU:T=!fermata!\nU:W=!roll!");
    const found = classify(prep(abc)).map((e) => [e.source, e.what, e.kind]);
    expect(found).toEqual([
      ["T", "fermata", "articulation"],
      ["W", "roll", "ornaments"],
    ]);
  });
});

describe("ABC 2.1 §4.13 tuplets", () => {
  const tupletTime = (abc: string): Fraction => {
    const p = prep(abc);
    return sum(p.model.tuplets[0].els.map((e) => e.duration));
  };
  // (p: p notes in the time of q: (2 → 3, (3 → 2, (4 → 3, (5,(7,(9 → 3 in compound meter else 2.
  it("(3 is three notes in the time of two", () => expect(tupletTime(tune("(3ABc d2 e4|"))).toEqual(frac(2, 8)));
  it("(2 is two notes in the time of three", () =>
    expect(tupletTime(tune("(2AB c3|", "M:6/8\nL:1/8"))).toEqual(frac(3, 8)));
  it("(5 in 6/8 is five notes in the time of three", () =>
    expect(tupletTime(tune("(5ABcde f3|", "M:6/8\nL:1/8"))).toEqual(frac(3, 8)));
  it("(5 in 2/4 is five notes in the time of two", () =>
    expect(tupletTime(tune("(5ABcde f2|", "M:2/4\nL:1/8"))).toEqual(frac(2, 8)));
  it("(p:q:r puts p notes in the time of q for the next r notes", () => {
    // (3:2:4 with four sixteenths: each takes 2/3 of a sixteenth.
    expect(tupletTime(tune("(3:2:4A/B/c/d/ e2 f4|"))).toEqual(frac(4 * 2, 16 * 3));
  });
  it("the skeleton holds a tuplet's first note for the tuplet's whole time", () => {
    const r = skeletonOf(tune("(3ABc d2 (3efg a2|"));
    expect(r.ok && r.value.abc).toBe(tune("A2 d2 e2 a2|"));
  });
});

describe("ABC 2.1 §3.1.7 default unit note length", () => {
  // Meter as a decimal below 0.75 → 1/16, else 1/8; M:C, M:C| and free meter → 1/8.
  it.each([
    ["2/4", frac(1, 16)],
    ["3/8", frac(1, 16)],
    ["3/4", frac(1, 8)],
    ["6/8", frac(1, 8)],
    ["4/4", frac(1, 8)],
    ["C", frac(1, 8)],
    ["C|", frac(1, 8)],
    ["none", frac(1, 8)],
  ])("M:%s gives L:%o", (m, unit) => {
    expect(defaultUnit(parseMeter(m))).toEqual(unit);
    const r = skeletonOf(`X:1\nM:${m}\nK:C\nA|\n`);
    expect(r.ok && r.value.unit).toEqual(unit);
    // abcjs agrees: the lone A lasts one default unit.
    expect(durations(`X:1\nM:${m}\nK:C\nA|\n`)).toEqual([unit]);
  });
});

describe("ABC 2.1 §4.17 chords", () => {
  it("a chord takes its first note's length, and the skeleton keeps that length", () => {
    const abc = tune("[C2E2] [CE]2 [C2E] [E2C]|");
    expect(same(durations(abc), [frac(2, 8), frac(2, 8), frac(2, 8), frac(2, 8)])).toBe(true);
    const r = skeletonOf(abc);
    expect(r.ok && r.value.abc).toBe(tune("E2 E2 E2 E2|"));
  });
});

describe("ABC 2.1 §4.4 broken rhythm", () => {
  // The standard's example: A>B equals A3/2B/2, A<B equals A/2B3/2; >> is double-dotted.
  it("the example lines are equal in time", () => {
    expect(same(durations(tune("A>B C<D E>>F G<<A|")), durations(tune("A3/2B/2 C/2D3/2 E7/4F/4 G/4A7/4|")))).toBe(true);
  });
  it("the skeleton keeps broken rhythm as written", () => {
    const r = skeletonOf(tune("~A>B C<D E2 F2|"));
    expect(r.ok && r.value.abc).toBe(tune("A>B C<D E2 F2|"));
  });
});

describe("ABC 2.1 §4.9 first and second endings", () => {
  it("labels the bars of each ending, also in the |1 and :|2 forms and for lists", () => {
    const abc = tune("|: A4 B4 |1 c4 d4 :|2 e4 f4 |] g8 |[1,3 a8 :|[2 b8 |]");
    const bars = melodyBars(prep(abc)).map((b) => b.ending);
    expect(bars).toEqual([null, "1", "2", null, "1,3", "2"]);
  });
});
