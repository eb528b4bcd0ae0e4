import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { createTestDatabase } from "./helpers/db";
import { createUser, findUserByEmail, isOnRoster, listRoster, searchPeople } from "@/db/queries/people";
import { databaseHealth } from "@/db/queries/health";
import { seed } from "@/db/seed";
import { STUDENTS, TEACHERS } from "@/db/seed-data/people";
import { rosterEntries } from "@/db/schema";
import { connect } from "@/db/client";

let t: Awaited<ReturnType<typeof createTestDatabase>>;
beforeAll(async () => {
  t = await createTestDatabase();
});
afterAll(async () => {
  await t?.drop();
});

describe("db/queries against a migrated throwaway database", () => {
  it("creates a person and finds them by address whatever the letter case", async () => {
    const created = await createUser(t.db, { email: "Fern.Oddie@Example.test", name: "Fern Oddie", role: "student" });
    const found = await findUserByEmail(t.db, "fern.oddie@example.test");
    expect(found?.id).toBe(created.id);
    expect(found?.role).toBe("student");
    expect(found?.timeZone).toBe("Europe/London");
  });

  it("refuses a second account for the same address in other letter case", async () => {
    await expect(
      createUser(t.db, { email: "FERN.ODDIE@example.test", name: "Other", role: "student" }),
    ).rejects.toThrow();
  });

  it("seeds an admin, three teachers and 32 students, and a second seed changes nothing", async () => {
    const rosterRows = async () => (await t.db.select({ n: sql<number>`count(*)::int` }).from(rosterEntries))[0].n;
    const first = await seed(t.db);
    const roster = await rosterRows();
    const second = await seed(t.db);
    // 1 admin + 3 teachers + 32 students + the person made above
    expect(first.people).toBe(1 + TEACHERS.length + STUDENTS.length + 1);
    expect(second.people).toBe(first.people);
    expect(await rosterRows()).toBe(roster);
    // Every demo student has a teacher, and each enrolment's teacher has the student on their roster.
    const students = await t.db.execute<{ n: number }>(
      sql`select count(distinct student_id)::int as n from roster_entries`,
    );
    expect(students[0].n).toBe(STUDENTS.length);
    const missing = await t.db.execute<{ n: number }>(
      sql`select count(*)::int as n from enrolments e where not exists
            (select 1 from roster_entries r where r.teacher_id = e.teacher_id and r.student_id = e.user_id)`,
    );
    expect(missing[0].n).toBe(0);
  });

  it("lists a teacher's roster and answers whether a student is on it", async () => {
    const teacher = await findUserByEmail(t.db, TEACHERS[0].email);
    const own = await findUserByEmail(t.db, STUDENTS[0].email); // student 0 belongs to teacher 0
    const other = await findUserByEmail(t.db, STUDENTS[1].email); // student 1 belongs to teacher 1
    const roster = await listRoster(t.db, teacher!.id);
    expect(roster.map((r) => r.email)).toContain(STUDENTS[0].email);
    expect(roster.map((r) => r.email)).not.toContain(STUDENTS[1].email);
    expect(await isOnRoster(t.db, teacher!.id, own!.id)).toBe(true);
    expect(await isOnRoster(t.db, teacher!.id, other!.id)).toBe(false);
  });

  it("searches people by name with paging, and treats % literally", async () => {
    const page1 = await searchPeople(t.db, { role: "student", page: 1, pageSize: 10 });
    const page4 = await searchPeople(t.db, { role: "student", page: 4, pageSize: 10 });
    expect(page1.total).toBe(STUDENTS.length + 1);
    expect(page1.rows).toHaveLength(10);
    expect(page4.rows).toHaveLength(page1.total - 30);
    const names = page1.rows.map((r) => r.name);
    expect([...names].sort((a, b) => (a < b ? -1 : 1))).toEqual(names);
    expect((await searchPeople(t.db, { query: "penhallow", page: 1, pageSize: 10 })).rows[0]?.email).toBe(
      TEACHERS[0].email,
    );
    expect((await searchPeople(t.db, { query: "%", page: 1, pageSize: 10 })).total).toBe(0);
  });

  it("reports the database healthy, and unhealthy when nothing answers", async () => {
    expect((await databaseHealth(t.db)).ok).toBe(true);
    const dead = connect("postgres://nobody:x@127.0.0.1:1/none");
    try {
      expect((await databaseHealth(dead.db)).ok).toBe(false);
    } finally {
      await dead.close();
    }
  });

  it("keeps refunds within the payment by a check constraint", async () => {
    const error = await t.db
      .execute(
        sql`insert into payments (user_id, stripe_invoice_id, kind, amount, refunded_amount, currency, status, created_at)
        select id, 'in_test_1', 'new', 1500, 1600, 'GBP', 'paid', now() from users limit 1`,
      )
      .then(
        () => null,
        (e: unknown) => e,
      );
    // drizzle wraps the driver's error; the constraint's name is on the cause.
    expect((error as { cause?: { constraint_name?: string } } | null)?.cause?.constraint_name).toBe(
      "payments_refund_within_amount",
    );
  });
});
