// Ladders and stages through the real route handlers (issue 5 items 5–7): a locked rung's stages are
// refused by the API, not only hidden by the page, and every refusal says why in words.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { enrolments, tuneProgress } from "@/db/schema";
import type { LadderJson, StageAbcJson, TuneJson } from "@/lib/catalogue/api-types";
import { authWorld, type AuthWorld } from "./helpers/auth-world";
import { makeCatalogueFixture, type CatalogueFixture } from "./helpers/catalogue-fixture";
import { callRoute } from "./helpers/catalogue-routes";

let w: AuthWorld;
let f: CatalogueFixture;
let student: { id: string };
let cookie: string;

beforeAll(async () => {
  w = await authWorld();
  const teacher = await w.person("teacher");
  student = await w.person("student");
  f = await makeCatalogueFixture(w.db, { teacher, student });
  cookie = await w.cookieFor(student.id);
});
afterAll(async () => w?.close());

/** As the student, or as a visitor when `who` is null. */
const get = (file: string, params: Record<string, string>, who: string | null = cookie) =>
  callRoute(file, "GET", { cookie: who ?? undefined, params });
const ladder = async () =>
  (await (await get("courses/[courseId]/ladder", { courseId: f.courseId })).json()) as LadderJson;
const setProgress = (tuneId: string, reachedStage: number) =>
  w.db
    .update(tuneProgress)
    .set({ reachedStage })
    .where(and(eq(tuneProgress.userId, student.id), eq(tuneProgress.tuneId, tuneId)));

describe("the ladder", () => {
  it("shows each rung done, in progress or locked, and a locked rung says which rung and stage open it", async () => {
    const l = await ladder();
    expect(l.standing).toEqual({ pathway: "ladder" });
    const rungs = l.grades.flatMap((g) => g.rungs);
    expect(rungs.map((r) => [r.tuneTitle, r.state])).toEqual([
      ["Fixture Taster", "done"],
      ["Fixture Second", "inProgress"],
      ["Fixture Third", "locked"],
    ]);
    expect(rungs[2].reason).toBe("Opens when you reach stage 2 (Bowing) on “Fixture Second” (Grade 1, rung 2).");
    expect(l.grades.map((g) => g.title)).toEqual(["Grade 1", "Grade 2"]);
  });

  it("refuses every stage of a locked rung with 403 and the same reason", async () => {
    for (const index of ["1", "2", "4"]) {
      const res = await get("tunes/[tuneId]/stages/[index]", { tuneId: f.tunes.C, index });
      expect(res.status).toBe(403);
      expect(((await res.json()) as { error: string }).error).toMatch(/stage 2 \(Bowing\) on “Fixture Second”/);
    }
    const tune = await get("tunes/[tuneId]", { tuneId: f.tunes.C });
    expect(tune.status).toBe(403);
  });

  it("opens the next rung once the previous one reaches its required stage", async () => {
    await setProgress(f.tunes.B, 2);
    try {
      expect((await ladder()).grades[1].rungs[0].state).toBe("open");
      expect((await get("tunes/[tuneId]/stages/[index]", { tuneId: f.tunes.C, index: "1" })).status).toBe(200);
      // Stage 2 of the newly opened rung still waits for stage 1 of its own tune.
      expect((await get("tunes/[tuneId]/stages/[index]", { tuneId: f.tunes.C, index: "2" })).status).toBe(403);
    } finally {
      await setProgress(f.tunes.B, 0);
    }
  });

  it("keeps a paused student on the taster only, and says why", async () => {
    const pause = (status: "paused" | "active") =>
      w.db.update(enrolments).set({ status }).where(eq(enrolments.userId, student.id));
    await pause("paused");
    try {
      const rungs = (await ladder()).grades.flatMap((g) => g.rungs);
      expect(rungs.map((r) => r.state)).toEqual(["done", "locked", "locked"]);
      expect(rungs[1].reason).toMatch(/enrolment in this course is paused/);
      expect((await get("tunes/[tuneId]/stages/[index]", { tuneId: f.tunes.B, index: "1" })).status).toBe(403);
    } finally {
      await pause("active");
    }
  });
});

describe("the tune and its stages", () => {
  it("lists locked stages with why, gives the phrase map, and never the full setting of a locked stage", async () => {
    const res = await get("tunes/[tuneId]", { tuneId: f.tunes.A });
    expect(res.status).toBe(200);
    const body = (await res.json()) as TuneJson;
    expect(body.stages.map((s) => [s.index, s.allowed])).toEqual([
      [1, true],
      [2, true],
      [3, false],
      [4, false],
    ]);
    expect(body.stages[2].reason).toBe("Opens when you have reached stage 2 (Bowing) of this tune.");
    expect(body.phraseMap?.parts[0].phrases.length).toBeGreaterThan(0);
    expect(JSON.stringify(body)).not.toContain("!mf!"); // dynamics belong to stage 4, which is locked
    const stage = (await (
      await get("tunes/[tuneId]/stages/[index]", { tuneId: f.tunes.A, index: "2" })
    ).json()) as StageAbcJson;
    expect(stage.abc).toContain("(d"); // stage 2 adds the slurs back
    expect(stage.abc).not.toContain("~");
  });

  it("answers 404 for an unknown tune, a malformed id, a stage the tune does not have and a draft course's tune", async () => {
    expect((await get("tunes/[tuneId]", { tuneId: "00000000-0000-4000-8000-000000000000" })).status).toBe(404);
    expect((await get("tunes/[tuneId]", { tuneId: "not-a-tune" })).status).toBe(404);
    expect((await get("tunes/[tuneId]/stages/[index]", { tuneId: f.tunes.A, index: "9" })).status).toBe(404);
    expect((await get("tunes/[tuneId]", { tuneId: f.tunes.D })).status).toBe(404);
    expect((await get("tunes/[tuneId]/stages/[index]", { tuneId: f.tunes.A, index: "zero" })).status).toBe(400);
  });

  it("lets a visitor play the taster's skeleton and tells them how to open the rest", async () => {
    expect((await get("tunes/[tuneId]/stages/[index]", { tuneId: f.tunes.A, index: "1" }, null)).status).toBe(200);
    const res = await get("tunes/[tuneId]/stages/[index]", { tuneId: f.tunes.A, index: "2" }, null);
    expect(res.status).toBe(403);
    expect(((await res.json()) as { error: string }).error).toMatch(/join the school/);
    const other = await get("tunes/[tuneId]", { tuneId: f.tunes.B }, null);
    expect(((await other.json()) as { error: string }).error).toMatch(/Join the school and enrol in “Fixture Course”/);
  });
});

describe("courses", () => {
  it("lists published courses with grades and tune titles, and leaves drafts out", async () => {
    const body = (await (await get("courses", {}, null)).json()) as {
      courses: { id: string; grades: { rungs: { tuneTitle: string; isTaster: boolean }[] }[] }[];
    };
    const ids = body.courses.map((c) => c.id);
    expect(ids).toContain(f.courseId);
    expect(ids).not.toContain(f.draftCourseId);
    const course = body.courses.find((c) => c.id === f.courseId);
    expect(course?.grades.flatMap((g) => g.rungs.map((r) => [r.tuneTitle, r.isTaster]))).toEqual([
      ["Fixture Taster", true],
      ["Fixture Second", false],
      ["Fixture Third", false],
    ]);
  });

  it("gives the student their courses with how far they have come and where to carry on", async () => {
    const body = (await (await get("courses/mine", {})).json()) as {
      courses: { id: string; relation: string; done: number; rungs: number; next: { tuneTitle: string } | null }[];
    };
    expect(body.courses).toHaveLength(1);
    expect(body.courses[0]).toMatchObject({
      id: f.courseId,
      relation: "active",
      done: 1,
      rungs: 3,
      next: { tuneTitle: "Fixture Second" },
    });
  });
});
