// The teaching e-mails' part of the mail contract (lib/mail/types.ts): template name → the data it needs.
// Each entry needs a subject in emails/teaching/subjects.ts and a component in emails/teaching/index.ts.
export interface TeachingMail {}
