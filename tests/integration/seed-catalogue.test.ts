// The demo catalogue in a fresh database (issue 5, item 8): seeding twice leaves one copy, every
// rung has a tune with its stages, and hand-edited stages survive a reseed.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { asc, eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { courses, enrolments, grades, rungs, tunes, tuneStages } from "@/db/schema";
import { seed } from "@/db/seed";
import { seedCatalogue } from "@/db/seed-catalogue";
import { DEMO_COURSES, DEMO_TUNES } from "@/db/seed-data/catalogue";
import { createTestDatabase } from "./helpers/db";

let world: Awaited<ReturnType<typeof createTestDatabase>>;
let db: Db;

const count = async (
  table: typeof courses | typeof grades | typeof rungs | typeof tunes | typeof tuneStages | typeof enrolments,
) => (await db.select({ n: sql<number>`count(*)::int` }).from(table))[0].n;
const counts = async () => ({
  courses: await count(courses),
  grades: await count(grades),
  rungs: await count(rungs),
  tunes: await count(tunes),
  stages: await count(tuneStages),
  enrolments: await count(enrolments),
});

beforeAll(async () => {
  world = await createTestDatabase();
  db = world.db;
  await seed(db);
});
afterAll(async () => world?.drop());

describe("seedCatalogue", () => {
  it("seeds the demo courses and tunes, and a second run changes no count", async () => {
    const first = await seedCatalogue(db);
    expect(first).toEqual({ courses: DEMO_COURSES.length, tunes: DEMO_TUNES.length });
    const before = await counts();
    expect(before.stages).toBe(DEMO_TUNES.length * 4); // the default plan has four stages
    expect(before.enrolments).toBe(DEMO_COURSES.reduce((n, c) => n + c.enrolments.length, 0));
    expect(await seedCatalogue(db)).toEqual(first);
    expect(await counts()).toEqual(before);
  });

  it("gives every rung a tune with its stages, and each course at least two grades", async () => {
    const rows = await db
      .select({
        slug: courses.slug,
        grade: grades.position,
        tune: tunes.title,
        stages: sql<number>`(select count(*)::int from tune_stages s where s.tune_id = ${tunes.id})`,
      })
      .from(rungs)
      .innerJoin(grades, eq(rungs.gradeId, grades.id))
      .innerJoin(courses, eq(grades.courseId, courses.id))
      .innerJoin(tunes, eq(rungs.tuneId, tunes.id));
    expect(rows).toHaveLength(DEMO_COURSES.reduce((n, c) => n + c.grades.reduce((m, g) => m + g.rungs.length, 0), 0));
    for (const r of rows) expect([r.tune, r.stages]).toEqual([r.tune, 4]);
    for (const c of DEMO_COURSES)
      expect(new Set(rows.filter((r) => r.slug === c.slug).map((r) => r.grade)).size).toBeGreaterThanOrEqual(2);
    const unlinked = await db.execute(
      sql`select g.id from grades g where not exists (select 1 from rungs r where r.grade_id = g.id)`,
    );
    expect(unlinked.length).toBe(0);
  });

  it("publishes the courses with a taster as the first rung of each", async () => {
    const firsts = await db
      .select({ slug: courses.slug, published: courses.publishedAt, taster: rungs.isTaster })
      .from(rungs)
      .innerJoin(grades, eq(rungs.gradeId, grades.id))
      .innerJoin(courses, eq(grades.courseId, courses.id))
      .where(sql`${grades.position} = 1 and ${rungs.position} = 1`)
      .orderBy(asc(courses.slug));
    expect(firsts.map((f) => [f.slug, f.taster, f.published !== null])).toEqual(
      DEMO_COURSES.map((c) => [c.slug, true, true]).sort((a, b) => String(a[0]).localeCompare(String(b[0]))),
    );
  });

  it("reads type, key and meter from the ABC and stores the full setting as the last stage", async () => {
    const [wren] = await db.select().from(tunes).where(eq(tunes.title, "The Gatepost Wren"));
    expect([wren.tuneType, wren.key, wren.meter]).toEqual(["reel", "G", "4/4"]);
    const [heron] = await db.select().from(tunes).where(eq(tunes.title, "The Heron's Second Thought"));
    expect([heron.tuneType, heron.key, heron.meter]).toEqual(["slip jig", "Em", "9/8"]);
    const stages = await db
      .select()
      .from(tuneStages)
      .where(eq(tuneStages.tuneId, wren.id))
      .orderBy(asc(tuneStages.index));
    expect(stages.map((s) => s.index)).toEqual([1, 2, 3, 4]);
    expect(stages[3].abc).toBe(wren.abc);
    expect(stages[0].kinds).toEqual([]);
    expect(stages[0].abc).not.toMatch(/[~{]|!\w+!/);
  });

  it("keeps a hand-edited stage when the demo source is seeded again, and flags it", async () => {
    const [wren] = await db.select().from(tunes).where(eq(tunes.title, "The Gatepost Wren"));
    const edited = "X:1\nT:The Gatepost Wren\nM:4/4\nL:1/8\nK:G\nG8|\n";
    await db
      .update(tuneStages)
      .set({ abc: edited, handEdited: true })
      .where(sql`${tuneStages.tuneId} = ${wren.id} and ${tuneStages.index} = 2`);
    await db
      .update(tunes)
      .set({ abc: wren.abc.replace("K:G", "% an older copy\nK:G") })
      .where(eq(tunes.id, wren.id));
    await seedCatalogue(db);
    const [after] = await db.select().from(tunes).where(eq(tunes.id, wren.id));
    expect(after.abc).toBe(wren.abc);
    const [stage2] = await db
      .select()
      .from(tuneStages)
      .where(sql`${tuneStages.tuneId} = ${wren.id} and ${tuneStages.index} = 2`);
    expect([stage2.abc, stage2.handEdited, stage2.sourceChanged]).toEqual([edited, true, true]);
  });
});
