// The ladder bench's rules (lib/courses/rules.ts): no empty published course, no rung without a
// tune, no cycle (a tune once per ladder, a required stage the tune has), and moving rungs.
import { describe, expect, it } from "vitest";
import {
  courseHints,
  courseProblems,
  moved,
  moveGrade,
  moveRung,
  newProblems,
  orderMismatch,
  orderOf,
  type GradeFacts,
  type RungFacts,
} from "@/lib/courses/rules";

const rung = (id: string, tuneId: string | null, o: Partial<RungFacts> = {}): RungFacts => ({
  id,
  tuneId,
  tuneTitle: `Tune ${tuneId}`,
  requiredStage: 1,
  stageCount: 4,
  isTaster: false,
  ...o,
});
const ladder = (): GradeFacts[] => [
  { id: "g1", title: "Grade 1", rungs: [rung("r1", "t1", { isTaster: true }), rung("r2", "t2", { requiredStage: 4 })] },
  { id: "g2", title: "Grade 2", rungs: [rung("r3", "t3")] },
];

describe("courseProblems", () => {
  it("finds nothing wrong with a well-made ladder, published or not", () => {
    expect(courseProblems(ladder(), { published: true })).toEqual([]);
    expect(courseHints(ladder())).toEqual([]);
  });

  it("refuses an empty published course, but not an empty draft", () => {
    const empty: GradeFacts[] = [{ id: "g1", title: "Grade 1", rungs: [] }];
    expect(courseProblems(empty, { published: true }).map((p) => p.message)).toEqual([
      "A published course needs at least one rung with a tune.",
    ]);
    expect(courseProblems([], { published: true })).toHaveLength(1);
    expect(courseProblems(empty, { published: false })).toEqual([]);
  });

  it("refuses a rung without a tune", () => {
    const g = ladder();
    g[1].rungs.push(rung("r4", null));
    expect(courseProblems(g, { published: false })).toEqual([
      { gradeId: "g2", rungId: "r4", message: "Grade 2, rung 2 has no tune: choose one or remove the rung." },
    ]);
  });

  it("refuses a tune that comes round again on the same ladder (a cycle)", () => {
    const g = ladder();
    g[1].rungs.push(rung("r4", "t1"));
    expect(courseProblems(g, { published: false }).map((p) => p.message)).toEqual([
      "“Tune t1” is already on this ladder (Grade 1, rung 1); a tune appears once in a course.",
    ]);
  });

  it("refuses a required stage the tune does not have", () => {
    const g = ladder();
    g[0].rungs[1] = rung("r2", "t2", { requiredStage: 5, stageCount: 4 });
    expect(courseProblems(g, { published: false }).map((p) => p.message)).toEqual([
      "Grade 1, rung 2 asks for stage 5, but “Tune t2” has 4 stages.",
    ]);
  });

  it("tells a change's new problems from the ones already there", () => {
    const before = [{ message: "old" }];
    expect(newProblems(before, [{ message: "old" }, { message: "new" }])).toEqual([{ message: "new" }]);
  });

  it("hints at empty grades and at a course without a taster", () => {
    const g = ladder();
    g[0].rungs[0].isTaster = false;
    g.push({ id: "g3", title: "Grade 3", rungs: [] });
    expect(courseHints(g)).toEqual([
      "Grade 3 has no rungs yet: students will see it empty.",
      "No taster rung yet: visitors and students without a membership will see titles only.",
    ]);
  });
});

describe("moving rungs and grades", () => {
  const order = orderOf(ladder());

  it("moves a rung within its grade", () => {
    expect(moveRung(order, "r2", -1)).toEqual({
      grades: [
        { id: "g1", rungs: ["r2", "r1"] },
        { id: "g2", rungs: ["r3"] },
      ],
    });
  });

  it("moves a rung across the edge of its grade into the next one", () => {
    expect(moveRung(order, "r2", 1)).toEqual({
      grades: [
        { id: "g1", rungs: ["r1"] },
        { id: "g2", rungs: ["r2", "r3"] },
      ],
    });
    expect(moveRung(order, "r3", -1)).toEqual({
      grades: [
        { id: "g1", rungs: ["r1", "r2", "r3"] },
        { id: "g2", rungs: [] },
      ],
    });
  });

  it("does not move past the ends of the ladder", () => {
    expect(moveRung(order, "r1", -1)).toBeNull();
    expect(moveRung(order, "r3", 1)).toBeNull();
    expect(moveRung(order, "nope", 1)).toBeNull();
  });

  it("moves grades with their rungs", () => {
    expect(moveGrade(order, "g2", -1)).toEqual({
      grades: [
        { id: "g2", rungs: ["r3"] },
        { id: "g1", rungs: ["r1", "r2"] },
      ],
    });
    expect(moveGrade(order, "g1", -1)).toBeNull();
  });

  it("drops a dragged item at its new index", () => {
    expect(moved(["a", "b", "c", "d"], 0, 2)).toEqual(["b", "c", "a", "d"]);
    expect(moved(["a", "b", "c", "d"], 3, 0)).toEqual(["d", "a", "b", "c"]);
  });

  it("accepts only an order of exactly the course's grades and rungs", () => {
    expect(orderMismatch(ladder(), moveRung(order, "r2", 1)!)).toBeNull();
    expect(
      orderMismatch(ladder(), {
        grades: [
          { id: "g1", rungs: ["r1", "r2"] },
          { id: "g2", rungs: [] },
        ],
      }),
    ).toMatch(/changed since this page loaded/);
    expect(orderMismatch(ladder(), { grades: [{ id: "g1", rungs: ["r1", "r2", "r3"] }] })).not.toBeNull();
  });
});
