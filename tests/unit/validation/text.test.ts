import { describe, expect, it } from "vitest";
import { findControlCharacter, isSaneDay } from "@/lib/validation/text";
import { checkTune } from "@/lib/tunes/check";

describe("control characters in text input", () => {
  it("finds the first C0 control or DEL, naming the top-level field and the code point", () => {
    expect(findControlCharacter({ name: "Ann", note: "a\u0000b" })).toEqual({ field: "note", char: "U+0000" });
    expect(findControlCharacter({ plan: { stages: ["ok", "x\u001b[2J"] } })).toEqual({ field: "plan", char: "U+001B" });
    expect(findControlCharacter({ title: "bell\u0007" })).toEqual({ field: "title", char: "U+0007" });
    expect(findControlCharacter({ title: "del\u007f" })).toEqual({ field: "title", char: "U+007F" });
    expect(findControlCharacter({ "bad\u0000key": "x" })).toEqual({ field: "badkey", char: "U+0000" });
  });

  it("leaves tab, line feed, carriage return and any other Unicode alone", () => {
    expect(findControlCharacter({ note: "Slow bows:\r\n\tA string", title: "Ríl 🎻 ‮" })).toBeNull();
    expect(findControlCharacter({ n: 5, ok: true, none: null })).toBeNull();
  });
});

describe("calendar days", () => {
  it("takes real days in the years 1900–2999 only", () => {
    for (const d of ["1900-01-01", "2024-02-29", "2999-12-31"]) expect(isSaneDay(d)).toBe(true);
    for (const d of ["0000-01-01", "1899-12-31", "3000-01-01", "2026-02-29", "2026-13-01", "+275760-09-13", "2026-1-1"])
      expect(isSaneDay(d)).toBe(false);
  });
});

describe("a tune with a control character", () => {
  it("is refused at the line and column of the character", () => {
    const abc = "X:1\nT:Bell Reel\nM:4/4\nL:1/8\nK:D\n|:DF\u0001AF dFAF|GBdB AFDF:|\n";
    const check = checkTune(abc, { lineOffset: 10 });
    expect(check.ok).toBe(false);
    if (check.ok) return;
    expect(check.problems).toEqual([expect.objectContaining({ line: 16, column: 5 })]);
    expect(check.problems[0].message).toMatch(/U\+0001/);
  });
});

describe("a tune's title", () => {
  it("is refused past 200 characters at its T: line", () => {
    const abc = `X:1\nT:${"Reel ".repeat(41)}\nM:4/4\nL:1/8\nK:D\n|:DFAF dFAF|GBdB AFDF:|\n`;
    const check = checkTune(abc);
    expect(check.ok).toBe(false);
    if (check.ok) return;
    expect(check.problems).toEqual([expect.objectContaining({ line: 2, column: 1 })]);
    expect(check.problems[0].message).toMatch(/under 200 characters/);
    expect(checkTune(abc.replace("Reel ".repeat(41), "Reel ".repeat(30))).ok).toBe(true);
  });
});
