import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { TEACHERS, DEMO_PASSWORD } from "@/db/seed-data/people";
import { BASE_URL, launch, screenshot } from "./helpers/browser";

// Issue 5's teacher journey in Debian's Chromium: write a tune with a mistake, see the problem at
// its line, fix it, adjust the stage plan, accept a twin swap, and put the tune on a course.
const run = Date.now().toString(36);
const TITLE = `Saltmarsh Rise ${run}`;
// An invented reel. Bar 6 ends "BcAB" where bar 2 ends "BcAF": phrase A3 is a near twin of A1.
const TUNE = `X:1
T:${TITLE}
R:reel
M:4/4
L:1/8
K:G
|:(GA)Bd gdBd|~c2ec BcAF|(GA)Bd gdBd|c2AF G4|
(GA)Bd gdBd|~c2ec BcAB|(3cBA GE D2FA|c2AF G4:|
|:gfga bgdB|c2ec BcAF|gfga bgdB|c2AF G4|
gfga bgdg|!f!e2ce dBAF|(3GAB cA BGAF|c2AF G4:|
`;
// '#' alone is not ABC music code (ABC 2.1 §4: sharps are written ^ before the note).
const MISTAKE = TUNE.replace("|:gfga bgdB|c2ec BcAF|", "|:gfga bgdB|c2ec B#cAF|");
const MISTAKE_AT = { line: 9, column: MISTAKE.split("\n")[8].indexOf("#") + 1 };

let browser: Browser;
let page: Page;
const errors: string[] = [];
const offsite: string[] = [];
let tuneUrl = "";

beforeAll(async () => {
  browser = await launch();
  page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  page.on("pageerror", (e) => errors.push(`${new URL(page.url()).pathname}: ${e.message}`));
  page.on("request", (r) => {
    if (!r.url().startsWith(BASE_URL) && !r.url().startsWith("data:") && !r.url().startsWith("blob:"))
      offsite.push(r.url());
  });
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel("E-mail address").fill(TEACHERS[0].email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/teach/);
});
afterAll(async () => {
  await browser?.close();
});

const source = () => page.locator("#abc-source");
/**
 * Opens a page and waits until React has taken over `selector`'s element (React keeps its fiber on
 * hydrated DOM nodes under a "__reactFiber" key), so typing is never raced against hydration.
 */
async function open(path: string, selector: string): Promise<void> {
  await page.goto(`${BASE_URL}${path}`);
  await page.waitForFunction((sel) => {
    const el = document.querySelector(sel);
    return el !== null && Object.keys(el).some((k) => k.startsWith("__reactFiber"));
  }, selector);
}

describe("a teacher writes a tune and puts it on a course", () => {
  it("shows a mistake at its line and column as the teacher types, and the server refuses it too", async () => {
    await open("/teach/tunes/new", "#abc-source");
    // The template has no notes yet: the first check's answer shows the engine runs in the page.
    await page.getByText("The tune has no notes.").waitFor({ timeout: 30_000 });
    await source().fill(MISTAKE);
    const problem = page.getByTestId("abc-problems").getByRole("button", {
      name: new RegExp(`Line ${MISTAKE_AT.line}, column ${MISTAKE_AT.column}: Unknown character ignored: "#"`),
    });
    await problem.waitFor({ timeout: 30_000 });
    // Choosing the problem puts the caret on it.
    await problem.click();
    expect(await page.locator("#abc-caret").textContent()).toBe(
      `Caret at line ${MISTAKE_AT.line}, column ${MISTAKE_AT.column}`,
    );
    await page.waitForSelector('[data-notation-state="ready"] svg', { timeout: 60_000 });
    await screenshot(page, "teacher-tune-mistake");
    await page.getByRole("button", { name: "Save the new tune" }).click();
    const refused = page.getByTestId("save-problems");
    await refused.waitFor();
    expect(await refused.textContent()).toBe(
      `Line ${MISTAKE_AT.line}, column ${MISTAKE_AT.column}: Unknown character ignored: "#"`,
    );
    expect(new URL(page.url()).pathname).toBe("/teach/tunes/new"); // nothing was saved
  });

  it("names a missing K: line as such, and a bar of ten eighths as a note by its bar number", async () => {
    await source().fill(TUNE.replace("K:G\n", ""));
    await page
      .getByTestId("abc-problems")
      .getByRole("button", { name: /Line 6, column 1: The tune has no K: line/ })
      .waitFor({ timeout: 30_000 });
    expect(await page.getByTestId("abc-problems").textContent()).not.toMatch(/title/);
    // bar 3 gets two more eighths: a note with its bar number, and the tune can still be saved
    await source().fill(TUNE.replace("|(GA)Bd gdBd|c2AF G4|", "|(GA)Bd gdBdBd|c2AF G4|"));
    const note = page.getByTestId("abc-notes").getByRole("button", {
      name: /Note, line 7, column \d+: Bar 3 lasts 10 eighths, but M:4\/4 makes a bar of 8 eighths/,
    });
    await note.waitFor({ timeout: 30_000 });
    expect(await page.getByTestId("abc-problems").count()).toBe(0);
    await page.getByText("1 note on the ABC: the tune can be saved as it is.").waitFor();
  });

  it("merges a stage of the default plan the tune would repeat, and says so", async () => {
    // without its slurs the tune has no bowing: the "Bowing" stage would be the skeleton again
    await source().fill(TUNE.replace(/\(GA\)/g, "GA"));
    const fit = page.getByTestId("plan-fit");
    await fit.waitFor({ timeout: 30_000 });
    expect(await fit.textContent()).toMatch(/the default plan makes 3 stages .*“Bowing” would repeat the music before/);
    expect(await page.locator("article[data-stage]").count()).toBe(3);
    expect(await page.getByTestId("stage-2-merged").textContent()).toMatch(/“Bowing” stage is taken into this one/);
  });

  it("clears the problem once fixed and reads the facts from the ABC", async () => {
    await source().fill(TUNE);
    await page.getByText("No problems found in the ABC.").waitFor({ timeout: 30_000 });
    expect(await page.locator('[data-fact="type"]').textContent()).toBe("reel");
    expect(await page.locator('[data-fact="key"]').textContent()).toBe("G");
    expect(await page.locator('[data-fact="meter"]').textContent()).toBe("4/4");
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(TITLE);
    expect(await page.locator("article[data-stage]").count()).toBe(4);
    expect(await page.getByTestId("plan-fit").count()).toBe(0);
  });

  it("adjusts the stage plan: slides come back at stage 2, with the plan's reasons shown on the way", async () => {
    await page.getByLabel("Slides added back at stage 3").uncheck();
    const reasons = page.getByTestId("plan-reasons");
    await reasons.waitFor();
    expect(await reasons.textContent()).toContain('Kind "slides" is never added back');
    await page.getByLabel("Slides added back at stage 2").check();
    await reasons.waitFor({ state: "detached" });
    await page.getByLabel("Name of stage 2").fill("Bowing and slides");
    await page.getByRole("heading", { name: "Stage 2: Bowing and slides" }).waitFor();
    expect(await page.locator("article[data-stage]").count()).toBe(4);
  });

  it("previews the twin swap A3 → A1, accepts it and saves the tune", async () => {
    await page.getByRole("button", { name: "Preview A3 swapped" }).click();
    await page.locator('figure svg[aria-label="Preview: A3 played like A1"]').waitFor({ timeout: 30_000 });
    await page.getByLabel(/Play A3 like A1 while learning/).check();
    await page.getByText("Learning version (1 swap accepted)").waitFor();
    expect(await page.getByTestId("learning-load").textContent()).toMatch(
      /8 distinct.*7 if every near twin is swapped; 7 with the 1 swap you accepted/,
    );
    await screenshot(page, "teacher-tune-swaps");
    await page.getByRole("button", { name: "Save the new tune" }).click();
    await page.waitForURL(/\/teach\/tunes\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    tuneUrl = page.url();
    await page.getByText("All changes saved.").waitFor({ timeout: 30_000 });
    const stored = await page.evaluate(
      async (id) => (await fetch(`/api/teach/tunes/${id}`)).json(),
      tuneUrl.split("/").pop(),
    );
    expect(stored.acceptedSwaps).toEqual(["A3"]);
    expect(stored.stagePlan.stages[1]).toEqual({ name: "Bowing and slides", adds: ["bowing", "slides"] });
    expect(stored.stages.map((s: { index: number }) => s.index)).toEqual([1, 2, 3, 4]);
    await page.waitForSelector('article[data-stage="4"] [data-notation-state="ready"] svg', { timeout: 60_000 });
    await screenshot(page, "teacher-tune-saved");
  });

  it("adds the tune to a new course, moves it with the Move buttons and by dragging, and publishes", async () => {
    await open("/teach/courses", "#title");
    await page.getByLabel("New course").fill(`Coastal reels ${run}`);
    await page.getByRole("button", { name: "Start a course" }).click();
    await page.waitForURL(/\/teach\/courses\/[0-9a-f-]{36}$/);
    await page.getByRole("button", { name: "Add a grade" }).click();
    const addForm = page.getByRole("form", { name: "Add a rung to Grade 1" });
    await addForm.waitFor();
    const tuneSelect = addForm.getByLabel("Tune", { exact: true });
    await page.waitForFunction(() => document.querySelectorAll("form select option").length > 1);
    await tuneSelect.selectOption({ label: `${TITLE} (reel, G)` });
    await addForm.getByLabel("Stage that opens the next rung").selectOption("2");
    await addForm.getByRole("button", { name: "Add to Grade 1" }).click();
    await page.locator(`li[data-rung="${TITLE}"]`).waitFor();
    // A second rung, one of the demo tunes, then the new tune moved above it with the Move up button.
    const other = await tuneSelect.locator("option").nth(1).textContent();
    await tuneSelect.selectOption({ index: 1 });
    await addForm.getByRole("button", { name: "Add to Grade 1" }).click();
    await page.locator("li[data-rung]").nth(1).waitFor();
    const titles = () =>
      page.locator("li[data-rung]").evaluateAll((els) => els.map((e) => e.getAttribute("data-rung")));
    expect(await titles()).toEqual([TITLE, other?.replace(/ \([^()]*\)$/, "")]);
    const down = page.getByRole("button", { name: `Move ${TITLE} down` });
    await down.focus();
    await page.keyboard.press("Enter");
    await page.waitForFunction(
      (t) => document.querySelectorAll("li[data-rung]")[1]?.getAttribute("data-rung") === t,
      TITLE,
    );
    // And back to the top by dragging its grip with the mouse.
    const grip = await page.getByRole("button", { name: `Drag rung 2, ${TITLE}` }).boundingBox();
    const top = await page.getByRole("button", { name: /^Drag rung 1, / }).boundingBox();
    if (!grip || !top) throw new Error("no grips to drag");
    await page.mouse.move(grip.x + grip.width / 2, grip.y + grip.height / 2);
    await page.mouse.down();
    await page.mouse.move(grip.x + grip.width / 2, grip.y + grip.height / 2 - 10, { steps: 4 });
    await page.mouse.move(top.x + top.width / 2, top.y + top.height / 2 - 10, { steps: 12 });
    await page.mouse.up();
    await page.waitForFunction(
      (t) => document.querySelectorAll("li[data-rung]")[0]?.getAttribute("data-rung") === t,
      TITLE,
    );
    await page.getByRole("button", { name: "Publish the course" }).click();
    await page
      .getByTestId("publish-state")
      .filter({ hasText: /^Published$/ })
      .waitFor();
    await screenshot(page, "teacher-ladder-bench");
    const courseId = page.url().split("/").pop();
    const stored = await page.evaluate(async (id) => (await fetch(`/api/teach/courses/${id}`)).json(), courseId);
    expect(stored.published).toBe(true);
    expect(
      stored.grades[0].rungs.map((r: { tuneTitle: string; requiredStage: number }) => [
        r.tuneTitle,
        r.requiredStage,
      ])[0],
    ).toEqual([TITLE, 2]);
  });

  it("imports a file: the progress bar fills as each tune is reported, and the bad tune shows its line in the file", async () => {
    await open("/teach/import", "#abc-file");
    const file = `${TUNE.replace(TITLE, `${TITLE} (import)`)}\n${MISTAKE.replace(TITLE, `${TITLE} (broken)`).replace("X:1", "X:2")}`;
    await page
      .getByLabel("ABC file")
      .setInputFiles({ name: "coastal.abc", mimeType: "text/plain", buffer: Buffer.from(file) });
    await page.getByRole("button", { name: "Import the tunes" }).click();
    await page.getByTestId("import-summary").waitFor({ timeout: 60_000 });
    expect(await page.getByTestId("import-summary").textContent()).toBe(
      "1 saved, 0 already in your tunes, 1 with problems.",
    );
    expect(
      await page
        .locator("#import-progress")
        .evaluate((el) => [(el as HTMLProgressElement).value, (el as HTMLProgressElement).max]),
    ).toEqual([2, 2]);
    const bad = page.locator('[data-import-status="problems"]');
    // The broken tune starts on line 12 of the file, so its line 9 is the file's line 20.
    expect(await bad.textContent()).toContain(
      `Line ${11 + MISTAKE_AT.line}, column ${MISTAKE_AT.column}: Unknown character ignored: "#"`,
    );
    await screenshot(page, "teacher-import");
  });

  it("lists the note each double stop keeps until double stops come back; a bar turned to its other note is saved", async () => {
    await open("/teach/tunes/new", "#abc-source");
    // an invented reel: the open A rings above the tune's F♯ in both bars
    await source().fill(`X:1\nT:Drone Field ${run}\nR:reel\nM:4/4\nL:1/8\nK:D\n|:d2 [FA]2 E2 D2|A2 [FA]2 E2 D2:|\n`);
    const list = page.getByTestId("double-stops");
    await list.waitFor({ timeout: 30_000 });
    await list.locator("summary").click();
    expect(await list.locator('li[data-bar="0"]').textContent()).toContain(
      "Bar 1: keeps F♯4, not A4 — the open A string rings beside it",
    );
    await list.getByRole("button", { name: "Keep the upper note in bar 2" }).click();
    await list
      .locator('li[data-bar="1"]')
      .filter({ hasText: "Bar 2: keeps A4, not F♯4 — turned by you" })
      .waitFor({ timeout: 30_000 });
    await page.getByRole("button", { name: "Save the new tune" }).click();
    await page.waitForURL(/\/teach\/tunes\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    await page.getByText("All changes saved.").waitFor({ timeout: 30_000 });
    const stored = await page.evaluate(
      async (id) => (await fetch(`/api/teach/tunes/${id}`)).json(),
      page.url().split("/").pop(),
    );
    expect(stored.turnedBars).toEqual({ "1": "upper" });
    expect(stored.stages[0].abc).toContain("|:d2 F2 E2 D2|A2 A2 E2 D2:|");
  });

  it("asked nothing of any other address, and raised no page errors", () => {
    expect(offsite).toEqual([]);
    expect(errors).toEqual([]);
  });
});
