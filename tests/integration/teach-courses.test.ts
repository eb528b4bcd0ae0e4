// The ladder bench's routes against a real database: grades and rungs, the rules (no empty
// published course, a tune once per ladder, a required stage the tune has), reordering through
// the unique positions, publish and unpublish, and whose course is whose.
import { insertEnrolment } from "@/db/queries/enrolments";
import { readFileSync } from "node:fs";
import { asc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { grades, rungs } from "@/db/schema";
import type { CourseView } from "@/lib/courses/api-types";
import { teachWorld } from "./helpers/teach-world";

const WICKER = readFileSync("tests/fixtures/teach/wicker-gate.abc", "utf8"); // invented tunes (this project's own)
const jig = (t: string) => `X:1\nT:${t}\nR:jig\nM:6/8\nL:1/8\nK:G\n|:GAB dBG|ABA AGE|GAB dBG|AGF G3:|\n`;

type World = Awaited<ReturnType<typeof teachWorld>>;
let w: World;
let me: string;
let other: string;
let admin: string;
let myTunes: string[] = [];
let theirTune: string;

const C = "teach/courses";
const ONE = "teach/courses/[courseId]";
async function tune(cookie: string, abc: string): Promise<string> {
  const res = await w.call("teach/tunes", "POST", { cookie, body: { abc } });
  expect(res.status).toBe(201);
  return ((await res.json()) as { tuneId: string }).tuneId;
}
async function course(title = "Jigs for starters", cookie = me): Promise<string> {
  const res = await w.call(C, "POST", { cookie, body: { title } });
  expect(res.status).toBe(201);
  return ((await res.json()) as { id: string }).id;
}
const view = async (courseId: string, cookie = me) =>
  (await (await w.call(ONE, "GET", { cookie, params: { courseId } })).json()) as CourseView;
const grade = async (courseId: string, title: string) =>
  (
    (await (
      await w.call(`${C}/[courseId]/grades`, "POST", { cookie: me, params: { courseId }, body: { title } })
    ).json()) as { id: string }
  ).id;
const addRung = (courseId: string, body: Record<string, unknown>, cookie = me) =>
  w.call(`${C}/[courseId]/rungs`, "POST", { cookie, params: { courseId }, body: { requiredStage: 1, ...body } });
const patch = (courseId: string, body: Record<string, unknown>, cookie = me) =>
  w.call(ONE, "PATCH", { cookie, params: { courseId }, body });
const errorOf = async (res: Response) => ((await res.json()) as { error: string }).error;

beforeAll(async () => {
  w = await teachWorld();
  me = await w.cookieFor((await w.person("teacher")).id);
  other = await w.cookieFor((await w.person("teacher")).id);
  admin = await w.cookieFor((await w.person("admin")).id);
  myTunes = [await tune(me, WICKER), await tune(me, jig("Hollow Lane")), await tune(me, jig("Mossy Step"))];
  theirTune = await tune(other, jig("Somebody Else's"));
});
afterAll(async () => w?.close());

describe("building a course", () => {
  it("adds grades and rungs in order, with the stage names for each rung", async () => {
    const id = await course();
    const g1 = await grade(id, "Grade 1");
    expect((await addRung(id, { gradeId: g1, tuneId: myTunes[0], requiredStage: 2, isTaster: true })).status).toBe(201);
    expect((await addRung(id, { gradeId: g1, tuneId: myTunes[1] })).status).toBe(201);
    const v = await view(id);
    expect(v.grades.map((g) => g.rungs.map((r) => [r.tuneTitle, r.requiredStage, r.isTaster]))).toEqual([
      [
        ["Wicker Gate", 2, true],
        ["Hollow Lane", 1, false],
      ],
    ]);
    expect(v.grades[0].rungs[0].stageNames).toEqual([
      "Skeleton",
      "Bowing",
      "Ornaments, slides and fills",
      "Full setting",
    ]);
    expect(v.problems).toEqual([]);
  });

  it("refuses a tune twice on one ladder, a stage the tune lacks, and someone else's tune", async () => {
    const id = await course();
    const [g1, g2] = [await grade(id, "Grade 1"), await grade(id, "Grade 2")];
    expect((await addRung(id, { gradeId: g1, tuneId: myTunes[0] })).status).toBe(201);
    const twice = await addRung(id, { gradeId: g2, tuneId: myTunes[0] });
    expect(twice.status).toBe(422);
    expect(await errorOf(twice)).toBe(
      "“Wicker Gate” is already on this ladder (Grade 1, rung 1); a tune appears once in a course.",
    );
    const deep = await addRung(id, { gradeId: g2, tuneId: myTunes[1], requiredStage: 6 });
    // a jig without embellishments: the default plan fitted to it is one stage (lib/abc/stages.ts withoutRepeats)
    expect(await errorOf(deep)).toBe("Grade 2, rung 1 asks for stage 6, but “Hollow Lane” has 1 stage.");
    expect((await addRung(id, { gradeId: g2, tuneId: theirTune })).status).toBe(404);
    expect((await addRung(id, { gradeId: g2 })).status).toBe(400); // no tune: the schema says so first
    expect((await view(id)).grades.flatMap((g) => g.rungs)).toHaveLength(1); // nothing half-stored
  });

  it("publishes only a course with a rung, and keeps a published course from going empty", async () => {
    const id = await course();
    const g1 = await grade(id, "Grade 1");
    const empty = await patch(id, { published: true });
    expect(empty.status).toBe(422);
    expect(await errorOf(empty)).toMatch(/A published course needs at least one rung/);
    await addRung(id, { gradeId: g1, tuneId: myTunes[2] });
    expect((await patch(id, { published: true })).status).toBe(200);
    expect((await view(id)).published).toBe(true);
    const rungId = (await view(id)).grades[0].rungs[0].id;
    const last = await w.call(`${C}/[courseId]/rungs/[rungId]`, "DELETE", {
      cookie: me,
      params: { courseId: id, rungId },
    });
    expect(last.status).toBe(422);
    expect(
      (
        await w.call(`${C}/[courseId]/grades/[gradeId]`, "DELETE", {
          cookie: me,
          params: { courseId: id, gradeId: g1 },
        })
      ).status,
    ).toBe(422);
    expect((await patch(id, { published: false })).status).toBe(200);
    expect(
      (await w.call(`${C}/[courseId]/rungs/[rungId]`, "DELETE", { cookie: me, params: { courseId: id, rungId } }))
        .status,
    ).toBe(204);
  });

  it("changes a rung's required stage and taster flag within the tune's stages", async () => {
    const id = await course();
    const g1 = await grade(id, "Grade 1");
    await addRung(id, { gradeId: g1, tuneId: myTunes[0] });
    const rungId = (await view(id)).grades[0].rungs[0].id;
    const path = `${C}/[courseId]/rungs/[rungId]`;
    expect(
      (
        await w.call(path, "PATCH", {
          cookie: me,
          params: { courseId: id, rungId },
          body: { requiredStage: 3, isTaster: true },
        })
      ).status,
    ).toBe(200);
    expect((await view(id)).grades[0].rungs[0]).toMatchObject({ requiredStage: 3, isTaster: true });
    expect(
      (await w.call(path, "PATCH", { cookie: me, params: { courseId: id, rungId }, body: { requiredStage: 5 } }))
        .status,
    ).toBe(422);
  });

  it("keeps a tune that a ladder uses from being deleted", async () => {
    const id = await course("Keeps its tunes");
    await addRung(id, { gradeId: await grade(id, "Grade 1"), tuneId: myTunes[1] });
    const res = await w.call("teach/tunes/[tuneId]", "DELETE", { cookie: me, params: { tuneId: myTunes[1] } });
    expect(res.status).toBe(409);
    expect(await errorOf(res)).toMatch(/is on the ladder of .*“Keeps its tunes”/);
  });
});

describe("reordering", () => {
  it("moves grades and rungs (across grades too) and stores unique positions from 1", async () => {
    const id = await course();
    const [g1, g2] = [await grade(id, "Grade 1"), await grade(id, "Grade 2")];
    for (const t of myTunes) await addRung(id, { gradeId: g1, tuneId: t });
    const [a, b, c] = (await view(id)).grades[0].rungs.map((r) => r.id);
    const order = {
      grades: [
        { id: g2, rungs: [c, a] },
        { id: g1, rungs: [b] },
      ],
    };
    expect(
      (await w.call(`${C}/[courseId]/order`, "PUT", { cookie: me, params: { courseId: id }, body: order })).status,
    ).toBe(200);
    expect((await view(id)).grades.map((g) => [g.id, g.rungs.map((r) => r.id)])).toEqual([
      [g2, [c, a]],
      [g1, [b]],
    ]);
    const rows = await w.db
      .select({ grade: rungs.gradeId, position: rungs.position })
      .from(rungs)
      .where(eq(rungs.id, a));
    expect(rows).toEqual([{ grade: g2, position: 2 }]);
    const gs = await w.db
      .select({ id: grades.id, position: grades.position })
      .from(grades)
      .where(eq(grades.courseId, id))
      .orderBy(asc(grades.position));
    expect(gs).toEqual([
      { id: g2, position: 1 },
      { id: g1, position: 2 },
    ]);
  });

  it("refuses an order that leaves a rung out (the page was stale)", async () => {
    const id = await course();
    const g1 = await grade(id, "Grade 1");
    await addRung(id, { gradeId: g1, tuneId: myTunes[0] });
    const res = await w.call(`${C}/[courseId]/order`, "PUT", {
      cookie: me,
      params: { courseId: id },
      body: { grades: [{ id: g1, rungs: [] }] },
    });
    expect(res.status).toBe(409);
    expect((await view(id)).grades[0].rungs).toHaveLength(1);
  });
});

describe("whose course", () => {
  it("answers another teacher with 404 everywhere and lets an admin in", async () => {
    const id = await course();
    const g1 = await grade(id, "Grade 1");
    expect((await w.call(ONE, "GET", { cookie: other, params: { courseId: id } })).status).toBe(404);
    expect((await patch(id, { title: "Mine now" }, other)).status).toBe(404);
    expect((await addRung(id, { gradeId: g1, tuneId: theirTune }, other)).status).toBe(404);
    expect((await w.call(ONE, "GET", { cookie: admin, params: { courseId: id } })).status).toBe(200);
    expect((await patch(id, { title: "Renamed by the admin" }, admin)).status).toBe(200);
    const list = (await (await w.call(C, "GET", { cookie: other })).json()) as { courses: { id: string }[] };
    expect(list.courses.some((c) => c.id === id)).toBe(false);
  });

  it("keeps a course with enrolled students from being deleted, and deletes an unused draft", async () => {
    const id = await course();
    const student = await w.person("student");
    await insertEnrolment(w.db, { userId: student.id, courseId: id });
    const res = await w.call(ONE, "DELETE", { cookie: me, params: { courseId: id } });
    expect(res.status).toBe(409);
    expect(await errorOf(res)).toMatch(/1 student is enrolled/);
    const draft = await course("Short-lived");
    expect((await w.call(ONE, "DELETE", { cookie: me, params: { courseId: draft } })).status).toBe(204);
  });

  it("gives each course its own slug", async () => {
    const [a, b] = [await course("Same Name"), await course("Same Name")];
    expect([(await view(a)).slug, (await view(b)).slug]).toEqual(["same-name", "same-name-2"]);
  });
});
