import { emailOutbox } from "@/db/schema";
import { scheduleEmail } from "@/lib/jobs/queue";
import type { DbOrTx } from "@/lib/jobs/sql-executor";
import { renderSubject } from "@/emails/subjects";
import type { OutgoingMail, TemplateName } from "./types";

export type { DbOrTx };

/** Any one message, with its data matching its template (OutgoingMail's default leaves them unpaired). */
export type AnyOutgoingMail = { [T in TemplateName]: OutgoingMail<T> }[TemplateName];

/**
 * Writes the message to the outbox and queues its sending, both in one transaction (a savepoint when
 * the caller already holds one), so the mail exists exactly when the caller's change does.
 * Returns null when `dedupeKey` was already used: that message was queued before.
 */
export async function enqueueEmail<T extends TemplateName>(
  db: DbOrTx,
  mail: OutgoingMail<T>,
): Promise<{ id: string } | null> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(emailOutbox)
      .values({
        toAddress: mail.to,
        template: mail.template,
        // Rendered now so the row reads well in the database and on admin pages.
        subject: renderSubject(mail.template, mail.data),
        payload: { ...mail.data },
        dedupeKey: mail.dedupeKey ?? null,
        sendAfter: mail.sendAfter ?? null,
      })
      .onConflictDoNothing({ target: emailOutbox.dedupeKey })
      .returning({ id: emailOutbox.id });
    if (!row) return null;
    try {
      // Its own savepoint: a failure here (no worker has created the queue yet) must not undo the row.
      const jobId = await tx.transaction((sp) => scheduleEmail(row.id, sp, mail.sendAfter));
      if (!jobId) console.warn(`[mail] outbox row ${row.id} saved; no send-email queue yet, the sweeper will queue it`);
    } catch (error) {
      console.warn(`[mail] outbox row ${row.id} saved; the sweeper will queue it (${errorText(error)})`);
    }
    return { id: row.id };
  });
}

/** Several messages in one transaction; the result lines up with `mails` (null where a dedupeKey was used). */
export async function enqueueEmails(db: DbOrTx, mails: readonly AnyOutgoingMail[]): Promise<({ id: string } | null)[]> {
  return db.transaction(async (tx) => {
    const results: ({ id: string } | null)[] = [];
    for (const mail of mails) results.push(await enqueueEmail(tx, mail));
    return results;
  });
}

// drizzle wraps driver errors with the whole query text; the driver's own message is the useful line.
function errorText(error: unknown): string {
  const inner = error instanceof Error && error.cause instanceof Error ? error.cause : error;
  return inner instanceof Error ? inner.message : String(inner);
}
