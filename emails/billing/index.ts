import type { TemplateEntry } from "@/lib/mail/templates";
import type { BillingMail } from "@/lib/mail/types-billing";
import MembershipEndedEmail from "./membership-ended";
import PaymentFailedEmail from "./payment-failed";
import PaymentReceiptEmail from "./payment-receipt";
import RefundIssuedEmail from "./refund-issued";
import { billingSubjects } from "./subjects";

// The billing e-mails' templates, spread into lib/mail/templates.ts.
export const billingTemplates: { [T in keyof BillingMail]: TemplateEntry<T> } = {
  "payment-receipt": { subject: billingSubjects["payment-receipt"], Component: PaymentReceiptEmail },
  "payment-failed": { subject: billingSubjects["payment-failed"], Component: PaymentFailedEmail },
  "membership-ended": { subject: billingSubjects["membership-ended"], Component: MembershipEndedEmail },
  "refund-issued": { subject: billingSubjects["refund-issued"], Component: RefundIssuedEmail },
};
