import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { connect } from "@/db/client";
import { BASE_URL, hydrated, launch } from "./helpers/browser";

// The served app as an attacker meets it: what it believes about the client's address.

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("the client's address", () => {
  it("is the connection's own, not an X-Forwarded-For the client wrote (TRUSTED_PROXIES=0)", async () => {
    const forged = "203.0.113.77";
    const context = await browser.newContext({ extraHTTPHeaders: { "x-forwarded-for": forged } });
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/forgot-password`);
    const email = `forged.${Date.now().toString(36)}@nobody.example`;
    await page.getByLabel("E-mail address").fill(email);
    const send = page.getByRole("button", { name: "Send me a reset link" });
    await hydrated(send);
    await send.click();
    await page.getByText(`If an account exists for ${email}`).waitFor();
    await context.close();

    const { db, close } = connect(process.env.DATABASE_URL ?? "");
    try {
      const keys = (await db.execute<{ key: string }>(sql`select key from rate_limits where key like 'reset:%'`)).map(
        (r) => r.key,
      );
      expect(keys).toContain(`reset:address:${email}`);
      expect(keys).not.toContain(`reset:ip:${forged}`);
      expect(keys).toContain("reset:ip:127.0.0.1");
    } finally {
      await close();
    }
  });
});
