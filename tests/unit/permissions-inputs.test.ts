import { describe, expect, it } from "vitest";
import { passwordProblem, MIN_PASSWORD_LENGTH } from "@/lib/auth/password-policy";
import { parseAddresses } from "@/lib/auth/invitations";
import { hashToken, newToken } from "@/lib/auth/tokens";

describe("password rules", () => {
  it("refuses short passwords with a message naming the length", () => {
    expect(passwordProblem("bow-rosin")).toMatch(new RegExp(`at least ${MIN_PASSWORD_LENGTH} characters`)); // 9 characters
    expect(passwordProblem("bow-and-fir")).toBeNull();
  });

  it("refuses the most common passwords whatever their letter case", () => {
    // "password123" and "qwertyuiop" top the widely published common-password lists (common practice).
    expect(passwordProblem("Password123")).toMatch(/most common passwords/);
    expect(passwordProblem("qwertyuiop")).toMatch(/most common passwords/);
    expect(passwordProblem("rosinwood123")).toMatch(/most common/);
  });

  it("refuses one repeated character and the person's own address", () => {
    expect(passwordProblem("zzzzzzzzzzzz")).toMatch(/repeated/);
    expect(passwordProblem("fern@example.test", "Fern@Example.test")).toMatch(/e-mail address/);
  });

  it("counts characters, not UTF-16 units, and caps the length", () => {
    expect(passwordProblem("🎻🎻🎻🎻🎻🎻🎻🎻🎻")).toMatch(/at least/); // 9 characters, 18 units
    expect(passwordProblem("x".repeat(150) + "y".repeat(60))).toMatch(/at most/);
  });
});

describe("pasted invitation addresses", () => {
  it("splits on commas, spaces and lines, drops repeats in any case and lists the bad ones", () => {
    const { valid, invalid } = parseAddresses(
      "a@one.example, B@two.example\n<c@three.example>; A@ONE.example not-an-address",
    );
    expect(valid).toEqual(["a@one.example", "B@two.example", "c@three.example"]);
    expect(invalid).toEqual(["not-an-address"]);
  });
});

describe("e-mailed tokens", () => {
  it("are long, random and stored only as a hash", () => {
    const a = newToken();
    const b = newToken();
    expect(a.token).not.toBe(b.token);
    expect(a.token.length).toBeGreaterThanOrEqual(43); // 32 bytes in base64url
    expect(a.hash).toBe(hashToken(a.token));
    expect(a.hash).not.toContain(a.token);
    expect(a.hash).toMatch(/^[0-9a-f]{64}$/);
  });
});
