import { and, asc, eq, ilike, or, sql } from "drizzle-orm";
import type { Tx as Db } from "./auth";
import { rosterEntries, users } from "../schema";

export type Role = "student" | "teacher" | "admin";

export async function findUserByEmail(db: Db, email: string) {
  const rows = await db
    .select()
    .from(users)
    .where(sql`lower(${users.email}) = lower(${email})`)
    .limit(1);
  return rows[0] ?? null;
}

export async function createUser(
  db: Db,
  input: { email: string; name: string; role: Role; passwordHash?: string | null },
) {
  const rows = await db.insert(users).values(input).returning();
  return rows[0];
}

/** A teacher's roster, alphabetical. */
export async function listRoster(db: Db, teacherId: string) {
  return db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(rosterEntries)
    .innerJoin(users, eq(users.id, rosterEntries.studentId))
    .where(eq(rosterEntries.teacherId, teacherId))
    .orderBy(asc(users.name));
}

export async function isOnRoster(db: Db, teacherId: string, studentId: string): Promise<boolean> {
  const rows = await db
    .select({ s: rosterEntries.studentId })
    .from(rosterEntries)
    .where(and(eq(rosterEntries.teacherId, teacherId), eq(rosterEntries.studentId, studentId)))
    .limit(1);
  return rows.length > 0;
}

/** People page: search by name or address, one page at a time. */
export async function searchPeople(db: Db, opts: { query?: string; role?: Role; page: number; pageSize: number }) {
  // Escape LIKE's wildcards so a search for "50%" means those characters.
  const q = opts.query?.trim().replace(/[\\%_]/g, "\\$&");
  const where = and(
    q ? or(ilike(users.name, `%${q}%`), ilike(users.email, `%${q}%`)) : undefined,
    opts.role ? eq(users.role, opts.role) : undefined,
  );
  const [rows, total] = await Promise.all([
    db
      .select({ id: users.id, name: users.name, email: users.email, role: users.role, createdAt: users.createdAt })
      .from(users)
      .where(where)
      .orderBy(asc(users.name), asc(users.id))
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize),
    db
      .select({ n: sql<number>`count(*)::int` })
      .from(users)
      .where(where),
  ]);
  return { rows, total: total[0].n };
}
