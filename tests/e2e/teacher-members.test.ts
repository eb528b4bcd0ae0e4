// In the browser: the admin hands a member's enrolment to another teacher from the enrolments table;
// that teacher sees the member new this week on the roster and sends a welcome note; in the review
// queue "needs more time" asks for a sentence, and the teacher undoes it while the note still waits.
// The member and their check-in on a teacher sign-off course are made in the app's database first.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { connect } from "@/db/client";
import { insertEnrolment } from "@/db/queries/enrolments";
import { courses, grades, rungs, users } from "@/db/schema";
import { ADMIN, DEMO_PASSWORD, TEACHERS } from "@/db/seed-data/people";
import { and, asc, eq } from "drizzle-orm";
import { giveMembership } from "../integration/helpers/membership";
import { BASE_URL, hydrated, launch, press, screenshot } from "./helpers/browser";

let browser: Browser;
const stamp = Date.now().toString(36);
const member = { name: `Linnet Oakes ${stamp}`, email: `linnet.${stamp}@newcomers.example` };
const NEXT = TEACHERS[1]; // Tomas Greavey
const COURSE = "Ready for the Session"; // teacher sign-off, led by Ruth Callander (db/seed-data/catalogue.ts)

beforeAll(async () => {
  browser = await launch();
  const { db, close } = connect(process.env.DATABASE_URL ?? "");
  try {
    const [u] = await db
      .insert(users)
      .values({ ...member, role: "student", emailVerifiedAt: new Date() })
      .returning();
    await giveMembership(db, u.id);
    const [course] = await db.select().from(courses).where(eq(courses.slug, "session-ready"));
    const made = await insertEnrolment(db, { userId: u.id, courseId: course.id });
    if (!made) throw new Error("the member was not enrolled");
    const [first] = await db
      .select({ tuneId: rungs.tuneId })
      .from(rungs)
      .innerJoin(grades, eq(grades.id, rungs.gradeId))
      .where(and(eq(grades.courseId, course.id), eq(rungs.isTaster, true)))
      .orderBy(asc(grades.position), asc(rungs.position))
      .limit(1);
    const { checkInRung } = await import("@/lib/teaching/course-check-in");
    await checkInRung(db, { id: u.id, role: "student" }, first.tuneId, {
      stageIndex: 1,
      uploadId: null,
      selfRating: 3,
      fromMemory: true,
    });
  } finally {
    await close();
  }
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(email: string): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
  await page.goto(`${BASE_URL}/sign-in`);
  await hydrated(page.getByRole("button", { name: "Sign in" }));
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await Promise.all([
    page.waitForURL((u) => u.pathname !== "/sign-in"),
    page.getByRole("button", { name: "Sign in" }).click(),
  ]);
  return page;
}

describe("every member has a teacher, in a real browser", () => {
  it("the admin hands the member's enrolment to another teacher from the enrolments table", async () => {
    const page = await signedIn(ADMIN.email);
    await page.goto(`${BASE_URL}/admin/enrolments?q=${encodeURIComponent(member.email)}`);
    const row = page.getByRole("row").filter({ hasText: member.email });
    await row.waitFor();
    expect(await row.getByTestId("enrolment-teacher").textContent()).toBe(TEACHERS[2].name);
    await hydrated(row.getByRole("checkbox"));
    await row.getByRole("checkbox", { name: `Choose ${member.name} on ${COURSE}` }).check();
    await page.getByTestId("reassign-count").filter({ hasText: "1 enrolment chosen." }).waitFor();
    await page.getByLabel("New teacher").selectOption({ label: NEXT.name });
    await press(page.getByRole("button", { name: "Reassign" }), page.getByText(`1 enrolment handed to ${NEXT.name}.`));
    await row.getByTestId("enrolment-teacher").filter({ hasText: NEXT.name }).waitFor();
    await screenshot(page, "members-reassigned");
    await page.context().close();
  });

  it("the new teacher sees the member new this week and sends a welcome note", async () => {
    const page = await signedIn(NEXT.email);
    const card = page.getByRole("listitem", { name: `${member.name}, new on ${COURSE}` });
    await card.waitFor();
    await card.getByLabel(`Welcome note to ${member.name}`).fill("Welcome! Take the first tune slowly.");
    await press(card.getByRole("button", { name: "Send the welcome note" }), card.getByText(/^Welcome note sent/));
    await screenshot(page, "members-welcomed");
    await page.context().close();
  });

  it("'needs more time' asks for a sentence, and can be undone while its note waits", async () => {
    const page = await signedIn(NEXT.email);
    await page.goto(`${BASE_URL}/teach/review`);
    const card = page.getByRole("listitem", { name: new RegExp(`^${member.name}: `) });
    await card.waitFor();
    expect(await card.textContent()).toContain(`on the course “${COURSE}”`);
    await press(
      card.getByRole("button", { name: "Needs more time" }),
      card.getByText(/in a sentence what to work on/).first(),
    );
    await card.getByLabel("Feedback").fill("Let the long notes ring their full length.");
    const sent = page.getByText(`Sent back to ${member.name}`);
    await press(card.getByRole("button", { name: "Needs more time" }), sent);
    expect(await page.getByRole("status").filter({ hasText: "Sent back" }).textContent()).toContain("in 10 minutes");
    await press(
      page.getByRole("button", { name: "Undo “needs more time”" }),
      page.getByText(`Undone: ${member.name}'s check-in waits for your review again`),
    );
    await page.getByRole("listitem", { name: new RegExp(`^${member.name}: `) }).waitFor();
    await screenshot(page, "members-undone");
    await page.context().close();
  });
});
