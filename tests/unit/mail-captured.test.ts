import { describe, expect, it } from "vitest";
import { frameDocument, linksIn } from "@/lib/mail/captured";
import { renderMail } from "@/lib/mail/templates";

describe("reading captured e-mail on the /dev/mail page", () => {
  it("offers each link of a rendered message once, with its query string intact", async () => {
    const { html } = await renderMail(
      "password-reset",
      { name: "Ann", resetUrl: "/reset-password?token=abc&from=mail", expiresInMinutes: 60 },
      { appUrl: "http://127.0.0.1:3000", schoolName: "Test Fiddle School" },
    );
    const links = linksIn(html);
    // The button and the written-out address are the same link: listed once. React writes & as &amp; in attributes.
    expect(links.filter((l) => l.includes("reset-password"))).toEqual([
      "http://127.0.0.1:3000/reset-password?token=abc&from=mail",
    ]);
    expect(links).toContain("http://127.0.0.1:3000/");
  });

  it("opens the message's links in a new tab rather than inside the sandboxed frame", () => {
    expect(frameDocument("<html><head><title>x</title></head><body></body></html>")).toContain(
      '<head><base target="_blank"><title>',
    );
    expect(frameDocument("<p>bare</p>")).toBe('<base target="_blank"><p>bare</p>');
  });
});
