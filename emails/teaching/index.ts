import type { TemplateEntry } from "@/lib/mail/templates";
import type { TeachingMail } from "@/lib/mail/types-teaching";

// The teaching e-mails' templates, spread into lib/mail/templates.ts.
export const teachingTemplates: { [T in keyof TeachingMail]: TemplateEntry<T> } = {};
