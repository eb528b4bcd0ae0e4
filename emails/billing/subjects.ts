import type { BillingMail } from "@/lib/mail/types-billing";

// Subjects of the billing e-mails (apart from the JSX, like emails/subjects.ts).
export const billingSubjects: { [T in keyof BillingMail]: (data: BillingMail[T]) => string } = {
  "payment-receipt": (d) => `Your Rosinwood receipt ${d.receiptNumber} (${d.amount})`,
  "payment-failed": (d) => `Your ${d.planName} payment did not go through`,
  "membership-ended": (d) => `Your ${d.planName} has ended`,
  "refund-issued": (d) => `Refund of ${d.amount} on receipt ${d.receiptNumber}`,
};
