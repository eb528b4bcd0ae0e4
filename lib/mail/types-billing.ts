// The billing e-mails' part of the mail contract (lib/mail/types.ts): template name → the data it needs.
// Each entry needs a subject in emails/billing/subjects.ts and a component in emails/billing/index.ts.
// Amounts arrive already written with their currency ("£18.00") and dates in the member's own time zone.
export interface BillingMail {
  "payment-receipt": {
    name: string;
    planName: string;
    amount: string;
    receiptNumber: string;
    paidOn: string;
    /** "1 March 2027 to 1 April 2027"; empty when the invoice has no period. */
    period: string;
    receiptUrl: string;
  };
  "payment-failed": {
    name: string;
    planName: string;
    amount: string;
    /** The card network's words as Stripe reports them, e.g. "Your card was declined." */
    failureMessage: string;
    /** The last day the catalogue stays open without payment. */
    graceUntil: string;
    billingUrl: string;
  };
  "membership-ended": { name: string; planName: string; endedOn: string; plansUrl: string };
  "refund-issued": { name: string; amount: string; receiptNumber: string; reason: string; receiptUrl: string };
}
