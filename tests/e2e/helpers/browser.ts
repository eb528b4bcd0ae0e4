import { mkdirSync } from "node:fs";
import path from "node:path";
import { chromium, type Browser, type BrowserContext, type Locator, type Page } from "playwright-core";
import { afterEach } from "vitest";

export const BASE_URL = process.env.E2E_BASE_URL ?? "";
export const ARTIFACTS = path.resolve(process.env.E2E_ARTIFACTS ?? "artifacts/e2e");

/**
 * What went wrong in any page of any browser this file launched since the last test ended: uncaught
 * errors, console errors (React's hydration errors among them) and answers of 500 or more. Each test
 * fails on them after it ends, so no page a test visits may go wrong unnoticed.
 */
const problems: string[] = [];
afterEach(() => {
  const seen = problems.splice(0);
  if (seen.length > 0) throw new Error(`the pages reported errors:\n${seen.join("\n")}`);
});

/** A refusal the test asked for (a 404 page, a locked rung's 403) is logged by Chromium as a console error. */
const REFUSAL = /^Failed to load resource: the server responded with a status of 4\d\d\b/;

function watch(page: Page): void {
  const where = () => page.url().replace(BASE_URL, "");
  page.on("pageerror", (e) => problems.push(`${where()}: uncaught ${e.message}`));
  page.on("console", (m) => {
    if (m.type() === "error" && !REFUSAL.test(m.text())) problems.push(`${where()}: console error ${m.text()}`);
  });
  page.on("response", (r) => {
    if (r.status() >= 500) problems.push(`${where()}: ${r.status()} from ${r.request().method()} ${r.url()}`);
  });
}

function watchContext(context: BrowserContext): BrowserContext {
  context.pages().forEach(watch);
  context.on("page", watch);
  return context;
}

/** Debian's Chromium (playwright gives each launch a fresh profile folder), never a downloaded browser; flags that work as root in this sandbox (STACK.md gotcha 9). Every page it opens is watched for errors (above). */
export async function launch(): Promise<Browser> {
  if (!BASE_URL) throw new Error("E2E_BASE_URL is not set: run browser tests through `npm test`");
  mkdirSync(ARTIFACTS, { recursive: true });
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
  // browser.newPage() opens its page through newContext() too.
  const newContext = browser.newContext.bind(browser);
  browser.newContext = async (options) => watchContext(await newContext(options));
  return browser;
}

export async function screenshot(page: Page, name: string): Promise<string> {
  const file = path.join(ARTIFACTS, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/**
 * Waits until React has attached to the page (app/layout.tsx's HydrationMark sets <html data-hydrated>) and to
 * this element (React keeps its fiber on the DOM nodes it has hydrated; a part of the page that streamed in
 * later is hydrated after the root). Before that a button's handler does nothing, so a test acts only after.
 */
export async function hydrated(locator: Locator): Promise<void> {
  await locator.waitFor();
  const page = locator.page();
  await page.locator("html[data-hydrated]").waitFor({ state: "attached" });
  await page.waitForFunction(
    (el) => el !== null && Object.keys(el).some((k) => k.startsWith("__reactFiber")),
    await locator.elementHandle(),
  );
}

/** Clicks a link once, when the page has hydrated, and waits for the address it leads to. */
export async function follow(page: Page, link: Locator, address: RegExp): Promise<void> {
  await hydrated(link);
  await Promise.all([page.waitForURL(address), link.click()]);
}

/** Clicks a button once, when the page has hydrated, and waits for its answer on the page. */
export async function press(button: Locator, answer: Locator): Promise<void> {
  await hydrated(button);
  await button.click();
  await answer.waitFor();
}
