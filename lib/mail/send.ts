import { and, eq, isNull, lte, or, sql } from "drizzle-orm";
import { Resend } from "resend";
import { emailOutbox } from "@/db/schema";
import type { DbOrTx } from "@/lib/jobs/sql-executor";
import { env, EnvError } from "@/lib/env";
import { isTemplateName, renderMail, type RenderedMail } from "./templates";
import type { MailTemplates } from "./types";

export interface MailerConfig {
  apiKey: string;
  /** Resend's API address; the SDK falls back to RESEND_BASE_URL, then to https://api.resend.com. */
  baseUrl?: string;
  from: string;
  /** The app's public address, for absolute links. */
  appUrl: string;
  /** The school's name, shown in every message. */
  schoolName: string;
  /** A send that takes longer is treated as failed and retried (the idempotency key makes that safe). */
  timeoutMs?: number;
}

export interface Mailer {
  resend: Resend;
  config: MailerConfig;
}

export function createMailer(config: MailerConfig): Mailer {
  return { resend: new Resend(config.apiKey, config.baseUrl ? { baseUrl: config.baseUrl } : undefined), config };
}

export function mailerFromEnv(): Mailer {
  const e = env();
  if (!e.RESEND_API_KEY)
    throw new EnvError("Rosinwood cannot send e-mail: RESEND_API_KEY is missing. See .env.example.");
  return createMailer({
    apiKey: e.RESEND_API_KEY,
    baseUrl: e.RESEND_BASE_URL,
    from: e.MAIL_FROM,
    appUrl: e.APP_URL,
    schoolName: e.SCHOOL_NAME,
  });
}

/** Thrown when a send may succeed later (provider down, network, rate limit): the job queue retries it. */
export class RetryableMailError extends Error {}

export type SendOutcome = "sent" | "skipped" | "failed";

// Resend answers 400/422 for a message it will never accept (bad address, missing field); retrying cannot help.
// Source: Resend API reference, "Errors" (validation_error 400, missing_required_field 422, invalid_parameter 422).
const PERMANENT_STATUS = new Set([400, 422]);

/**
 * Sends one outbox row. The row is locked while it is sent, so two jobs for the same row never send
 * at once; the row id is the idempotency key, so a retry after a lost answer is not delivered twice.
 * Returns "skipped" when the row is already sent, failed for good, or being sent by another job.
 */
export async function sendOutboxEmail(db: DbOrTx, outboxId: string, mailer: Mailer): Promise<SendOutcome> {
  const result = await db.transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(emailOutbox)
      // A message held back (sendAfter) is not sent early by a spare job; its own job or a later sweep sends it.
      .where(
        and(
          eq(emailOutbox.id, outboxId),
          eq(emailOutbox.status, "queued"),
          or(isNull(emailOutbox.sendAfter), lte(emailOutbox.sendAfter, sql`now()`)),
        ),
      )
      .for("update", { skipLocked: true });
    if (!row) return { outcome: "skipped" as const };

    const record = (fields: Partial<typeof emailOutbox.$inferInsert>) =>
      tx
        .update(emailOutbox)
        .set({ attempts: sql`${emailOutbox.attempts} + 1`, ...fields })
        .where(eq(emailOutbox.id, row.id));

    let rendered: RenderedMail;
    try {
      if (!isTemplateName(row.template)) throw new Error(`unknown template "${row.template}"`);
      // The payload was written from a value typed by this template (enqueueEmail), so it has its shape.
      rendered = await renderMail(row.template, row.payload as MailTemplates[typeof row.template], mailer.config);
    } catch (error) {
      await record({ status: "failed", lastError: `could not render: ${message(error)}` });
      return { outcome: "failed" as const };
    }

    const { data, error } = await mailer.resend.emails.send(
      { from: mailer.config.from, to: row.toAddress, subject: row.subject, html: rendered.html, text: rendered.text },
      { idempotencyKey: row.id, signal: AbortSignal.timeout(mailer.config.timeoutMs ?? 15_000) },
    );
    if (data) {
      await record({ status: "sent", providerId: data.id, sentAt: new Date(), lastError: null });
      return { outcome: "sent" as const };
    }
    const text = `${error.name} (${error.statusCode ?? "no answer"}): ${error.message}`;
    if (error.name === "invalid_idempotent_request") {
      // Resend already accepted a message under this key (an earlier rendering, before a settings change):
      // it was sent, and sending the new version would be the duplicate the key exists to prevent.
      await record({ status: "sent", sentAt: new Date(), lastError: `accepted earlier under this key; ${text}` });
      return { outcome: "sent" as const };
    }
    if (error.statusCode !== null && PERMANENT_STATUS.has(error.statusCode)) {
      await record({ status: "failed", lastError: text });
      return { outcome: "failed" as const };
    }
    await record({ lastError: text });
    return { outcome: "retry" as const, text };
  });
  if (result.outcome === "retry") throw new RetryableMailError(`e-mail ${outboxId} not sent yet: ${result.text}`);
  return result.outcome;
}

function message(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
