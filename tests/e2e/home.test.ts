import { existsSync, statSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { BASE_URL, launch, screenshot } from "./helpers/browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("the home page and health in a real browser", () => {
  it("shows the school's offer with landmarks and a way to join, at desktop and phone widths", async () => {
    for (const [name, width] of [
      ["home-desktop", 1280],
      ["home-phone", 375],
    ] as const) {
      const page = await browser.newPage({ viewport: { width, height: 900 } });
      const errors: string[] = [];
      page.on("pageerror", (e) => errors.push(e.message));
      const response = await page.goto(BASE_URL + "/");
      expect(response?.status()).toBe(200);
      await expect(page.title()).resolves.toMatch(/Rosinwood/);
      expect(await page.locator("header").count()).toBeGreaterThan(0);
      expect(await page.locator("main").count()).toBe(1);
      expect(await page.locator("footer").count()).toBeGreaterThan(0);
      expect(await page.locator("h1").first().textContent()).toBeTruthy();
      expect(await page.locator('a[href="/sign-up"]').count()).toBeGreaterThan(0);
      // Nothing wider than the viewport: the page is usable at a phone's width.
      const scrollWidth = await page.evaluate(() => document.documentElement.scrollWidth);
      expect(scrollWidth).toBeLessThanOrEqual(width);
      const file = await screenshot(page, name);
      expect(existsSync(file) && statSync(file).size > 1000).toBe(true);
      expect(errors).toEqual([]);
      await page.close();
    }
  });

  it("answers /api/health with the database up", async () => {
    const page = await browser.newPage();
    const response = await page.goto(BASE_URL + "/api/health");
    expect(response?.status()).toBe(200);
    expect(await response?.json()).toMatchObject({ app: "ok", database: "ok" });
    await screenshot(page, "health");
    await page.close();
  });

  it("shows the not-found page for an unknown address", async () => {
    const page = await browser.newPage();
    const response = await page.goto(BASE_URL + "/no-such-page");
    expect(response?.status()).toBe(404);
    expect(await page.locator("main").textContent()).toMatch(/could not find that page/i);
    await page.close();
  });
});
