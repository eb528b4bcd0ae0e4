import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import type { Browser, Locator, Page } from "playwright-core";
import { BASE_URL, follow, launch, screenshot } from "./helpers/browser";
import { DEMO_PASSWORD, STUDENTS } from "@/db/seed-data/people";

// Issue 5's student journey in Debian's Chromium, on the demo seed: the first demo student opens a
// ladder, opens the first rung, plays it, slows it down, loops a phrase, adds a margin note and
// prints a stage; a locked rung says why; a visitor plays a taster. (Demo progress: db/seed-progress.ts.)
let browser: Browser;
let page: Page;
const requests: string[] = [];
const errors: string[] = [];
const pending = new Map<unknown, string>();

beforeAll(async () => {
  browser = await launch();
  page = await browser.newPage({ viewport: { width: 1280, height: 1000 } });
  page.on("request", (r) => requests.push(r.url()));
  page.on("pageerror", (e) => errors.push(`${page.url()}: ${e.message}`)); // the address says which page failed
  page.on("request", (r) =>
    pending.set(
      r,
      `${Date.now()} ${r.method()} ${r.url().slice(0, 160)} ${r.headers()["next-router-prefetch"] ? "prefetch" : ""}`,
    ),
  );
  page.on("requestfinished", (r) => pending.delete(r));
  page.on("requestfailed", (r) => pending.delete(r));
});
afterAll(async () => {
  await browser?.close();
});
// When a step fails, keep where the page was, what it showed, the requests still unanswered and a
// screenshot, so the failure says why.
beforeEach(({ task, onTestFailed }) => {
  onTestFailed(async () => {
    const shown = await page
      .locator("body")
      .innerText()
      .catch((e: Error) => `(no text: ${e.message})`);
    console.error(`unfinished requests at ${Date.now()}: ${JSON.stringify([...pending.values()])}`);
    console.error(
      `"${task.name}" failed at ${page.url()}; page errors: ${JSON.stringify(errors)}; the page showed: ${shown.slice(0, 600)}`,
    );
    await screenshot(page, `student-tune-failed-${task.name.slice(0, 30).replace(/\W+/g, "-")}`).catch(() => undefined);
  });
});

const player = (): Locator => page.locator("section[data-player-status]");
const attr = async (name: string): Promise<string> => (await player().getAttribute(name)) ?? "";
const waitFor = (fn: string) => page.waitForFunction(fn, undefined, { timeout: 30_000 });
const duration = async (): Promise<number> => Number(await attr("data-duration"));
/** Waits until the audio has been rebuilt (its length changed) and returns the new length. */
async function nextDuration(before: number): Promise<number> {
  await waitFor(`Number(document.querySelector("section[data-player-status]").dataset.duration) !== ${before}`);
  return duration();
}

describe("a student's ladder and tune page in a real browser", () => {
  it("signs in and finds the course among their courses", async () => {
    await page.goto(`${BASE_URL}/sign-in`);
    await page.getByLabel("E-mail address").fill(STUDENTS[0].email);
    await page.getByLabel("Password").fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`${BASE_URL}/learn`);
    await page.goto(`${BASE_URL}/learn/courses`);
    await follow(
      page,
      page.getByRole("link", { name: "Open the ladder of First Steps on the Fiddle" }),
      /\/learn\/courses\/[0-9a-f-]{36}$/,
    );
    await page.getByRole("heading", { level: 1, name: "First Steps on the Fiddle" }).waitFor();
  });

  it("shows the ladder's rungs by state, and a locked rung says which rung and stage open it", async () => {
    const states = await page
      .locator("[data-rung-state]")
      .evaluateAll((els) => els.map((e) => e.getAttribute("data-rung-state")));
    expect(states.slice(0, 3)).toEqual(["done", "inProgress", "locked"]); // the demo progress of STUDENTS[0]
    const why = page.locator("[data-rung-state=locked] [data-locked-reason]").first();
    expect(await why.textContent()).toBe(
      "Why it is locked: Opens when you reach stage 2 (Bowing) on “Hop the Puddle” (Grade 1, rung 2).",
    );
    expect(await page.locator("[data-rung-state=locked] a").count()).toBe(0); // a locked rung has no link to open
    await screenshot(page, "student-ladder");
  });

  it("opens the first rung: its stages, locked ones closed with why, and the music with its phrases", async () => {
    await follow(
      page,
      page.getByRole("link", { name: "Practise Little Biscuit Polka" }),
      /\/learn\/tunes\/[0-9a-f-]{36}/,
    );
    await page.waitForSelector('[data-notation-state="ready"] svg', { timeout: 60_000 });
    expect(await page.getByRole("radio", { name: /2\. Bowing/ }).isChecked()).toBe(true); // the furthest open stage
    const locked = page.getByRole("radio", { name: /3\. Ornaments/ });
    expect(await locked.isDisabled()).toBe(true);
    expect(await page.getByText("Opens when you have reached stage 2 (Bowing) of this tune.").first().isVisible()).toBe(
      true,
    );
    expect(await page.locator("text.rw-phrase-label").count()).toBeGreaterThan(0);
  });

  it("plays it with the fiddle samples the app serves, then slows it down", async () => {
    await page.getByRole("button", { name: "Play" }).click();
    await page.waitForSelector('section[data-player-status="playing"]', { timeout: 60_000 });
    expect(await attr("data-audio")).toBe("running");
    expect(Number(await attr("data-peak"))).toBeGreaterThan(0.01); // sound, not silence
    expect(requests.some((u) => u.startsWith(`${BASE_URL}/soundfonts/violin-mp3/`))).toBe(true);
    const full = await duration();
    await page.getByLabel(/^Speed/).fill("50");
    const slow = await nextDuration(full);
    expect(slow).toBeGreaterThan(full * 1.8); // half speed: about twice as long (abcjs adds a short fade)
    await screenshot(page, "student-tune-playing");
  });

  it("loops one phrase: a shorter audio, outlined in the music", async () => {
    const before = await duration();
    await page.getByLabel("Loop").selectOption("A1");
    const loop = await nextDuration(before);
    expect(loop).toBeLessThan(before / 3);
    expect(await page.locator('svg [data-highlight="A1"]').count()).toBe(1);
    await waitFor(`document.querySelector("section[data-player-status]").dataset.playerStatus === "playing"`);
    await page.getByRole("button", { name: "Pause" }).click();
    await page.waitForSelector('section[data-player-status="paused"]');
  });

  it("adds a margin note pinned to the bar of a clicked note, kept after a reload", async () => {
    const first = page.locator("svg .abcjs-note.abcjs-l0").first();
    await first.scrollIntoViewIfNeeded(); // the mouse clicks where the note is on screen, as a person scrolls to it
    const box = await first.boundingBox();
    if (!box) throw new Error("the first note has no box");
    await page.mouse.click(box.x + box.width / 2, box.y + box.height - 4);
    await waitFor(`document.querySelector("form[aria-label='Add note'] input[type=number]")?.value === "1"`);
    const text = `Keep the bow light here ${Date.now().toString(36)}`;
    await page.getByLabel("Note", { exact: true }).fill(text);
    await page.getByRole("button", { name: "Add note" }).click();
    await page.locator("[data-note-bar='1']", { hasText: text }).waitFor();
    await screenshot(page, "student-margin-note");
    await page.reload();
    await page.locator("[data-note-bar='1']", { hasText: text }).waitFor({ timeout: 30_000 });
    // The form checks the note before sending it: an empty one is refused with a message.
    await page.getByRole("button", { name: "Add note" }).click();
    await page.getByText("Write something in the note.").waitFor();
  });

  it("compares the stage with another setting pasted in, bar by bar", async () => {
    // Another player's version: the stage on screen with bar 1's last note moved down a step.
    const tuneId = new URL(page.url()).pathname.split("/").pop() ?? "";
    const abc = await page.evaluate(
      async (id) => ((await (await fetch(`/api/tunes/${id}/stages/2`)).json()) as { abc: string }).abc,
      tuneId,
    );
    const other = abc.replace(/^(\|: .*?GB) \|/m, (_, head: string) => `${head.slice(0, -1)}A |`);
    expect(other).not.toBe(abc);
    await page.getByLabel("Another setting of this tune, in ABC").fill(other);
    await page.getByRole("button", { name: "Compare with stage 2" }).click();
    await page.locator("[data-compare-different]").waitFor();
    expect(await page.locator("[data-compare-different]").getAttribute("data-compare-different")).toBe("1");
    expect(await page.getByText(/^Part A, bar 1: 1 difference/).isVisible()).toBe(true);
    expect(await page.getByText(/this stage plays B4 .*, the other setting A4/).isVisible()).toBe(true);
    await screenshot(page, "student-compare");
  });

  it("opens the print view of an open stage: music only on paper", async () => {
    await page.waitForSelector('[data-notation-state="ready"] svg', { timeout: 60_000 });
    await follow(page, page.getByRole("link", { name: /^Print view of stage 2/ }), /\/print\?stage=2$/);
    await page.waitForSelector('[data-notation-state="ready"] svg', { timeout: 60_000 });
    expect(await page.getByText("Stage: 2. Bowing").isVisible()).toBe(true);
    await page.emulateMedia({ media: "print" });
    expect(await page.locator("body > header").isVisible()).toBe(false);
    expect(await page.getByRole("button", { name: "Print this stage" }).isVisible()).toBe(false);
    expect(await page.locator("figure svg").isVisible()).toBe(true);
    await screenshot(page, "student-print");
    await page.emulateMedia({ media: "screen" });
    // A locked stage has no print view: the page says why instead.
    await page.goto(page.url().replace(/stage=2$/, "stage=4"));
    await page.getByText("This stage is not open to you yet").waitFor();
    expect(await page.locator("figure svg").count()).toBe(0);
  });

  it("lets a visitor browse the catalogue and play a taster's core melody, the rest closed with why", async () => {
    const visitor = await browser.newPage({ viewport: { width: 1280, height: 1000 } }); // a fresh context: no session
    visitor.on("request", (r) => requests.push(r.url()));
    visitor.on("pageerror", (e) => errors.push(`visitor at ${visitor.url()}: ${e.message}`)); // whose page, and which
    // Which scripts each page loads: abcjs (its "abcjs-" class names) only where music is drawn.
    const scripts: Promise<string>[] = [];
    visitor.on("response", (r) => void (r.url().endsWith(".js") && scripts.push(r.text())));
    const abcjsLoaded = async () => (await Promise.all(scripts)).some((t) => t.includes("abcjs-note"));
    await visitor.goto(`${BASE_URL}/catalogue`);
    await visitor.waitForLoadState("load");
    for (const title of ["First Steps on the Fiddle", "Tunes for the Dance Floor", "Ready for the Session"]) {
      expect(await visitor.getByRole("heading", { level: 2, name: title }).isVisible()).toBe(true);
    }
    expect(await visitor.getByText("Evening at Thornsby Weir").isVisible()).toBe(true); // tune titles of locked rungs are listed
    expect(await abcjsLoaded()).toBe(false);
    await screenshot(visitor, "catalogue");
    await follow(
      visitor,
      visitor.getByRole("link", { name: /Little Biscuit Polka/ }),
      /\/catalogue\/tunes\/[0-9a-f-]{36}/,
    );
    await visitor.waitForSelector('[data-notation-state="ready"] svg', { timeout: 60_000 });
    expect(await visitor.getByRole("radio", { name: /1\. Skeleton/ }).isChecked()).toBe(true);
    expect(await visitor.getByRole("radio", { name: /2\. Bowing/ }).isDisabled()).toBe(true);
    expect(
      await visitor
        .getByText(/join the school to learn it stage by stage/)
        .first()
        .isVisible(),
    ).toBe(true);
    expect(await visitor.getByRole("button", { name: "Play" }).isEnabled()).toBe(true);
    expect(await abcjsLoaded()).toBe(true); // the same check sees abcjs where the music is drawn
    await screenshot(visitor, "catalogue-taster");
    await visitor.close();
  });

  it("asked nothing of any address but the app's own, and raised no page errors", () => {
    expect(requests.length).toBeGreaterThan(0);
    expect(requests.filter((u) => !u.startsWith(BASE_URL))).toEqual([]);
    expect(errors).toEqual([]);
  });
});
