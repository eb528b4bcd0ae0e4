import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator, Page } from "playwright-core";
import { BASE_URL, launch, screenshot } from "./helpers/browser";

// The music components on their development page (app/dev/notation), in Debian's Chromium.
// The page needs DEMO_DEV_PAGES=true when the app runs with NODE_ENV=production.
let browser: Browser;
let page: Page;
const requests: string[] = [];
const failedSamples: string[] = [];
const errors: string[] = [];

beforeAll(async () => {
  browser = await launch();
  page = await browser.newPage({ viewport: { width: 1280, height: 1000 } });
  page.on("request", (r) => requests.push(r.url()));
  page.on("response", (r) => {
    if (r.url().includes("/soundfonts/") && r.status() !== 200) failedSamples.push(`${r.status()} ${r.url()}`);
  });
  page.on("pageerror", (e) => errors.push(e.message));
  const response = await page.goto(`${BASE_URL}/dev/notation`);
  expect(response?.status()).toBe(200);
  await page.waitForSelector('[data-notation-state="ready"] svg', { timeout: 60_000 });
});
afterAll(async () => {
  await browser?.close();
});

const player = (): Locator => page.locator("section[data-player-status]");
const attr = async (name: string): Promise<string> => (await player().getAttribute(name)) ?? "";
const waitFor = (fn: string, arg?: unknown) => page.waitForFunction(fn, arg, { timeout: 30_000 });
const duration = async (): Promise<number> => Number(await attr("data-duration"));

/** Waits until the audio has been rebuilt (its length changed) and returns the new length. */
async function nextDuration(before: number): Promise<number> {
  await waitFor(`Number(document.querySelector("section[data-player-status]").dataset.duration) !== ${before}`);
  return duration();
}

// The demo tune: 4/4 reel, Q:1/4=100, two 8-bar parts each played twice (app/dev/notation/demo-tune.ts).
const BAR_SECONDS = 2.4; // 4 quarter notes at 100 a minute
const FADE = 0.2; // abcjs adds its default 200 ms fade to the end of the audio (create-synth.js)

describe("the music components in a real browser", () => {
  it("draws the notation with the phrase map labelled in words, not colour alone", async () => {
    expect(await page.locator("figure svg").count()).toBe(1);
    const labels = await page.locator("text.rw-phrase-label").allTextContents();
    expect(labels.length).toBe(8); // 2 parts × 4 two-bar phrases
    expect(labels).toContain("A1 · a");
    expect(labels.some((l) => l.startsWith("A2 · a′") && /like A1 but 1 note|≈ A1/.test(l))).toBe(true);
    expect(labels.some((l) => l.startsWith("A3 · a") && /same as A1|= A1/.test(l))).toBe(true);
    expect(labels.some((l) => l.startsWith("B4 · b") && /same as A4|= A4/.test(l))).toBe(true);
    expect(await page.locator("figcaption li").first().textContent()).toMatch(/^A1 · a, bars 1–2/);
    await screenshot(page, "notation-desktop");
  });

  it("shows locked stages closed, with the reason, and switches open ones", async () => {
    const locked = page.getByRole("radio", { name: /Full setting/ });
    expect(await locked.isDisabled()).toBe(true);
    expect(await page.getByText("Opens when your teacher signs off").isVisible()).toBe(true);
    expect(await page.locator("svg .abcjs-slur").count()).toBe(0); // the skeleton has no slurs
    await page.getByText("2. Bowing").click();
    await waitFor(`document.querySelectorAll("svg .abcjs-slur").length > 0`);
    await page.waitForSelector('[data-notation-state="ready"] text.rw-phrase-label');
  });

  it("reports the bar of a clicked note by the phrase map's numbering, by mouse and by keyboard", async () => {
    // abcjs picks the element nearest the pointer, so click inside the first note's own box.
    const box = await page.locator("svg .abcjs-note.abcjs-l0").first().boundingBox();
    if (!box) throw new Error("the first note has no box");
    await page.mouse.click(box.x + box.width / 2, box.y + box.height - 4);
    await waitFor(`document.querySelector("[data-clicked-bar]").dataset.clickedBar === "1"`);
    // Bar 1 of the bowing stage holds six notes (A2 (FA) d2 fd), so the seventh opens bar 2.
    await page.locator("svg .abcjs-note.abcjs-l0").nth(6).focus();
    await page.keyboard.press("Enter");
    await waitFor(`document.querySelector("[data-clicked-bar]").dataset.clickedBar === "2"`);
  });

  it("plays with the fiddle samples served by the app", async () => {
    await page.getByRole("button", { name: "Play" }).click();
    await page.waitForSelector('section[data-player-status="playing"]', { timeout: 60_000 });
    expect(await attr("data-audio")).toBe("running");
    expect(Number(await attr("data-peak"))).toBeGreaterThan(0.01); // the buffer holds sound, not silence
    // Count-in bar + 32 bars (both parts repeated) at 100%.
    expect(await duration()).toBeCloseTo(33 * BAR_SECONDS + FADE, 1);
    expect(requests.some((u) => u.includes("/soundfonts/violin-mp3/"))).toBe(true);
    expect(requests.some((u) => u.includes("/soundfonts/percussion-mp3/"))).toBe(true);
    expect(failedSamples).toEqual([]);
    // The samples are FluidR3 GM's, credited beside the player with its licence (Debian's fluid-soundfont-gm: MIT).
    const credit = page.getByRole("link", { name: "MIT licence" });
    expect(await page.getByText("Fiddle sound rendered from the FluidR3 GM soundfont").isVisible()).toBe(true);
    const licence = await page.request.get(new URL((await credit.getAttribute("href")) ?? "", BASE_URL).toString());
    expect(licence.status()).toBe(200);
    expect(await licence.text()).toContain("I hereby release Fluid under the MIT license");
    await screenshot(page, "notation-playing");
  });

  it("changes speed: half speed makes the audio twice as long", async () => {
    const before = await duration();
    await page.getByLabel(/^Speed/).fill("50");
    expect(await page.locator("output").first().textContent()).toBe("50%");
    const after = await nextDuration(before);
    expect(after - FADE).toBeCloseTo((before - FADE) * 2, 1);
    await waitFor(`document.querySelector("section[data-player-status]").dataset.playerStatus === "playing"`);
  });

  it("loops one phrase: exactly its bars, outlined in the music, started again at the end", async () => {
    const before = await duration();
    await page.getByLabel(/^Speed/).fill("120");
    await nextDuration(before);
    const whole = await duration();
    await page.getByLabel("Loop").selectOption("A1");
    const loop = await nextDuration(whole);
    expect(loop).toBeCloseTo(((1 + 2) * BAR_SECONDS) / 1.2 + FADE, 1); // count-in + the phrase's 2 bars
    expect(await page.locator('svg [data-highlight="A1"]').count()).toBe(1);
    await page.getByLabel("Count in one bar").uncheck();
    expect(await nextDuration(loop)).toBeCloseTo((2 * BAR_SECONDS) / 1.2 + FADE, 1);
    await waitFor(`document.querySelector("section[data-player-status]").dataset.playerStatus === "playing"`);
    await page.waitForTimeout(5_500); // past the end of the 4 s phrase: still playing, so it looped
    expect(await attr("data-player-status")).toBe("playing");
    await screenshot(page, "notation-loop");
    await page.getByRole("button", { name: "Pause" }).click();
    await page.waitForSelector('section[data-player-status="paused"]');
  });

  it("memory mode hides phrases one at a time and shows them again", async () => {
    await page.getByRole("button", { name: "Hide next phrase (A1)" }).click();
    await page.waitForSelector('svg [data-hidden-phrase="A1"]');
    expect(await page.locator('svg [data-hidden-phrase="A1"] text').first().textContent()).toBe("play from memory");
    await page.getByRole("button", { name: "Hide next phrase (A2)" }).click();
    await page.waitForSelector('svg [data-hidden-phrase="A2"]');
    expect(await page.getByText("2 of 8 phrases hidden").isVisible()).toBe(true);
    await screenshot(page, "notation-memory");
    await page.getByRole("button", { name: "Show all" }).click();
    await waitFor(`document.querySelectorAll("svg [data-hidden-phrase]").length === 0`);
  });

  it("print view: the music without the site's header, menus or buttons on paper", async () => {
    const response = await page.goto(`${BASE_URL}/dev/notation/print?stage=2`);
    expect(response?.status()).toBe(200);
    await page.waitForSelector('[data-notation-state="ready"] svg', { timeout: 60_000 });
    expect(await page.getByRole("button", { name: "Print this stage" }).isVisible()).toBe(true);
    expect(await page.getByText("Stage: Bowing").isVisible()).toBe(true);
    await page.emulateMedia({ media: "print" });
    expect(await page.locator("body > header").isVisible()).toBe(false);
    expect(await page.getByRole("button", { name: "Print this stage" }).isVisible()).toBe(false);
    expect(await page.locator("figure svg").isVisible()).toBe(true);
    await screenshot(page, "notation-print");
    await page.emulateMedia({ media: "screen" });
    // A locked stage has no print view (the not-found page; its status may be 200 once streaming began).
    await page.goto(`${BASE_URL}/dev/notation/print?stage=4`);
    await page.getByText(/could not find that page/i).waitFor();
    expect(await page.locator("figure svg").count()).toBe(0);
  });

  it("fits a phone's width, two bars to a line, with the labels still there", async () => {
    const phone = await browser.newPage({ viewport: { width: 375, height: 800 } });
    phone.on("request", (r) => requests.push(r.url()));
    await phone.goto(`${BASE_URL}/dev/notation`);
    await phone.waitForSelector('[data-notation-state="ready"] text.rw-phrase-label', { timeout: 60_000 });
    expect(await phone.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(375);
    expect(await phone.locator("svg .abcjs-staff").count()).toBe(8); // 16 bars, 2 to a line
    expect(await phone.locator("text.rw-phrase-label").count()).toBe(8);
    await screenshot(phone, "notation-phone");
    await phone.close();
  });

  it("asked nothing of any address but the app's own, and raised no page errors", () => {
    expect(requests.length).toBeGreaterThan(0);
    expect(requests.filter((u) => !u.startsWith(BASE_URL))).toEqual([]);
    expect(errors).toEqual([]);
  });
});
