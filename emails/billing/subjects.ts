import type { BillingMail } from "@/lib/mail/types-billing";

// Subjects of the billing e-mails (apart from the JSX, like emails/subjects.ts).
export const billingSubjects: { [T in keyof BillingMail]: (data: BillingMail[T]) => string } = {};
