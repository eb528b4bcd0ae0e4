import { describe, expect, it } from "vitest";
import { renderSubject } from "@/emails/subjects";
import { renderMail } from "@/lib/mail/templates";
import type { AnyOutgoingMail } from "@/lib/mail/outbox";

const appUrl = "https://school.example";
const schoolName = "Hollin Bank Fiddle School";

// One message per template, each with the link the reader must be able to follow.
const cases: { mail: AnyOutgoingMail; link: string; subject: RegExp }[] = [
  {
    mail: { to: "a@example.com", template: "welcome", data: { name: "Ann", verifyUrl: "/verify-email?token=w1" } },
    link: `${appUrl}/verify-email?token=w1`,
    subject: /Welcome to Rosinwood, Ann/,
  },
  {
    mail: {
      to: "a@example.com",
      template: "verify-email",
      data: { name: "Ann", verifyUrl: `${appUrl}/verify-email?token=v1` },
    },
    link: `${appUrl}/verify-email?token=v1`,
    subject: /confirm your e-mail/i,
  },
  {
    mail: {
      to: "a@example.com",
      template: "password-reset",
      data: { name: "Ann", resetUrl: "/reset-password?token=r1", expiresInMinutes: 60 },
    },
    link: `${appUrl}/reset-password?token=r1`,
    subject: /new Rosinwood password/,
  },
  {
    mail: { to: "a@example.com", template: "password-changed", data: { name: "Ann" } },
    link: `${appUrl}/forgot-password`,
    subject: /password was changed/,
  },
  {
    mail: {
      to: "a@example.com",
      template: "invitation",
      data: { inviterName: "Morag Reid", role: "student", acceptUrl: "/invite/i1", expiresInDays: 7 },
    },
    link: `${appUrl}/invite/i1`,
    subject: /Morag Reid invited you/,
  },
];

describe("e-mail templates", () => {
  it.each(cases)("$mail.template: HTML and text carry the absolute link", async ({ mail, link, subject }) => {
    const rendered = await renderMail(mail.template, mail.data, { appUrl, schoolName });
    expect(rendered.subject).toMatch(subject);
    expect(renderSubject(mail.template, mail.data)).toBe(rendered.subject);
    expect(rendered.html).toContain(`href="${link}"`);
    expect(rendered.html).toMatch(/^<!DOCTYPE html/i);
    // The text part is for readers that show no HTML: the address must be there to copy.
    expect(rendered.text).toContain(link);
    expect(rendered.text).not.toMatch(/<[a-z]+[^>]*>/i);
  });

  it("puts the facts the reader needs in the words", async () => {
    const reset = await renderMail(
      "password-reset",
      { name: "Ann", resetUrl: "/r", expiresInMinutes: 45 },
      { appUrl, schoolName },
    );
    expect(reset.text).toMatch(/45 minutes/);
    const invite = await renderMail(
      "invitation",
      { inviterName: "Morag", role: "teacher", acceptUrl: "/i", expiresInDays: 1 },
      { appUrl, schoolName },
    );
    expect(invite.text).toMatch(/to teach/);
    expect(invite.text).toMatch(/1 day\b/);
  });

  it("names the school from the frame, not the demo school", async () => {
    const reset = await renderMail(
      "password-reset",
      { name: "Ann", resetUrl: "/r", expiresInMinutes: 45 },
      { appUrl, schoolName },
    );
    expect(reset.text).toContain("Hollin Bank Fiddle School");
    expect(reset.html).not.toContain("Larchmoor");
  });

  it("escapes what people typed (a name is text, never markup)", async () => {
    const rendered = await renderMail(
      "welcome",
      { name: '<img src=x onerror="alert(1)">', verifyUrl: "/v" },
      { appUrl, schoolName },
    );
    expect(rendered.html).not.toContain("<img src=x");
    expect(rendered.html).toContain("&lt;img");
  });
});
