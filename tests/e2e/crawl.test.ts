// Every page the navigation leads to, for each role: the header's links, and the links on those pages
// one step further (one page per kind of address). None may log an error or throw in the browser (the
// helper's watch fails the test on those, hydration errors included) or answer 500, and none may have
// a serious or critical accessibility violation as axe-core finds them (WCAG 2.2 A and AA, and axe's
// best practices; an unlabelled form control is critical).
import AxeBuilder from "@axe-core/playwright";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { BASE_URL, launch } from "./helpers/browser";
import { ADMIN, DEMO_PASSWORD, STUDENTS, TEACHERS } from "@/db/seed-data/people";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const ROLES = [
  { role: "visitor", email: null, home: "/" },
  { role: "student", email: STUDENTS[0].email, home: "/learn" },
  { role: "teacher", email: TEACHERS[0].email, home: "/teach" },
  { role: "admin", email: ADMIN.email, home: "/admin/people" },
] as const;

/** Addresses the crawl leaves alone: route handlers (downloads, feeds), the development pages, Next's files. */
const SKIP = /^\/(api|dev|_next)(\/|$)/;

/** One page per kind of address: ids and queries do not make a new kind. */
const kindOf = (path: string) => path.replace(/[0-9a-f]{8}-[0-9a-f-]{27}/g, ":id");

/** The page's own links (not downloads), as paths on this site. */
async function linksOn(page: Page): Promise<string[]> {
  const hrefs = await page
    .locator("a[href]:not([download])")
    .evaluateAll((as) => as.map((a) => (a as HTMLAnchorElement).href));
  return hrefs
    .map((h) => new URL(h))
    .filter((u) => u.origin === new URL(BASE_URL).origin && !SKIP.test(u.pathname))
    .map((u) => u.pathname + u.search);
}

/** Opens a page and waits until React has attached and the page's own requests have been answered. */
async function visit(page: Page, path: string): Promise<void> {
  const response = await page.goto(`${BASE_URL}${path}`);
  expect(response?.status(), path).toBeLessThan(400);
  await page.locator("html[data-hydrated]").waitFor({ state: "attached" });
  await page.waitForLoadState("networkidle");
}

/** axe-core's serious and critical violations on the page as it is now, one line each with where. */
async function accessibilityProblems(page: Page): Promise<string[]> {
  const { violations } = await new AxeBuilder({ page }).analyze();
  return violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map(
      (v) =>
        `${new URL(page.url()).pathname}: ${v.id} (${v.impact}) at ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`,
    );
}

describe("every page the navigation leads to, for each role", () => {
  for (const { role, email, home } of ROLES) {
    it(`${role}: no page error, console error, server error or serious accessibility violation`, async () => {
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
      const page = await context.newPage();
      if (email) {
        await page.goto(`${BASE_URL}/sign-in`);
        await page.getByLabel("E-mail address").fill(email);
        await page.getByLabel("Password").fill(DEMO_PASSWORD);
        await page.getByRole("button", { name: "Sign in" }).click();
        await page.waitForURL(`${BASE_URL}${home}`);
      } else {
        await visit(page, home);
      }
      const nav = await page
        .getByRole("navigation", { name: "Main" })
        .locator("a[href]")
        .evaluateAll((as) => as.map((a) => new URL((a as HTMLAnchorElement).href).pathname));
      expect(nav.length).toBeGreaterThan(2);

      const seen = new Set<string>();
      const visited: string[] = [];
      const inaccessible: string[] = [];
      const queue = [home, ...nav];
      for (let depth = 0; depth < 2; depth++) {
        const next: string[] = [];
        for (const path of queue.splice(0)) {
          if (seen.has(kindOf(path.split("?")[0]))) continue;
          seen.add(kindOf(path.split("?")[0]));
          await visit(page, path);
          visited.push(path);
          inaccessible.push(...(await accessibilityProblems(page)));
          if (depth === 0) next.push(...(await linksOn(page)));
        }
        queue.push(...next);
      }
      // Each area has more pages than its header links (detail pages reached from them).
      expect(visited.length).toBeGreaterThan(nav.length);
      expect(inaccessible).toEqual([]);
      await context.close();
    }, 600_000);
  }
});
