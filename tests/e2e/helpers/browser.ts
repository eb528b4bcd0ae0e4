import { mkdirSync } from "node:fs";
import path from "node:path";
import { chromium, type Browser, type Page } from "playwright-core";

export const BASE_URL = process.env.E2E_BASE_URL ?? "";
export const ARTIFACTS = path.resolve(process.env.E2E_ARTIFACTS ?? "artifacts/e2e");

/** Debian's Chromium (playwright gives each launch a fresh profile folder), never a downloaded browser; flags that work as root in this sandbox (STACK.md gotcha 9). */
export async function launch(): Promise<Browser> {
  if (!BASE_URL) throw new Error("E2E_BASE_URL is not set: run browser tests through `npm test`");
  mkdirSync(ARTIFACTS, { recursive: true });
  return chromium.launch({
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
}

export async function screenshot(page: Page, name: string): Promise<string> {
  const file = path.join(ARTIFACTS, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
