import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Locator, Page } from "playwright-core";
import { connect } from "@/db/client";
import { assignments, assignmentStudents, tunes, users } from "@/db/schema";
import { DEMO_PASSWORD, STUDENTS, TEACHERS } from "@/db/seed-data/people";
import { renderRecording } from "@/lib/listen/recording";
import { BASE_URL, hydrated, launch, screenshot } from "./helpers/browser";

// The listening aid in the browser: a student checks in a recording (rendered from the demo tune's
// stage with the app's fiddle samples and two notes left out); the worker hears it; the student's
// self-check and the teacher's review queue show the bar strip; pressing a bar moves the recording to
// that bar and outlines the bar in the music.
const TEACHER = TEACHERS[0]; // Isla Penhallow: "Little Biscuit Polka" is on her taster rung
const TUNE = "Little Biscuit Polka";
const STUDENT = STUDENTS[15]; // on Isla's roster (teacherIndex 0), used by no other browser test

let browser: Browser;
const contexts: BrowserContext[] = [];
const errors: string[] = [];
const { db, close } = connect(process.env.DATABASE_URL ?? "");

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

async function idOf(email: string): Promise<string> {
  const [row] = await db
    .select({ id: users.id })
    .from(users)
    .where(sql`lower(${users.email}) = lower(${email})`);
  return row.id;
}

/** Presses a bar of a strip and checks the recording moved to it and the music outlines it. */
async function pressBar(page: Page, panel: Locator, name: string): Promise<number> {
  const bar = panel.locator("[data-testid=bar-strip] button[data-verdict=check]").first();
  const number = Number(await bar.getAttribute("data-bar"));
  const at = Number(await bar.getAttribute("data-at"));
  const audio = panel.locator("audio");
  await audio.evaluate(
    (el) =>
      new Promise<void>((resolve, reject) => {
        const a = el as HTMLAudioElement;
        if (a.readyState >= 1) return resolve();
        a.addEventListener("loadedmetadata", () => resolve(), { once: true });
        a.addEventListener("error", () => reject(new Error(`audio error ${a.error?.code ?? "?"}`)), { once: true });
      }),
  );
  await hydrated(bar);
  await bar.click();
  await expect(bar.getAttribute("aria-pressed")).resolves.toBe("true");
  const position = await audio.evaluate((el) => (el as HTMLAudioElement).currentTime);
  expect(position).toBeGreaterThanOrEqual(at - 0.05);
  expect(position).toBeLessThan(at + 3);
  await panel.locator(`figure[data-highlight-bars="${number}"]`).waitFor();
  await panel.locator(`svg [data-rw-bar-highlight=front] rect[data-bar="${number}"]`).first().waitFor();
  await expect(panel.getByTestId("listening-selected").textContent()).resolves.toContain(`Bar ${number}, listen`);
  await screenshot(page, name);
  return number;
}

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  for (const c of contexts) await c.close();
  await browser?.close();
  await close();
});

describe("the listening aid's bar strip", () => {
  let assignmentStudentId = "";
  let missedBars: number[] = [];
  let teacher: Page;
  let student: Page;

  it("the student checks in a recording and sees the strip as a self-check, with the caution", async () => {
    teacher = await signedIn(TEACHER.email, /\/teach/);
    const [tune] = await db
      .select({ id: tunes.id, abc: tunes.abc })
      .from(tunes)
      .where(and(eq(tunes.title, TUNE), eq(tunes.teacherId, await idOf(TEACHER.email))));
    const studentId = await idOf(STUDENT.email);
    const due = new Date(Date.now() + 9 * 86_400_000).toISOString().slice(0, 16);
    const status = await teacher.evaluate(
      async (body) =>
        (
          await fetch("/api/teach/assignments", {
            method: "POST",
            headers: { "content-type": "application/json" },
            body: JSON.stringify(body),
          })
        ).status,
      { tuneId: tune.id, studentIds: [studentId], dueLocal: due, note: "Record the skeleton for me." },
    );
    expect(status).toBe(201);
    const [place] = await db
      .select({ id: assignmentStudents.id })
      .from(assignmentStudents)
      .innerJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
      .where(and(eq(assignmentStudents.studentId, studentId), eq(assignments.tuneId, tune.id)))
      .orderBy(sql`${assignments.createdAt} desc`)
      .limit(1);
    assignmentStudentId = place.id;

    const { analyze } = await import("@/lib/abc");
    const analysis = analyze(tune.abc);
    if (!analysis.ok) throw new Error("the demo tune does not read");
    const rendered = await renderRecording(analysis.value.stages[0].abc, {
      bpm: 88,
      voice: "fiddle",
      seed: 8,
      faults: { missed: 0.06 },
      noiseDb: 30,
      format: "mp3",
    });
    missedBars = [...new Set(rendered.performance.truth.filter((t) => t.played === "missed").map((t) => t.bar))];
    expect(missedBars.length).toBeGreaterThan(0);

    student = await signedIn(STUDENT.email, /\/learn/);
    await student.goto(`${BASE_URL}/learn/assignments/${assignmentStudentId}`);
    await hydrated(student.locator("form[aria-label='Check in stage 1'] button[type=submit]"));
    await student
      .getByLabel("Choose a recording file")
      .setInputFiles({ name: "biscuit-skeleton.mp3", mimeType: "audio/mpeg", buffer: rendered.bytes });
    await student.getByText("biscuit-skeleton.mp3 is uploaded and ready").waitFor();
    await student.getByRole("radio", { name: /^3/ }).check();
    await student.getByRole("button", { name: "Check in" }).click();
    await student.getByRole("button", { name: "Withdraw check-in" }).waitFor();

    // The worker hears it; the page asks again while it listens, so the strip appears by itself.
    const panel = student.locator("section[aria-label='Recording and listening aid']");
    await panel.locator("[data-testid=bar-strip]").waitFor({ timeout: 90_000 });
    const checked = await panel
      .locator("button[data-verdict=check]")
      .evaluateAll((els) => els.map((e) => Number(e.getAttribute("data-bar"))));
    for (const bar of missedBars) expect(checked).toContain(bar);
    await expect(panel.getByTestId("listening-summary").textContent()).resolves.toMatch(/bars? to listen to: /);
    await panel.getByText("Your teacher's word counts").waitFor();
    // Screen readers hear each bar's verdict and why.
    const first = panel.locator(`button[data-bar="${missedBars[0]}"]`);
    await expect(first.getAttribute("aria-label")).resolves.toMatch(
      new RegExp(`^bar ${missedBars[0]} listen: .*not heard`), // begins with the words shown (label in name)
    );
    await pressBar(student, panel, "listening-01-student-self-check");
  });

  it("the teacher sees the strip beside the recording in the review queue; a bar plays from there, outlined", async () => {
    await teacher.goto(`${BASE_URL}/teach/review`);
    const card = teacher.locator(`li[aria-label^="${STUDENT.name}: ${TUNE}, stage 1 of"]`).last();
    const panel = card.locator("section[aria-label='Recording and listening aid']");
    await panel.locator("[data-testid=bar-strip]").waitFor();
    await expect(panel.getByTestId("listening-summary").textContent()).resolves.toMatch(/to listen to/);
    await panel.getByText("your sign-off decide").waitFor();
    const bar = await pressBar(teacher, panel, "listening-02-review-queue");
    expect(missedBars).toContain(bar);
    // The decision stays the teacher's: the card still offers both outcomes.
    await card.getByRole("button", { name: "Sign off" }).waitFor();
    await card.getByRole("button", { name: "Needs more time" }).waitFor();
    expect(errors).toEqual([]);
  });
});
