import { and, eq, gt, sql } from "drizzle-orm";
import type { Tx } from "@/db/queries/auth";
import { emailTokens, users } from "@/db/schema";

/** At most one confirmation or reset e-mail per address in this many minutes (common practice). */
export const MAIL_GAP_MINUTES = 5;

/**
 * Whether a link of this purpose went to the person within the last few minutes. The person's row is
 * locked for the rest of the transaction, so requests arriving together decide one after the other.
 * A request inside the gap sends nothing and keeps the link already sent working.
 */
export async function mailedRecently(tx: Tx, userId: string, purpose: "verify_email" | "reset_password") {
  await tx.select({ id: users.id }).from(users).where(eq(users.id, userId)).for("update");
  const rows = await tx
    .select({ id: emailTokens.id })
    .from(emailTokens)
    .where(
      and(
        eq(emailTokens.userId, userId),
        eq(emailTokens.purpose, purpose),
        gt(emailTokens.createdAt, sql`now() - make_interval(mins => ${MAIL_GAP_MINUTES})`),
      ),
    )
    .limit(1);
  return rows.length > 0;
}
