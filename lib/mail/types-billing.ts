// The billing e-mails' part of the mail contract (lib/mail/types.ts): template name → the data it needs.
// Each entry needs a subject in emails/billing/subjects.ts and a component in emails/billing/index.ts.
export interface BillingMail {}
