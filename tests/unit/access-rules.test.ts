// The pure access rules of the ladders and stages (lib/catalogue/rules.ts), as issue 5 item 5 and
// PRODUCT.md §3 state them: "a rung opens when the previous rung reaches its required stage".
import { describe, expect, it } from "vitest";
import { bestRung, decideLadder, decideStage, type LadderRung, type Standing } from "@/lib/catalogue/rules";

const NAMES = { 1: "Core melody", 2: "Bowing", 3: "Ornaments and fills", 4: "Full setting" };
const rung = (n: number, o: Partial<LadderRung> = {}): LadderRung => ({
  rungId: `r${n}`,
  tuneId: `t${n}`,
  tuneTitle: `Tune ${n}`,
  gradeTitle: n <= 2 ? "Grade 1" : "Grade 2",
  position: n <= 2 ? n : n - 2,
  requiredStage: 2,
  isTaster: false,
  stageNames: NAMES,
  ...o,
});
const LADDER = [rung(1, { isTaster: true, requiredStage: 1 }), rung(2), rung(3), rung(4)];
const enrolled: Standing = { pathway: "ladder" };
const outsider: Standing = { pathway: "taster", why: "Enrol in this course to open this rung." };
const progress = (entries: [string, number][]) => new Map(entries);

describe("decideLadder", () => {
  it("opens the first rung of an enrolled student and locks the second until the first's required stage", () => {
    const d = decideLadder(LADDER, enrolled, progress([]));
    expect(d.map((r) => r.state)).toEqual(["open", "locked", "locked", "locked"]);
    // The reason names the rung and the stage to reach, in words.
    expect(d[1].reason).toBe("Opens when you reach stage 1 (Core melody) on “Tune 1” (Grade 1, rung 1).");
    expect(d[2].reason).toBe("Opens when you reach stage 2 (Bowing) on “Tune 2” (Grade 1, rung 2).");
  });

  it("crosses from one grade to the next by the last rung of the grade before", () => {
    const d = decideLadder(
      LADDER,
      enrolled,
      progress([
        ["t1", 1],
        ["t2", 2],
        ["t3", 1],
      ]),
    );
    expect(d.map((r) => r.state)).toEqual(["done", "done", "inProgress", "locked"]);
    expect(d[2].open).toBe(true);
    expect(d[3].reason).toMatch(/stage 2 \(Bowing\) on “Tune 3” \(Grade 2, rung 1\)/);
  });

  it("counts a started tune with no stage reached as in progress only once the rung is open", () => {
    const d = decideLadder(
      LADDER,
      enrolled,
      progress([
        ["t1", 1],
        ["t2", 0],
      ]),
    );
    expect(d[1].state).toBe("inProgress");
    expect(d[1].reached).toBe(0);
  });

  it("opens a taster rung to everyone, and nothing else to someone not enrolled", () => {
    const d = decideLadder(LADDER, outsider, progress([["t2", 4]]));
    expect(d.map((r) => r.open)).toEqual([true, false, false, false]);
    expect(d[1].reason).toBe("Enrol in this course to open this rung.");
    expect(d[3].reason).toBe("Enrol in this course to open this rung."); // progress elsewhere does not open a rung
  });

  it("opens every rung to staff", () => {
    expect(decideLadder(LADDER, { pathway: "staff" }, progress([])).every((r) => r.open)).toBe(true);
  });

  it("keeps a taster rung open in the middle of a ladder even when the rung before is not done", () => {
    const d = decideLadder([rung(1), rung(2, { isTaster: true }), rung(3)], enrolled, progress([]));
    expect(d.map((r) => r.open)).toEqual([true, true, false]);
  });
});

describe("decideStage", () => {
  it("opens stage k once stage k−1 is reached, and stage 1 at once", () => {
    const allowed = [1, 2, 3, 4].map(
      (k) => decideStage(k, NAMES, { staff: false, reached: 1, signedIn: true }).allowed,
    );
    expect(allowed).toEqual([true, true, false, false]);
    expect(decideStage(3, NAMES, { staff: false, reached: 1, signedIn: true }).reason).toBe(
      "Opens when you have reached stage 2 (Bowing) of this tune.",
    );
  });

  it("opens only the skeleton to a visitor, and says how to go further", () => {
    expect(decideStage(1, NAMES, { staff: false, reached: 0, signedIn: false }).allowed).toBe(true);
    const two = decideStage(2, NAMES, { staff: false, reached: 0, signedIn: false });
    expect(two.allowed).toBe(false);
    expect(two.reason).toMatch(/stage 1 \(Core melody\).*join the school/);
  });

  it("opens every stage to staff", () => {
    expect(decideStage(4, NAMES, { staff: true, reached: 0, signedIn: true }).allowed).toBe(true);
  });
});

describe("bestRung", () => {
  it("prefers an open rung, then the one with more progress", () => {
    const a = { id: "a", open: false, reached: 3 };
    const b = { id: "b", open: true, reached: 0 };
    const c = { id: "c", open: true, reached: 2 };
    expect(bestRung([a, b, c])?.id).toBe("c");
    expect(bestRung([a])?.id).toBe("a");
    expect(bestRung([])).toBeUndefined();
  });
});
