import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { ADMIN, DEMO_PASSWORD, STUDENTS, TEACHERS } from "@/db/seed-data/people";
import { BASE_URL, launch, screenshot } from "./helpers/browser";

// The demo school as a newcomer meets it: each demo sign-in lands on a page with something to do; the
// first student's Today has assignments, a streak, feedback and a chart; the first teacher's review
// queue holds check-ins whose recordings play in the browser, with the listening aid's bar strip.
let browser: Browser;
const contexts: BrowserContext[] = [];
const errors: string[] = [];

async function signedIn(email: string, home: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 1000 } });
  contexts.push(context);
  const page = await context.newPage();
  page.on("pageerror", (e) => errors.push(`${email} ${new URL(page.url()).pathname}: ${e.message}`));
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${BASE_URL}${home}`);
  return page;
}

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  for (const c of contexts) await c.close();
  await browser?.close();
});

describe("the demo school in mid-term", () => {
  it("greets the first student with assignments (one overdue), a live streak, feedback and practice", async () => {
    const page = await signedIn(STUDENTS[0].email, "/learn");
    const list = page.getByRole("list", { name: "Assignments" });
    await list.waitFor();
    expect(await list.locator(":scope > li").count()).toBeGreaterThanOrEqual(2);
    await list
      .getByText(/overdue/i)
      .first()
      .waitFor();
    await expect(page.getByTestId("streak").textContent()).resolves.toMatch(/^\d+ days in a row/);
    expect(await page.getByText("No feedback yet").count()).toBe(0);
    await page.getByText(/Bars 2 to 5 run ahead of the beat/).waitFor(); // the teacher's "needs more time"
    const bars = await page.getByTestId("minutes-chart").locator("svg .recharts-bar-rectangle").count();
    expect(bars).toBeGreaterThan(10);
    await screenshot(page, "demo-01-student-today");
  });

  it("lands each teacher on the roster with check-ins waiting, and the first one's queue plays recordings", async () => {
    const isla = await signedIn(TEACHERS[0].email, "/teach");
    await expect(isla.getByRole("link", { name: /^Review queue/ }).textContent()).resolves.toMatch(/ · \d+ waiting$/);
    await screenshot(isla, "demo-02-teacher-roster");
    for (const t of TEACHERS.slice(1)) {
      const page = await signedIn(t.email, "/teach");
      await expect(page.getByRole("link", { name: /^Review queue/ }).textContent(), t.name).resolves.toMatch(
        /\d+ waiting$/,
      );
      await page.context().close();
    }
    await isla.goto(`${BASE_URL}/teach/review`);
    const cards = isla.getByRole("list", { name: "Check-ins waiting" }).locator(":scope > li");
    await cards.first().waitFor();
    expect(await cards.count()).toBeGreaterThanOrEqual(5);
    // Playable: the browser reads each recording's header and knows its length (the takes run 20–40 s).
    for (const audio of await isla.locator("li audio").all()) {
      const seconds = await audio.evaluate(
        (el) =>
          new Promise<number>((resolve, reject) => {
            const a = el as HTMLAudioElement;
            if (a.readyState >= 1) return resolve(a.duration);
            a.addEventListener("loadedmetadata", () => resolve(a.duration), { once: true });
            a.addEventListener("error", () => reject(new Error(`audio error ${a.error?.code ?? "?"}`)), { once: true });
            a.load();
          }),
      );
      expect(seconds).toBeGreaterThan(15);
      expect(seconds).toBeLessThan(60);
    }
    // The worker heard them when it started: every card shows the aid's strip and summary.
    // The worker heard them when it started; the queue asks again by itself while one is still being heard.
    const count = await cards.count();
    await expect.poll(() => isla.locator("[data-testid=bar-strip]").count(), { timeout: 90_000 }).toBe(count);
    await expect(isla.getByTestId("listening-summary").first().textContent()).resolves.toMatch(/bpm/);
    await screenshot(isla, "demo-03-review-queue");
  });

  it("lands the admin on people with the school's members listed", async () => {
    const page = await signedIn(ADMIN.email, "/admin/people");
    await page.getByRole("cell", { name: STUDENTS[0].name }).first().waitFor();
    expect(errors).toEqual([]);
  });
});
