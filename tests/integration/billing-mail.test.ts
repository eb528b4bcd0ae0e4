// The billing e-mails render with their facts and an absolute link (no database needed; kept with
// the billing tests). The webhook tests show when each is queued.
import { describe, expect, it } from "vitest";
import { renderMail } from "@/lib/mail/templates";
import type { AnyOutgoingMail } from "@/lib/mail/outbox";

const appUrl = "https://school.example";
const cases: { mail: AnyOutgoingMail; link: string; subject: RegExp; words: string[] }[] = [
  {
    mail: {
      to: "a@example.com",
      template: "payment-receipt",
      data: {
        name: "Ann",
        planName: "Monthly membership",
        amount: "£18.00",
        receiptNumber: "RW-0001",
        paidOn: "2 December 2026",
        period: "2 December 2026 to 2 January 2027",
        receiptUrl: "/learn/billing/receipts/p1",
      },
    },
    link: `${appUrl}/learn/billing/receipts/p1`,
    subject: /receipt RW-0001 \(£18\.00\)/,
    words: ["Hollin Bank Fiddle School received £18.00", "RW-0001", "2 December 2026 to 2 January 2027"],
  },
  {
    mail: {
      to: "a@example.com",
      template: "payment-failed",
      data: {
        name: "Ann",
        planName: "Monthly membership",
        amount: "£18.00",
        failureMessage: "Your card was declined.",
        graceUntil: "9 January 2027",
        billingUrl: "/learn/billing",
      },
    },
    link: `${appUrl}/learn/billing`,
    subject: /Monthly membership payment did not go through/,
    words: ["Your card was declined.", "9 January 2027"],
  },
  {
    mail: {
      to: "a@example.com",
      template: "membership-ended",
      data: { name: "Ann", planName: "Yearly membership", endedOn: "1 March 2027", plansUrl: "/plans" },
    },
    link: `${appUrl}/plans`,
    subject: /Yearly membership has ended/,
    words: ["1 March 2027"],
  },
  {
    mail: {
      to: "a@example.com",
      template: "refund-issued",
      data: {
        name: "Ann",
        amount: "£5.00",
        receiptNumber: "RW-0001",
        reason: "Missed two lessons",
        receiptUrl: "/learn/billing/receipts/p1",
      },
    },
    link: `${appUrl}/learn/billing/receipts/p1`,
    subject: /Refund of £5\.00 on receipt RW-0001/,
    words: ["£5.00", "Missed two lessons"],
  },
];

describe("billing e-mails", () => {
  it.each(cases)(
    "$mail.template: subject, facts and the absolute link in HTML and text",
    async ({ mail, link, subject, words }) => {
      const r = await renderMail(mail.template, mail.data, { appUrl, schoolName: "Hollin Bank Fiddle School" });
      expect(r.subject).toMatch(subject);
      expect(r.html).toContain(`href="${link}"`);
      expect(r.text).toContain(link);
      for (const w of words) expect(r.text).toContain(w);
    },
  );
});
