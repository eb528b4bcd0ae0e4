// The keyboard alone (WCAG 2.2 §2.1.1): the tune page's stage selector, player and memory mode, the
// assign form and the review queue, each reached with Tab and used with the keys a person would press.
// The set-up between them (signing in, the student's upload) may use the mouse.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator, Page } from "playwright-core";
import { DEMO_PASSWORD, STUDENTS, TEACHERS } from "@/db/seed-data/people";
import { BASE_URL, follow, hydrated, launch } from "./helpers/browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(email: string, home: RegExp): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(home);
  return page;
}

/** Presses Tab, from where the focus is, until `target` has it; fails if it is not in the tab order. */
async function tabTo(page: Page, target: Locator, most = 120): Promise<void> {
  const handle = await target.elementHandle();
  for (let i = 0; i < most; i++) {
    await page.keyboard.press("Tab");
    if (await handle?.evaluate((el) => el === document.activeElement)) return;
  }
  throw new Error(`${target} was not reached with ${most} presses of Tab`);
}

// Isla's first rung for STUDENTS[0], whose demo progress opens stages 1 and 2 of it.
const TUNE = "Little Biscuit Polka";
// Tomas's own students and tunes, so the other browser tests' counts of Isla's assignments stay as they were.
const TEACHER = TEACHERS[1];
const FEEDBACK = `Clean string crossings, all by keyboard. (${Date.now().toString(36)})`;

/** A small valid WAV (RIFF WAVE, PCM): 0.5 s of 16-bit mono silence at 8 kHz. */
function silentWav(): Buffer {
  const data = Buffer.alloc(8000);
  const h = Buffer.alloc(44);
  h.write("RIFF", 0, "ascii");
  h.writeUInt32LE(36 + data.length, 4);
  h.write("WAVEfmt ", 8, "ascii");
  h.writeUInt32LE(16, 16);
  h.writeUInt16LE(1, 20);
  h.writeUInt16LE(1, 22);
  h.writeUInt32LE(8000, 24);
  h.writeUInt32LE(16000, 28);
  h.writeUInt16LE(2, 32);
  h.writeUInt16LE(16, 34);
  h.write("data", 36, "ascii");
  h.writeUInt32LE(data.length, 40);
  return Buffer.concat([h, data]);
}

describe("with the keyboard alone", () => {
  let teacher: Page;
  let student = "";
  let tune = "";

  it("the tune page: a stage chosen with the arrow keys, the player started and paused, a phrase hidden", async () => {
    const page = await signedIn(STUDENTS[0].email, /\/learn$/);
    await page.goto(`${BASE_URL}/learn/courses`);
    await follow(
      page,
      page.getByRole("link", { name: "Open the ladder of First Steps on the Fiddle" }),
      /\/learn\/courses\//,
    );
    await follow(page, page.getByRole("link", { name: `Practise ${TUNE}` }), /\/learn\/tunes\//);
    await page.waitForSelector('[data-notation-state="ready"] svg', { timeout: 60_000 });

    const bowing = page.getByRole("radio", { name: /^2\. Bowing/ });
    const core = page.getByRole("radio", { name: /^1\. / });
    expect(await bowing.isChecked()).toBe(true);
    await tabTo(page, bowing); // a radio group is one stop in the tab order: the chosen stage
    await page.keyboard.press("ArrowLeft");
    await expect.poll(() => core.isChecked()).toBe(true);
    // The stage shown is in the address: a reload shows the same stage.
    expect(page.url()).toMatch(/\/learn\/tunes\/[0-9a-f-]{36}\?stage=1$/);
    await page.reload();
    await page.waitForSelector('[data-notation-state="ready"] svg', { timeout: 60_000 });
    expect(await core.isChecked()).toBe(true);

    const play = page.getByRole("button", { name: "Play" });
    await tabTo(page, play);
    await page.keyboard.press("Space");
    await page.waitForSelector('section[data-player-status="playing"]', { timeout: 60_000 });
    // The same button now pauses, and keeps the focus.
    expect(await page.getByRole("button", { name: "Pause" }).evaluate((el) => el === document.activeElement)).toBe(
      true,
    );
    await page.keyboard.press("Enter");
    await page.waitForSelector('section[data-player-status="paused"]');

    const hide = page.getByRole("button", { name: /^Hide next phrase/ });
    await tabTo(page, hide);
    await page.keyboard.press("Enter");
    await page.waitForSelector("svg [data-hidden-phrase]");
    await page.context().close();
  });

  it("the assign form: a tune, a student and Assign", async () => {
    teacher = await signedIn(TEACHER.email, /\/teach/);
    await teacher.goto(`${BASE_URL}/teach/assign`);
    const tuneSelect = teacher.locator("#assign-tune");
    await hydrated(tuneSelect);
    const first = await tuneSelect.inputValue();
    await tabTo(teacher, tuneSelect);
    await teacher.keyboard.press("ArrowDown"); // the next tune
    await expect.poll(() => tuneSelect.inputValue()).not.toBe(first);
    tune = (await tuneSelect.locator("option:checked").textContent()) ?? "";

    const box = teacher.getByRole("group", { name: "Students" }).getByRole("checkbox").first();
    student = ((await box.locator("xpath=..").textContent()) ?? "").trim();
    await tabTo(teacher, box);
    await teacher.keyboard.press("Space");
    expect(await box.isChecked()).toBe(true);

    await tabTo(teacher, teacher.getByRole("button", { name: "Assign" }));
    await teacher.keyboard.press("Enter");
    await teacher.getByText(`Assigned “${tune}” to 1 student`).waitFor();
  });

  it("the review queue: feedback written and the stage signed off", async () => {
    // The student checks in (set-up: the mouse may do this part).
    const email = STUDENTS.find((s) => s.name === student)?.email;
    expect(email).toBeTruthy();
    const page = await signedIn(email!, /\/learn$/);
    await page.goto(`${BASE_URL}/learn/assignments`);
    await follow(page, page.getByRole("link", { name: tune }).first(), /\/learn\/assignments\/[0-9a-f-]{36}$/);
    const checkIn = page.locator("form[aria-label='Check in stage 1']");
    await hydrated(checkIn.getByRole("button", { name: "Check in" }));
    await checkIn
      .getByLabel("Choose a recording file")
      .setInputFiles({ name: "keyboard-take.wav", mimeType: "audio/wav", buffer: silentWav() });
    await page.getByText("keyboard-take.wav is uploaded and ready").waitFor();
    await page.getByRole("radio", { name: /^4/ }).check();
    await checkIn.getByRole("button", { name: "Check in" }).click();
    await page.getByRole("button", { name: "Withdraw check-in" }).waitFor();
    await page.context().close();

    await teacher.goto(`${BASE_URL}/teach/review`);
    const item = teacher.locator(`li[aria-label^="${student}: ${tune}, stage 1 of"]`).last();
    const feedback = item.getByLabel("Feedback");
    await hydrated(feedback);
    await tabTo(teacher, feedback);
    await teacher.keyboard.type(FEEDBACK);
    expect(await feedback.inputValue()).toBe(FEEDBACK);
    await tabTo(teacher, item.getByRole("button", { name: "Sign off" }));
    await teacher.keyboard.press("Enter");
    await teacher.getByText(`Stage 2 is open for ${student}.`).waitFor();
    await teacher.context().close();
  });
});
