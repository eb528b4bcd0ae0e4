import { describe, expect, it } from "vitest";
import { parseEnv } from "@/lib/env";

const base = { DATABASE_URL: "postgres://u:p@127.0.0.1:5432/db" };

describe("e-mail settings", () => {
  it("needs no mail setting for the web app, and has a sender by default", () => {
    const env = parseEnv(base);
    expect(env.MAIL_FROM).toBe("Rosinwood <hello@rosinwood.test>");
    expect(env.RESEND_API_KEY).toBeUndefined();
    expect(env.RESEND_FAKE_URL).toBeUndefined();
  });

  it("accepts a bare address or Name <address> as the sender, and names anything else", () => {
    expect(parseEnv({ ...base, MAIL_FROM: "school@example.com" }).MAIL_FROM).toBe("school@example.com");
    expect(parseEnv({ ...base, MAIL_FROM: "The School <school@example.com>" }).MAIL_FROM).toBe(
      "The School <school@example.com>",
    );
    expect(() => parseEnv({ ...base, MAIL_FROM: "The School" })).toThrow(
      /MAIL_FROM: must be an address or "Name <address>"/,
    );
  });

  it("names a malformed stand-in or API address", () => {
    expect(() => parseEnv({ ...base, RESEND_FAKE_URL: "localhost" })).toThrow(
      /RESEND_FAKE_URL: must be the local Resend stand-in's address/,
    );
    expect(() => parseEnv({ ...base, RESEND_BASE_URL: "api.resend" })).toThrow(
      /RESEND_BASE_URL: must be the Resend API's address/,
    );
    expect(() => parseEnv({ ...base, RESEND_API_KEY: "" })).toThrow(/RESEND_API_KEY: must not be empty/);
  });
});
