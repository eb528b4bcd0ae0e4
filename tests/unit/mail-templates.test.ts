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
  {
    mail: {
      to: "a@example.com",
      template: "welcome-note",
      data: {
        studentName: "Ann",
        teacherName: "Morag Reid",
        courseTitle: "Slow Airs",
        note: "Glad to have you: start with the first rung.",
        courseUrl: "/learn/courses/slow-airs",
      },
    },
    link: `${appUrl}/learn/courses/slow-airs`,
    subject: /Morag Reid welcomes you to Slow Airs/,
  },
  {
    mail: {
      to: "t@example.com",
      template: "new-members",
      data: {
        teacherName: "Morag Reid",
        day: "Friday 4 December",
        members: [
          { name: "Ann", courseTitle: "Slow Airs" },
          { name: "Bea", courseTitle: "Reels" },
        ],
        rosterUrl: "/teach",
      },
    },
    link: `${appUrl}/teach`,
    subject: /2 new members since Friday 4 December/,
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

  it("lists every new member with their course, and words a comment on a self-paced check-in", async () => {
    const digest = await renderMail(
      "new-members",
      {
        teacherName: "Morag",
        day: "Friday 4 December",
        members: [
          { name: "Ann Lea", courseTitle: "Slow Airs" },
          { name: "Bea Orr", courseTitle: "Reels" },
        ],
        rosterUrl: "/teach",
      },
      { appUrl, schoolName },
    );
    expect(digest.text).toContain("Ann Lea, on “Slow Airs”");
    expect(digest.text).toContain("Bea Orr, on “Reels”");
    const comment = await renderMail(
      "checkin-feedback",
      {
        studentName: "Ann",
        teacherName: "Morag",
        tuneTitle: "Hill Road",
        stageName: "Skeleton",
        outcome: "comment",
        feedback: "Lovely even bowing.",
        nextStageName: null,
        assignmentUrl: "/learn/tunes/t1",
        courseTitle: "Slow Airs",
        recorded: false,
      },
      { appUrl, schoolName },
    );
    expect(comment.subject).toBe("Hill Road: a word from Morag on Skeleton");
    expect(comment.text).toContain("Morag has a word on your check-in of Hill Road (Skeleton).");
    expect(comment.html).toContain(`href="${appUrl}/learn/tunes/t1"`);
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
