import type { MailTemplates, TemplateName } from "@/lib/mail/types";
import { billingSubjects } from "./billing/subjects";
import { teachingSubjects } from "./teaching/subjects";

// Subjects live apart from the JSX so that code which only enqueues (and its tests) never loads React e-mail.
export const subjects: { [T in TemplateName]: (data: MailTemplates[T]) => string } = {
  welcome: (data) => `Welcome to Rosinwood, ${data.name}`,
  "verify-email": () => "Please confirm your e-mail address",
  "password-reset": () => "Choose a new Rosinwood password",
  "password-changed": () => "Your Rosinwood password was changed",
  invitation: (data) => `${data.inviterName} invited you to Rosinwood`,
  ...teachingSubjects,
  ...billingSubjects,
};

export function renderSubject<T extends TemplateName>(template: T, data: MailTemplates[T]): string {
  const subject: (data: MailTemplates[T]) => string = subjects[template];
  return subject(data);
}
