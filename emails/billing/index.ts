import type { TemplateEntry } from "@/lib/mail/templates";
import type { BillingMail } from "@/lib/mail/types-billing";

// The billing e-mails' templates, spread into lib/mail/templates.ts.
export const billingTemplates: { [T in keyof BillingMail]: TemplateEntry<T> } = {};
