import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { BASE_URL, follow, hydrated, launch, press, screenshot } from "./helpers/browser";
import { mailedLink } from "./helpers/mail-link";
import { DEMO_PASSWORD, STUDENTS, TEACHERS } from "@/db/seed-data/people";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const stamp = Date.now().toString(36);
const newcomer = {
  name: "Hazel Quarrie",
  email: `hazel.${stamp}@newcomers.example`,
  password: "hazel-plays-hornpipes",
};

async function signIn(page: Page, email: string, password: string) {
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

/** A page of its own (a fresh context) signed in through the form, once it has reached `home`. */
async function signedIn(email: string, password: string, home: string): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  await page.goto(`${BASE_URL}/sign-in`);
  await signIn(page, email, password);
  await page.waitForURL(`${BASE_URL}${home}`);
  return page;
}

describe("accounts in a real browser", () => {
  it("signs up, confirms the address from the e-mail, signs in, signs out and signs back in", async () => {
    const page = await browser.newPage();
    const started = Date.now() - 1000;
    await page.goto(`${BASE_URL}/sign-up`);
    await page.getByLabel("Your name").fill(newcomer.name);
    await page.getByLabel("E-mail address").fill(newcomer.email);
    await page.getByLabel("Password").fill("password123"); // on every common-password list
    await page.getByRole("button", { name: "Create my account" }).click();
    await expect(page.getByText("one of the most common passwords").waitFor()).resolves.toBeUndefined();
    expect(await page.getByLabel("E-mail address").inputValue()).toBe(newcomer.email); // kept after the error
    await screenshot(page, "accounts-sign-up-error");
    await page.getByLabel("Password").fill(newcomer.password);
    await page.getByRole("button", { name: "Create my account" }).click();
    await page.getByText("Check your e-mail").waitFor();
    await screenshot(page, "accounts-sign-up-sent");

    await page.goto(await mailedLink(newcomer.email, "/verify-email", { after: started }));
    await page.getByRole("button", { name: "Confirm my address" }).click();
    await page.waitForURL(/\/sign-in\?confirmed=1/);
    await signIn(page, newcomer.email, newcomer.password);
    await page.waitForURL(`${BASE_URL}/learn`);
    expect(await page.locator("h1").textContent()).toMatch(/Hazel/);
    await screenshot(page, "accounts-today");

    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(`${BASE_URL}/`);
    expect(await page.getByRole("link", { name: "Sign in" }).count()).toBeGreaterThan(0);
    // Signed out, the student area sends back to sign-in and returns there afterwards.
    await page.goto(`${BASE_URL}/learn`);
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    expect(new URL(page.url()).searchParams.get("next")).toBe("/learn");
    await signIn(page, newcomer.email, "not-the-password");
    await page.getByText("don't match an account").waitFor();
    await screenshot(page, "accounts-sign-in-error");
    await signIn(page, newcomer.email, newcomer.password);
    await page.waitForURL(`${BASE_URL}/learn`);
    await page.close();
  });

  it("resets the password through the captured e-mail", async () => {
    const page = await browser.newPage();
    const asked = Date.now() - 1000;
    await page.goto(`${BASE_URL}/sign-in`);
    await follow(page, page.getByRole("link", { name: "Forgotten your password?" }), /\/forgot-password$/);
    await page.getByLabel("E-mail address").fill(newcomer.email);
    await page.getByRole("button", { name: "Send me a reset link" }).click();
    await page.getByText(`If an account exists for ${newcomer.email}`).waitFor();
    await screenshot(page, "accounts-reset-sent");

    await page.goto(await mailedLink(newcomer.email, "/reset-password", { after: asked }));
    await page.getByLabel("New password").fill("hazel-new-bow-hair");
    await page.getByRole("button", { name: "Save the new password" }).click();
    await page.waitForURL(/\/sign-in\?reset=done/);
    await screenshot(page, "accounts-reset-done");
    await signIn(page, newcomer.email, newcomer.password);
    await page.getByText("don't match an account").waitFor(); // the old password no longer works
    await signIn(page, newcomer.email, "hazel-new-bow-hair");
    await page.waitForURL(`${BASE_URL}/learn`);
    await page.close();
  });

  it("a teacher invites a student by e-mail; the student accepts and joins the roster", async () => {
    const teacher = await signedIn(TEACHERS[0].email, DEMO_PASSWORD, "/teach");
    await teacher.getByRole("link", { name: "Invite students" }).click();
    const invited = `rook.${stamp}@newcomers.example`;
    const sent = Date.now() - 1000;
    await teacher.getByLabel("Students' e-mail addresses").fill(invited);
    await teacher.getByRole("button", { name: "Send invitations" }).click();
    await teacher.getByText("Invitation sent to 1 address").waitFor();
    await screenshot(teacher, "accounts-invite-sent");

    const studentContext = await browser.newContext();
    const student = await studentContext.newPage();
    await student.goto(await mailedLink(invited, "/accept-invitation", { after: sent }));
    await student.locator("main", { hasText: `${TEACHERS[0].name} has invited` }).waitFor();
    expect(await student.locator("main").textContent()).toContain(`${TEACHERS[0].name} has invited`);
    await student.getByLabel("Your name").fill("Rook Allenby");
    await student.getByLabel("Choose a password").fill("rook-learns-jigs");
    await screenshot(student, "accounts-invitation");
    await student.getByRole("button", { name: "Create my account and accept" }).click();
    await student.waitForURL(`${BASE_URL}/learn`);

    await teacher.goto(`${BASE_URL}/teach`);
    // The area's loading view streams first and React reveals the page a moment later: wait for it.
    await teacher.locator("main", { hasText: "Rook Allenby" }).waitFor();
    expect(await teacher.locator("main").textContent()).toContain("Rook Allenby");
    await screenshot(teacher, "accounts-roster");
    // The invitation link works once.
    const again = await (await browser.newContext()).newPage();
    await again.goto(await mailedLink(invited, "/accept-invitation", { after: sent }));
    await again.locator("main", { hasText: /expired or has already been used/ }).waitFor();
    expect(await again.locator("main").textContent()).toMatch(/expired or has already been used/);
    await Promise.all([teacher.context().close(), studentContext.close(), again.context().close()]);
  });

  it("each role sees only its own area; another role's area says whose it is and links back", async () => {
    const page = await signedIn(STUDENTS[0].email, DEMO_PASSWORD, "/learn");
    // Another role's area answers 403 with a page naming the signed-in account, and none of its content.
    for (const [area, content, whose] of [
      ["/teach", "Your students", "teachers' area"],
      ["/admin/people", "Invite a teacher", "administration"],
    ]) {
      const answer = await page.goto(`${BASE_URL}${area}`);
      await page.locator("main", { hasText: /belongs to another area/ }).waitFor();
      expect(answer?.status()).toBe(403);
      const main = await page.locator("main").textContent();
      expect(main).toContain(`You are signed in as ${STUDENTS[0].name} (${STUDENTS[0].email}), a student.`);
      expect(main).toContain(whose);
      expect(main).not.toContain(content);
    }
    await screenshot(page, "accounts-wrong-area");
    await follow(page, page.getByRole("link", { name: "Go to Today, your own area" }), /\/learn$/);
    await page.context().close();

    const teacher = await signedIn(TEACHERS[0].email, DEMO_PASSWORD, "/teach");
    const answer = await teacher.goto(`${BASE_URL}/admin/people`);
    await teacher.locator("main", { hasText: /belongs to another area/ }).waitFor();
    expect(answer?.status()).toBe(403);
    expect(await teacher.getByTestId("signed-in-as").textContent()).toBe(
      `You are signed in as ${TEACHERS[0].name} (${TEACHERS[0].email}), a teacher.`,
    );
    expect(await teacher.getByRole("link", { name: "Go to your roster" }).getAttribute("href")).toBe("/teach");
    await teacher.context().close();

    const admin = await (await browser.newContext()).newPage();
    await admin.goto(`${BASE_URL}/admin`);
    await signIn(admin, "admin@larchmoor.example", DEMO_PASSWORD);
    // Back to the address asked for: the admin's landing page, which links each admin table.
    await admin.waitForURL(/\/admin$/);
    await follow(admin, admin.getByRole("main").getByRole("link", { name: "People" }), /\/admin\/people/);
    await admin.getByLabel("Search by name or e-mail").fill("penhallow");
    await admin.getByRole("button", { name: "Search" }).click();
    await admin.waitForURL(/q=penhallow/);
    const rows = admin.locator("tbody tr");
    expect(await rows.count()).toBe(1);
    expect(await rows.first().textContent()).toContain(TEACHERS[0].email);
    await screenshot(admin, "accounts-admin-people");
    await admin.context().close();
  });

  it("a role the admin changes holds on the person's very next page, though their session was just looked up", async () => {
    const person = await signedIn(newcomer.email, "hazel-new-bow-hair", "/learn"); // the password the reset test set

    const admin = await (await browser.newContext()).newPage();
    await admin.goto(`${BASE_URL}/admin/people?q=${encodeURIComponent(newcomer.email)}`);
    await signIn(admin, "admin@larchmoor.example", DEMO_PASSWORD);
    await admin.waitForURL(/\/admin\/people/);
    await person.reload(); // the person's session, looked up again moments before the change
    await hydrated(admin.getByLabel(`Role of ${newcomer.name}`));
    await admin.getByLabel(`Role of ${newcomer.name}`).selectOption("teacher");
    await press(admin.getByRole("button", { name: "Save" }), admin.getByText(`${newcomer.name} is now a teacher.`));

    await person.goto(`${BASE_URL}/teach`);
    expect(await person.getByRole("heading", { level: 1 }).first().textContent()).toBe("Your students");
    await Promise.all([person.context().close(), admin.context().close()]);
  });
});
