import { sql } from "drizzle-orm";
import type { Db } from "./client";
import { rosterEntries, users } from "./schema";
import { ADMIN, DEMO_PASSWORD, STUDENTS, TEACHERS } from "./seed-data/people";
import type { TeachingSeeded } from "./seed-teaching";
import { hashPassword } from "@/lib/auth/password";

/** True when the database holds no people yet (start.sh seeds only then). */
export async function isEmpty(db: Db): Promise<boolean> {
  const rows = await db.select({ n: sql<number>`count(*)::int` }).from(users);
  return rows[0].n === 0;
}

async function upsertPerson(
  db: Db,
  person: { name: string; email: string; role: "student" | "teacher" | "admin"; timeZone?: string },
  passwordHash: string,
) {
  await db
    .insert(users)
    .values({ ...person, passwordHash, emailVerifiedAt: new Date() })
    .onConflictDoNothing();
  const rows = await db
    .select({ id: users.id })
    .from(users)
    .where(sql`lower(${users.email}) = lower(${person.email})`);
  return rows[0].id;
}

/** Idempotent: running it twice leaves one copy of everything. */
export async function seed(db: Db): Promise<{ people: number; teaching: TeachingSeeded }> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await upsertPerson(db, { ...ADMIN, role: "admin" }, passwordHash);
  const teacherIds: string[] = [];
  for (const t of TEACHERS) teacherIds.push(await upsertPerson(db, { ...t, role: "teacher" }, passwordHash));
  for (const s of STUDENTS) {
    const id = await upsertPerson(
      db,
      { name: s.name, email: s.email, role: "student", timeZone: s.timeZone },
      passwordHash,
    );
    await db
      .insert(rosterEntries)
      .values({ teacherId: teacherIds[s.teacherIndex], studentId: id })
      .onConflictDoNothing();
  }
  await (await import("./seed-catalogue")).seedCatalogue(db); // demo courses and tunes (issue 5, item 8)
  await (await import("./seed-progress")).seedProgress(db); // demo ladder progress (issue 5)
  await (await import("./seed-data/billing")).seedBilling(db); // plans and a year of billing, also in the Stripe stand-in (issue 7)
  // assignments, check-ins with recordings, feedback, practice and margin notes: the school in mid-term
  const teaching = await (await import("./seed-teaching")).seedTeaching(db);
  const rows = await db.select({ n: sql<number>`count(*)::int` }).from(users);
  return { people: rows[0].n, teaching };
}
