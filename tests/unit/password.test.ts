import { describe, expect, it } from "vitest";
import { hashPassword, verifyPassword } from "@/lib/auth/password";

describe("password hashing", () => {
  it("stores argon2id at OWASP's minimum cost and verifies only the right password", async () => {
    const stored = await hashPassword("a long fiddle tune");
    // PHC string format: $argon2id$v=19$m=19456,t=2,p=1$… (OWASP Password Storage Cheat Sheet: m=19 MiB, t=2, p=1)
    expect(stored).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(await verifyPassword(stored, "a long fiddle tune")).toBe(true);
    expect(await verifyPassword(stored, "a long fiddle tunE")).toBe(false);
    expect(await verifyPassword("not a hash", "x")).toBe(false);
  });
});
