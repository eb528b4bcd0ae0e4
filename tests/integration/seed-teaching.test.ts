// The demo school in mid-term, seeded into a fresh database and read back through the app's own code:
// the first student's Today, the teachers' review queues with recordings in storage that the
// listening aid hears, rosters with open and overdue work, notes and ladders; a second seed keeps
// whatever was done with the demo since.
import { readFileSync } from "node:fs";
import { and, eq, sql } from "drizzle-orm";
import { fileTypeFromBuffer } from "file-type";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Db } from "@/db/client";
import { checkIns, checkInListenings, practiceLogs, stageStates, users } from "@/db/schema";
import { seed } from "@/db/seed";
import { demoId } from "@/db/seed-teaching";
import { STUDENTS, TEACHERS } from "@/db/seed-data/people";
import { DEMO_TAKES, takeFile } from "@/db/seed-data/takes";
import { DEMO_ASSIGNMENTS } from "@/db/seed-data/teaching";
import { ladderFor } from "@/lib/catalogue/access";
import { notesOn } from "@/lib/catalogue/notes";
import { hearCheckIn } from "@/lib/jobs/listen";
import { playbackUrl } from "@/lib/storage/recordings";
import { reviewCheckIn, reviewQueue } from "@/lib/teaching/review";
import { rosterTable } from "@/lib/teaching/roster";
import { todayFor } from "@/lib/teaching/today";
import { createTestDatabase } from "./helpers/db";

let world: Awaited<ReturnType<typeof createTestDatabase>>;
let db: Db;
let first: Awaited<ReturnType<typeof seed>>;
type Who = { id: string; name: string; email: string; role: "student" | "teacher" | "admin" };
const person = async (email: string): Promise<Who> => {
  const [row] = await db
    .select({ id: users.id, name: users.name, email: users.email, role: users.role })
    .from(users)
    .where(sql`lower(${users.email}) = lower(${email})`);
  return row;
};

beforeAll(async () => {
  world = await createTestDatabase();
  db = world.db;
  first = await seed(db);
}, 120_000);
afterAll(async () => world?.drop());

describe("the demo school in mid-term", () => {
  it("writes every demo assignment, each check-in with its recording", () => {
    expect(first.teaching.assignments).toBe(DEMO_ASSIGNMENTS.length);
    expect(first.teaching.checkIns).toBe(DEMO_ASSIGNMENTS.reduce((n, a) => n + a.checkIns.length, 0));
  });

  it("gives the first student a Today with assignments (one overdue), a live streak, feedback and a chart", async () => {
    const alder = await person(STUDENTS[0].email);
    const today = await todayFor(db, { id: alder.id, role: "student" });
    expect(today.assignments.length).toBeGreaterThanOrEqual(2);
    expect(today.assignments.some((a) => a.overdue)).toBe(true);
    expect(today.assignments.some((a) => a.current?.waiting)).toBe(true);
    expect(today.streak).toBeGreaterThan(5);
    expect(today.feedback.length).toBeGreaterThanOrEqual(3);
    expect(today.feedback.map((f) => f.outcome)).toContain("needs_more_time");
    expect(today.minutes.filter((d) => d.minutes > 0).length).toBeGreaterThan(14);
    expect(today.nextRungs.map((r) => r.courseTitle).sort()).toEqual([
      "First Steps on the Fiddle",
      "Tunes for the Dance Floor",
    ]);
  });

  it("shows the first student progress on two ladders and their margin notes", async () => {
    const alder = await person(STUDENTS[0].email);
    const viewer = { id: alder.id, role: "student" as const };
    const first = await ladderFor(db, viewer, "first-steps");
    const dance = await ladderFor(db, viewer, "dance-floor");
    expect(first?.grades[0].rungs.map((r) => r.state)).toEqual(["done", "inProgress", "locked"]);
    expect(dance?.grades[0].rungs.map((r) => r.state)).toEqual(["done", "open"]);
    const biscuit = first!.grades[0].rungs[0].tuneId;
    expect((await notesOn(db, viewer, biscuit)).map((n) => n.bar).sort()).toEqual([3, 6]);
  });

  it("fills the first teacher's review queue with recordings in storage that play and that the aid hears", async () => {
    const isla = await person(TEACHERS[0].email);
    const queue = await reviewQueue(db, { id: isla.id, role: "teacher" });
    expect(queue.waiting).toBeGreaterThanOrEqual(5);
    for (const item of queue.checkIns) expect(item.uploadId, item.student.name).not.toBeNull();
    const newest = queue.checkIns.at(-1)!;
    const { url } = await playbackUrl(db, { ...isla, role: "teacher" }, newest.uploadId!);
    const bytes = Buffer.from(await (await fetch(url)).arrayBuffer());
    expect((await fileTypeFromBuffer(bytes))?.mime).toBe("audio/mpeg");
    const demo = DEMO_ASSIGNMENTS.find((a) => a.student === 3 && a.tune === "lamp-in-the-attic.abc")!;
    expect(newest.student.name).toBe(STUDENTS[3].name); // the newest check-in: Delphine's, a day ago
    expect(bytes.equals(readFileSync(takeFile(demo.checkIns[0].take)))).toBe(true);
    // The worker's job on it: heard against the stage, bar by bar.
    const oldest = queue.checkIns[0];
    expect(await hearCheckIn(db, oldest.checkInId)).toBe("done");
    const [heard] = await db.select().from(checkInListenings).where(eq(checkInListenings.checkInId, oldest.checkInId));
    expect(heard.status).toBe("done");
    expect(String(heard.result?.summary)).toMatch(/bpm/);
  });

  it("gives every teacher a roster with open and overdue work and practice, and check-ins in every outcome", async () => {
    for (const t of TEACHERS) {
      const me = await person(t.email);
      const roster = await rosterTable(db, { id: me.id, role: "teacher" }, new Date());
      expect(
        roster.some((r) => r.openAssignments > 0),
        t.name,
      ).toBe(true);
      expect(
        roster.some((r) => r.overdueAssignments > 0),
        t.name,
      ).toBe(true);
      expect(
        roster.some((r) => r.lastPractice !== null),
        t.name,
      ).toBe(true);
      const rows = await db.execute<{ status: string; state: string }>(sql`
        select distinct c.status::text as status, st.state::text as state from check_ins c
        join stage_states st on st.id = c.stage_state_id
        join assignment_students s on s.id = st.assignment_student_id
        join assignments a on a.id = s.assignment_id where a.teacher_id = ${me.id}`);
      const statuses = new Set(rows.map((r) => r.status));
      for (const s of ["waiting", "signed_off", "needs_more_time"]) expect(statuses, `${t.name}: ${s}`).toContain(s);
    }
  });

  it("stores one recording object per check-in, each a shipped take", async () => {
    const rows = await db.execute<{ n: number; stored: number }>(sql`
      select count(*)::int as n, count(*) filter (where u.status = 'stored' and u.size_bytes > 0)::int as stored
      from check_ins c join uploads u on u.id = c.upload_id`);
    expect(rows[0].stored).toBe(first.teaching.checkIns);
    expect(Object.keys(DEMO_TAKES).length).toBeGreaterThan(10);
  });

  it("seeds again without adding a row, and keeps what was done with the demo since", async () => {
    const alder = await person(STUDENTS[0].email);
    const isla = await person(TEACHERS[0].email);
    const count = async () =>
      (
        await db.execute<{ a: number; c: number; p: number }>(sql`select
          (select count(*)::int from assignments) as a, (select count(*)::int from check_ins) as c,
          (select count(*)::int from practice_logs) as p`)
      )[0];
    // Alder deletes a practice entry; Isla signs off a waiting check-in.
    const [entry] = await db
      .select({ id: practiceLogs.id })
      .from(practiceLogs)
      .where(eq(practiceLogs.userId, alder.id))
      .limit(1);
    await db.delete(practiceLogs).where(eq(practiceLogs.id, entry.id));
    const waiting = demoId("check-in", "isla/gideon/biscuit/0");
    await reviewCheckIn(
      db,
      { id: isla.id, role: "teacher" },
      { checkInId: waiting, outcome: "signed_off", feedback: "Good." },
      new Date(),
    );
    const before = await count();
    const again = await seed(db);
    expect(again.teaching).toEqual({ assignments: 0, checkIns: 0, recent: [] });
    expect(await count()).toEqual(before);
    const [kept] = await db.select({ status: checkIns.status }).from(checkIns).where(eq(checkIns.id, waiting));
    expect(kept.status).toBe("signed_off");
    expect(await db.select().from(practiceLogs).where(eq(practiceLogs.id, entry.id))).toEqual([]);
    const stage2 = await db
      .select({ state: stageStates.state })
      .from(stageStates)
      .where(and(eq(stageStates.id, demoId("stage", "isla/gideon/biscuit/2"))));
    expect(stage2[0].state).toBe("open");
  });
});
