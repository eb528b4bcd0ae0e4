// The contract between the code that decides to send an e-mail and the mail system (outbox, queue, templates).
// Callers only ever enqueue; a worker renders and sends through the resend SDK with retries.

import type { BillingMail } from "./types-billing";
import type { TeachingMail } from "./types-teaching";

/** Every message Rosinwood sends, with the data its template needs. Teaching and billing keep theirs apart. */
export interface MailTemplates extends TeachingMail, BillingMail {
  welcome: { name: string; verifyUrl: string };
  "verify-email": { name: string; verifyUrl: string };
  "password-reset": { name: string; resetUrl: string; expiresInMinutes: number };
  "password-changed": { name: string };
  invitation: { inviterName: string; role: "student" | "teacher" | "admin"; acceptUrl: string; expiresInDays: number };
}
export type TemplateName = keyof MailTemplates;

export interface OutgoingMail<T extends TemplateName = TemplateName> {
  to: string;
  template: T;
  data: MailTemplates[T];
  /** Makes "send at most once" rules hold: a second enqueue with the same key is ignored. */
  dedupeKey?: string;
  /** Not sent before this time (a note its writer can still take back); unset: as soon as the worker can. */
  sendAfter?: Date;
}
