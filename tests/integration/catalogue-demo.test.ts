// The demo school's ladders (issue 5): after seeding, the first demo student sees rungs done, in
// progress, open and locked, and seeding again changes nothing.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { tuneProgress } from "@/db/schema";
import { seed } from "@/db/seed";
import { DEMO_PROGRESS, seedProgress } from "@/db/seed-progress";
import { STUDENTS } from "@/db/seed-data/people";
import { ladderFor } from "@/lib/catalogue/access";
import { createTestDatabase } from "./helpers/db";

let world: Awaited<ReturnType<typeof createTestDatabase>>;
let db: Db;
let alder: { id: string; role: "student" };

beforeAll(async () => {
  world = await createTestDatabase();
  db = world.db;
  await seed(db); // people, catalogue and progress
  const rows = await db.execute<{ id: string }>(
    sql`select id from users where lower(email) = lower(${STUDENTS[0].email})`,
  );
  alder = { id: rows[0].id, role: "student" };
});
afterAll(async () => world?.drop());

describe("demo progress", () => {
  it("is seeded once: a second run adds no row", async () => {
    const count = async () => (await db.select({ n: sql<number>`count(*)::int` }).from(tuneProgress))[0].n;
    expect(await count()).toBe(DEMO_PROGRESS.length);
    expect(await seedProgress(db)).toBe(0);
    expect(await count()).toBe(DEMO_PROGRESS.length);
  });

  it("shows the first demo student every state of a rung, with a reason on each locked one", async () => {
    const first = await ladderFor(db, alder, "first-steps");
    const dance = await ladderFor(db, alder, "dance-floor");
    const states = [first, dance].flatMap((l) => l?.grades.flatMap((g) => g.rungs.map((r) => r.state)) ?? []);
    expect(new Set(states)).toEqual(new Set(["done", "inProgress", "open", "locked"]));
    expect(first?.grades[0].rungs.map((r) => r.state)).toEqual(["done", "inProgress", "locked"]);
    const locked = [first, dance].flatMap(
      (l) => l?.grades.flatMap((g) => g.rungs.filter((r) => r.state === "locked")) ?? [],
    );
    for (const r of locked)
      expect(r.reason).toMatch(/^Opens when you reach stage \d \(.+\) on “.+” \(Grade \d, rung \d\)\.$/);
  });

  it("keeps a course the student is not enrolled in to its taster", async () => {
    const session = await ladderFor(db, alder, "session-ready");
    const rungs = session?.grades.flatMap((g) => g.rungs) ?? [];
    expect(rungs.filter((r) => r.open).map((r) => r.isTaster)).toEqual([true]);
    expect(rungs.find((r) => !r.open)?.reason).toBe("Enrol in “Ready for the Session” to open this rung.");
  });
});
