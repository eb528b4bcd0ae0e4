import { and, eq, gt, isNull, sql } from "drizzle-orm";
import type { PgDatabase } from "drizzle-orm/pg-core";
import type { PostgresJsQueryResultHKT } from "drizzle-orm/postgres-js";
import type * as schema from "../schema";
import { emailTokens, invitations, rosterEntries, users } from "../schema";
import type { Role } from "./people";

/** A database or an open transaction (both are this base type): the queries below run in either. */
export type Tx = PgDatabase<PostgresJsQueryResultHKT, typeof schema>;
type Purpose = "verify_email" | "reset_password";

export async function findUserById(db: Tx, id: string) {
  const rows = await db.select().from(users).where(eq(users.id, id)).limit(1);
  return rows[0] ?? null;
}

export async function insertEmailToken(
  db: Tx,
  v: { userId: string; purpose: Purpose; tokenHash: string; expiresAt: Date },
) {
  await db.insert(emailTokens).values(v);
}

/** Marks a token used and returns its person, in one statement, so two clicks cannot both succeed. */
export async function consumeEmailToken(
  db: Tx,
  tokenHash: string,
  purpose: Purpose,
  now = new Date(),
): Promise<string | null> {
  const rows = await db
    .update(emailTokens)
    .set({ usedAt: now })
    .where(
      and(
        eq(emailTokens.tokenHash, tokenHash),
        eq(emailTokens.purpose, purpose),
        isNull(emailTokens.usedAt),
        gt(emailTokens.expiresAt, now),
      ),
    )
    .returning({ userId: emailTokens.userId });
  return rows[0]?.userId ?? null;
}

/** A still-usable token of this purpose, without using it up (to show the right page before the submit). */
export async function peekEmailToken(db: Tx, tokenHash: string, purpose: Purpose, now = new Date()): Promise<boolean> {
  const rows = await db
    .select({ id: emailTokens.id })
    .from(emailTokens)
    .where(
      and(
        eq(emailTokens.tokenHash, tokenHash),
        eq(emailTokens.purpose, purpose),
        isNull(emailTokens.usedAt),
        gt(emailTokens.expiresAt, now),
      ),
    )
    .limit(1);
  return rows.length > 0;
}

/** Retires a person's other unused tokens of a purpose: only the newest link works. */
export async function retireEmailTokens(db: Tx, userId: string, purpose: Purpose, now = new Date()) {
  await db
    .update(emailTokens)
    .set({ usedAt: now })
    .where(and(eq(emailTokens.userId, userId), eq(emailTokens.purpose, purpose), isNull(emailTokens.usedAt)));
}

export async function setPasswordHash(db: Tx, userId: string, passwordHash: string) {
  await db.update(users).set({ passwordHash }).where(eq(users.id, userId));
}

export async function updateUser(
  db: Tx,
  userId: string,
  v: { name?: string; passwordHash?: string; emailVerifiedAt?: Date; role?: Role },
) {
  const rows = await db.update(users).set(v).where(eq(users.id, userId)).returning();
  return rows[0] ?? null;
}

export async function insertInvitation(
  db: Tx,
  v: { email: string; role: Role; invitedBy: string; tokenHash: string; expiresAt: Date },
) {
  const rows = await db.insert(invitations).values(v).returning({ id: invitations.id });
  return rows[0];
}

/** An invitation with its inviter's name and role, found by its token's hash. */
export async function findInvitation(db: Tx, tokenHash: string) {
  const rows = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      invitedBy: invitations.invitedBy,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      inviterName: users.name,
      inviterRole: users.role,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, tokenHash))
    .limit(1);
  return rows[0] ?? null;
}

/** Single use: only the first acceptance changes the row. */
export async function markInvitationAccepted(db: Tx, id: string, userId: string, now = new Date()): Promise<boolean> {
  const rows = await db
    .update(invitations)
    .set({ acceptedAt: now, acceptedUserId: userId })
    .where(and(eq(invitations.id, id), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)))
    .returning({ id: invitations.id });
  return rows.length > 0;
}

export async function addToRoster(db: Tx, teacherId: string, studentId: string) {
  await db.insert(rosterEntries).values({ teacherId, studentId }).onConflictDoNothing();
}

export async function countAdmins(db: Tx): Promise<number> {
  const rows = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(users)
    .where(and(eq(users.role, "admin"), eq(users.disabled, false)));
  return rows[0].n;
}
