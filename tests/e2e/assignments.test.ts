import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { DEMO_PASSWORD, STUDENTS, TEACHERS } from "@/db/seed-data/people";
import { BASE_URL, follow, hydrated, launch, screenshot } from "./helpers/browser";

// Issue 6's browser journey in Debian's Chromium: a teacher assigns a tune to two students with a
// due date; both get e-mail; one checks in with an uploaded recording; the teacher listens, writes
// feedback and signs off; stage 2 opens for that student only — the other's stays locked on the
// page and in the API. The tune is on a taster rung, so no membership is involved.
const TEACHER = TEACHERS[0]; // Isla Penhallow: her course "First Steps on the Fiddle" holds the taster
const TUNE = "Little Biscuit Polka"; // taster rung of that course (db/seed-data/catalogue.ts)
// Two students on Isla's roster (teacherIndex 0) in different zones: Juno (America/Halifax), Morwen (Europe/London).
const JUNO = STUDENTS.find((s) => s.name.startsWith("Juno "))!;
const MORWEN = STUDENTS.find((s) => s.name.startsWith("Morwen "))!;
const FEEDBACK = `Steady bow and a clean last bar — on to the next stage. (${Date.now().toString(36)})`;

/**
 * A small valid WAV: RIFF header + 0.5 s of 16-bit mono silence at 8 kHz. Layout per the RIFF WAVE
 * format (Microsoft Multimedia Programming Interface and Data Specifications 1.0: "RIFF" size
 * "WAVE", a 16-byte "fmt " chunk with PCM = 1, then the "data" chunk).
 */
function silentWav(): Buffer {
  const rate = 8000;
  const data = Buffer.alloc(rate); // 4000 samples × 2 bytes
  const h = Buffer.alloc(44);
  h.write("RIFF", 0, "ascii");
  h.writeUInt32LE(36 + data.length, 4);
  h.write("WAVE", 8, "ascii");
  h.write("fmt ", 12, "ascii");
  h.writeUInt32LE(16, 16);
  h.writeUInt16LE(1, 20); // PCM
  h.writeUInt16LE(1, 22); // mono
  h.writeUInt32LE(rate, 24);
  h.writeUInt32LE(rate * 2, 28); // byte rate
  h.writeUInt16LE(2, 32); // block align
  h.writeUInt16LE(16, 34); // bits per sample
  h.write("data", 36, "ascii");
  h.writeUInt32LE(data.length, 40);
  return Buffer.concat([h, data]);
}

type FakeEmail = { to: string[]; subject: string; text: string | null; html: string | null; created_at: string };

/** The assignment link of the newest "assignment-new" mail to an address, read from the Resend stand-in (like helpers/mail-link.ts). */
async function assignmentLinkMailed(to: string, after: number): Promise<string> {
  const base = process.env.RESEND_FAKE_URL;
  if (!base) throw new Error("RESEND_FAKE_URL is not set: run browser tests through `npm test`");
  const pattern = /\/learn\/assignments\/([0-9a-f-]{36})/;
  const deadline = Date.now() + 45_000;
  for (;;) {
    const { data } = (await (await fetch(`${base}/_fake/emails`)).json()) as { data: FakeEmail[] };
    const mail = data.find(
      (m) =>
        m.to.some((a) => a.toLowerCase() === to.toLowerCase()) &&
        Date.parse(m.created_at) >= after &&
        pattern.test(m.text ?? m.html ?? "") &&
        (m.text ?? m.html ?? "").includes(TUNE),
    );
    if (mail) return pattern.exec(mail.text ?? mail.html ?? "")![1];
    if (Date.now() > deadline) throw new Error(`no assignment mail to ${to} arrived in time`);
    await new Promise((r) => setTimeout(r, 300));
  }
}

let browser: Browser;
const contexts: BrowserContext[] = [];
const errors: string[] = [];

async function signedIn(email: string, home: RegExp): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 1000 } });
  contexts.push(context);
  const page = await context.newPage();
  page.on("pageerror", (e) => errors.push(`${email} ${new URL(page.url()).pathname}: ${e.message}`));
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(home);
  return page;
}

/** Opens a page and waits until React has taken over `selector`'s element, so clicks never race hydration. */
async function open(page: Page, path: string, selector: string): Promise<void> {
  await page.goto(`${BASE_URL}${path}`);
  await hydrated(page.locator(selector).first());
}

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  for (const c of contexts) await c.close();
  await browser?.close();
});

describe("assignments, check-in and sign-off in the browser", () => {
  let teacher: Page;
  let juno: Page;
  let morwen: Page;
  let junoId = "";
  let morwenId = "";

  it("the teacher assigns a tune to two roster students with a due date; both get e-mail", async () => {
    const started = Date.now() - 1000;
    teacher = await signedIn(TEACHER.email, /\/teach/);
    await open(teacher, "/teach/assign", "#assign-tune");
    await teacher.locator("#assign-tune").selectOption({ label: TUNE });
    await teacher.getByRole("checkbox", { name: JUNO.name }).check();
    await teacher.getByRole("checkbox", { name: MORWEN.name }).check();
    const due = new Date(Date.now() + 10 * 86_400_000).toISOString().slice(0, 10);
    await teacher.locator("#assign-due").fill(`${due}T18:00`);
    await teacher.locator("#assign-note").fill("Keep the bow light in bar 3.");
    await screenshot(teacher, "assignments-01-assign-form");
    await teacher.getByRole("button", { name: "Assign" }).click();
    await teacher.getByText(`Assigned “${TUNE}” to 2 students`).waitFor();
    junoId = await assignmentLinkMailed(JUNO.email, started);
    morwenId = await assignmentLinkMailed(MORWEN.email, started);
    expect(junoId).not.toBe(morwenId);
  });

  it("one student uploads a recording and checks in", async () => {
    juno = await signedIn(JUNO.email, /\/learn/);
    await open(juno, `/learn/assignments/${junoId}`, "form[aria-label='Check in stage 1'] button[type=submit]");
    await expect(juno.locator('li[data-stage="1"]').getAttribute("data-state")).resolves.toBe("open");
    await expect(juno.getByTestId("due").textContent()).resolves.toContain("America/Halifax");
    await juno
      .getByLabel("Choose a recording file")
      .setInputFiles({ name: "biscuit-take-1.wav", mimeType: "audio/wav", buffer: silentWav() });
    await juno.getByText("biscuit-take-1.wav is uploaded and ready").waitFor();
    await juno.getByRole("radio", { name: /^4/ }).check();
    await juno.getByRole("checkbox", { name: "Played from memory" }).check();
    await screenshot(juno, "assignments-02-check-in-form");
    await juno.getByRole("button", { name: "Check in" }).click();
    await juno.getByRole("button", { name: "Withdraw check-in" }).waitFor();
    await expect(juno.locator('li[data-stage="1"]').getAttribute("data-state")).resolves.toBe("checked_in");
    await screenshot(juno, "assignments-03-checked-in");
  });

  it("the student logs practice beside the cautions and sees it on Today", async () => {
    await open(juno, "/learn/practice", "form[aria-label='Log practice'] button[type=submit]");
    await juno.getByText("Take a short break every 20–30 minutes").waitFor();
    await juno.getByLabel("Minutes").fill("700");
    await juno.getByRole("button", { name: "Log practice" }).click();
    await juno.getByText("Minutes can be at most 600").waitFor(); // the server's 422 names the field
    await juno.getByLabel("Minutes").fill("25");
    await juno.getByLabel("Tune").selectOption({ label: TUNE });
    await juno.getByLabel("Note").fill("Skeleton, slow then at speed");
    await juno.getByRole("button", { name: "Log practice" }).click();
    await juno.getByText(`25 min · ${TUNE}`).waitFor();
    await screenshot(juno, "assignments-03b-practice-log");
    await juno.goto(`${BASE_URL}/learn`);
    await juno.getByTestId("streak").waitFor();
    await expect(juno.getByTestId("streak").textContent()).resolves.toMatch(/in a row, today included/);
    await juno.getByRole("list", { name: "Assignments" }).getByRole("link", { name: TUNE }).first().waitFor();
    await juno.getByTestId("minutes-chart").locator("svg").first().waitFor();
    await screenshot(juno, "assignments-03c-today");
  });

  it("the teacher listens in the review queue, writes feedback and signs off", async () => {
    await open(teacher, "/teach/review", "main h1");
    // The review card of this check-in (components/teaching/review-card.tsx names it "<student>: <tune>, stage i of n").
    const item = teacher.locator(`li[aria-label^="${JUNO.name}: ${TUNE}, stage 1 of"]`).last();
    const audio = item.getByLabel(`Recording by ${JUNO.name}`);
    await audio.waitFor();
    const src = await audio.evaluate((el) => (el as HTMLAudioElement).currentSrc || (el as HTMLAudioElement).src);
    expect(src).toMatch(/^https?:\/\//);
    // Playable: the browser reads the recording's header and knows its length (0.5 s of our silence).
    const duration = await audio.evaluate(
      (el) =>
        new Promise<number>((resolve, reject) => {
          const a = el as HTMLAudioElement;
          if (a.readyState >= 1) return resolve(a.duration);
          a.addEventListener("loadedmetadata", () => resolve(a.duration), { once: true });
          a.addEventListener("error", () => reject(new Error(`audio error ${a.error?.code ?? "?"}`)), { once: true });
          a.load();
        }),
    );
    expect(duration).toBeCloseTo(0.5, 1);
    // And the short-lived address hands back the very bytes uploaded (read here, outside the page, where no CORS applies).
    const bytes = new Uint8Array(await (await fetch(src)).arrayBuffer());
    expect(Buffer.from(bytes).equals(silentWav())).toBe(true);
    await item.getByLabel("Feedback").fill(FEEDBACK);
    await screenshot(teacher, "assignments-04-review");
    await item.getByRole("button", { name: "Sign off" }).click();
    await teacher.getByText(`Stage 2 is open for ${JUNO.name}.`).waitFor();
    await screenshot(teacher, "assignments-04b-signed-off");
  });

  it("stage 2 opens for that student only; the other student's stays locked on the page and in the API", async () => {
    await open(juno, `/learn/assignments/${junoId}`, "form[aria-label='Check in stage 2'] button[type=submit]");
    await expect(juno.locator('li[data-stage="1"]').getAttribute("data-state")).resolves.toBe("signed_off");
    await expect(juno.locator('li[data-stage="2"]').getAttribute("data-state")).resolves.toBe("open");
    await juno.getByText(FEEDBACK).first().waitFor();
    await screenshot(juno, "assignments-05-stage-2-open");

    morwen = await signedIn(MORWEN.email, /\/learn/);
    await open(morwen, `/learn/assignments/${morwenId}`, "form[aria-label='Check in stage 1'] button[type=submit]");
    await expect(morwen.locator('li[data-stage="1"]').getAttribute("data-state")).resolves.toBe("open");
    await expect(morwen.locator('li[data-stage="2"]').getAttribute("data-state")).resolves.toBe("locked");
    await screenshot(morwen, "assignments-06-other-student-locked");
    const res = await morwen.request.get(`${BASE_URL}/api/learn/assignments/${morwenId}`);
    expect(res.status()).toBe(200);
    const body = (await res.json()) as { stages: { index: number; state: string }[] };
    expect(body.stages.find((s) => s.index === 2)?.state).toBe("locked");
    expect(body.stages.find((s) => s.index === 1)?.state).toBe("open");
    // And the first student's assignment is not hers to read.
    expect((await morwen.request.get(`${BASE_URL}/api/learn/assignments/${junoId}`)).status()).toBe(404);
  });

  it("the student's pages fit a 375 px phone without sideways scrolling", async () => {
    await morwen.setViewportSize({ width: 375, height: 800 });
    for (const [path, ready, name] of [
      [
        `/learn/assignments/${morwenId}`,
        "form[aria-label='Check in stage 1'] button[type=submit]",
        "assignments-07-phone-assignment",
      ],
      ["/learn/practice", "form[aria-label='Log practice'] button[type=submit]", "assignments-08-phone-practice"],
      ["/learn", "[data-testid=streak]", "assignments-09-phone-today"],
    ] as const) {
      await open(morwen, path, ready);
      await morwen.waitForTimeout(300); // the chart and the notation size themselves after mount
      const wide = await morwen.evaluate(() => document.documentElement.scrollWidth);
      expect(wide, path).toBeLessThanOrEqual(375);
      await screenshot(morwen, name);
    }
    expect(errors).toEqual([]);
  });

  it("the teacher's list shows 20 assignments a page, with the others on the next", async () => {
    // Enough assignments for two pages, all for Juno, made through the same route the assign form uses.
    const made = await teacher.evaluate(async (junoAssignment) => {
      type List = {
        assignments: { tune: { id: string }; students: { studentId: string; assignmentStudentId: string }[] }[];
        total: number;
      };
      const list = (await (await fetch("/api/teach/assignments")).json()) as List;
      let juno: { tuneId: string; studentId: string } | undefined;
      for (let page = 1; !juno && (page - 1) * 20 < list.total; page++) {
        const some = page === 1 ? list : ((await (await fetch(`/api/teach/assignments?page=${page}`)).json()) as List);
        const a = some.assignments.find((x) => x.students.some((s) => s.assignmentStudentId === junoAssignment));
        if (a)
          juno = {
            tuneId: a.tune.id,
            studentId: a.students.find((s) => s.assignmentStudentId === junoAssignment)!.studentId,
          };
      }
      if (!juno) throw new Error("Juno's assignment is not in the teacher's list");
      for (let i = 0; i < 21; i++) {
        const due = new Date(Date.now() + (30 + i) * 86_400_000).toISOString().slice(0, 10);
        const body = { tuneId: juno.tuneId, studentIds: [juno.studentId], dueLocal: `${due}T18:00` };
        const res = await fetch("/api/teach/assignments", {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify(body),
        });
        if (res.status !== 201) throw new Error(`POST answered ${res.status}: ${await res.text()}`);
      }
      return list.total + 21;
    }, junoId);
    await open(teacher, "/teach/assignments", "nav[aria-label='Assignment pages'] a");
    const pages = Math.ceil(made / 20);
    await teacher.getByText(`Page 1 of ${pages} · ${made} assignments`).waitFor();
    expect(await teacher.getByRole("list", { name: "Assignments" }).locator(":scope > li").count()).toBe(20);
    // The pager is a link: the page is in the address, and Back returns to the first page.
    await follow(
      teacher,
      teacher.getByRole("navigation", { name: "Assignment pages" }).getByRole("link", { name: "Next" }),
      /\/teach\/assignments\?page=2$/,
    );
    await teacher.getByText(`Page 2 of ${pages} · ${made} assignments`).waitFor();
    await expect
      .poll(() => teacher.getByRole("list", { name: "Assignments" }).locator(":scope > li").count())
      .toBe(pages === 2 ? made - 20 : 20);
    await screenshot(teacher, "assignments-10-list-page-2");
    await teacher.goBack();
    await teacher.getByText(`Page 1 of ${pages} · ${made} assignments`).waitFor();
    expect(teacher.url()).toMatch(/\/teach\/assignments$/);
  });

  it("the student's list pages too: this week's work first, the rest after Next", async () => {
    const mine = await juno.evaluate(
      async () =>
        ((await (await fetch("/api/learn/assignments")).json()) as { assignments: unknown[] }).assignments.length,
    );
    expect(mine).toBeGreaterThan(20); // the 21 just made and the one from the first step
    const pages = Math.ceil(mine / 20);
    await open(juno, "/learn/assignments", "nav[aria-label='Assignment pages'] a");
    await juno.getByText(`Page 1 of ${pages} · ${mine} assignments`).waitFor();
    const cards = () => juno.getByRole("list", { name: "Assignments" }).locator(":scope > li");
    expect(await cards().count()).toBe(20);
    // The first step's assignment is due in ten days, before all 21 new ones (30 days and later).
    expect(await cards().first().getByRole("link").getAttribute("href")).toBe(`/learn/assignments/${junoId}`);
    await follow(
      juno,
      juno.getByRole("navigation", { name: "Assignment pages" }).getByRole("link", { name: "Next" }),
      /\/learn\/assignments\?page=2$/,
    );
    await juno.getByText(`Page 2 of ${pages} · ${mine} assignments`).waitFor();
    expect(await cards().count()).toBe(pages === 2 ? mine - 20 : 20);
    expect(
      await juno
        .getByRole("navigation", { name: "Assignment pages" })
        .getByRole("link", { name: "Previous" })
        .isVisible(),
    ).toBe(true);
    await screenshot(juno, "assignments-11-student-list-page-2");
  });
});
