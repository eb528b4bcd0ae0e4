import { plainTextSelectors, render, toPlainText } from "@react-email/render";
import { createElement, type ComponentType } from "react";
import { billingTemplates } from "@/emails/billing";
import { teachingTemplates } from "@/emails/teaching";
import InvitationEmail, { subject as invitationSubject } from "@/emails/invitation";
import type { MailFrame } from "@/emails/layout";
import PasswordChangedEmail, { subject as passwordChangedSubject } from "@/emails/password-changed";
import PasswordResetEmail, { subject as passwordResetSubject } from "@/emails/password-reset";
import VerifyEmail, { subject as verifySubject } from "@/emails/verify-email";
import WelcomeEmail, { subject as welcomeSubject } from "@/emails/welcome";
import type { MailTemplates, TemplateName } from "./types";

export interface TemplateEntry<T extends TemplateName> {
  subject: (data: MailTemplates[T]) => string;
  Component: ComponentType<MailTemplates[T] & MailFrame>;
}

// A mapped type, so adding an entry to MailTemplates without a template here is a type error.
const templates: { [T in TemplateName]: TemplateEntry<T> } = {
  welcome: { subject: welcomeSubject, Component: WelcomeEmail },
  "verify-email": { subject: verifySubject, Component: VerifyEmail },
  "password-reset": { subject: passwordResetSubject, Component: PasswordResetEmail },
  "password-changed": { subject: passwordChangedSubject, Component: PasswordChangedEmail },
  invitation: { subject: invitationSubject, Component: InvitationEmail },
  ...teachingTemplates,
  ...billingTemplates,
};

export function isTemplateName(name: string): name is TemplateName {
  return Object.hasOwn(templates, name);
}

// Headings stay in the writer's case: shouted capitals read as unfriendly in a warm message.
const textOptions = { selectors: [...plainTextSelectors, { selector: "h1", options: { uppercase: false } }] };

export interface RenderedMail {
  subject: string;
  html: string;
  text: string;
}

/** HTML and a plain-text part: some readers show only text, and a text part helps deliverability (common practice). */
export async function renderMail<T extends TemplateName>(
  template: T,
  data: MailTemplates[T],
  frame: MailFrame,
): Promise<RenderedMail> {
  const entry: TemplateEntry<T> = templates[template];
  // An explicit (empty) key lets TypeScript see that the generic props also fit React's Attributes.
  const html = await render(createElement(entry.Component, { key: null, ...data, ...frame }));
  return { subject: entry.subject(data), html, text: toPlainText(html, textOptions) };
}
