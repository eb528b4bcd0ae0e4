import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { DEMO_PASSWORD, TEACHERS } from "@/db/seed-data/people";
import { BASE_URL, follow, hydrated, launch, press, screenshot } from "./helpers/browser";
import { mailedLink } from "./helpers/mail-link";

// The journey from paying to playing (PRODUCT.md §5, journey 1), in Debian's Chromium against the app
// and the stand-ins `npm test` starts: a visitor chooses a plan, signs up, confirms the address from
// the captured e-mail, pays on the Stripe stand-in's card page with Stripe's test card 4242 4242 4242
// 4242 (Stripe docs, "Testing"), finds a course in the catalogue, starts it, checks in the first stage
// of its first tune played from memory, sees the next stage open at once (First Steps is self-paced,
// db/seed-data/catalogue.ts) and the ladder move on; the course's lead teacher then sees the new member.
// Only the first address is typed: every other page is reached by a link, a button or a redirect, and
// every click happens once, after the page has hydrated.
let browser: Browser;
let page: Page;
const stamp = Date.now().toString(36);
let started = 0; // when the sign-up was sent
const newcomer = { name: "Wren Halloran", email: `wren.${stamp}@newcomers.example`, password: "wren-plays-by-ear" };
const COURSE = "First Steps on the Fiddle";
const FIRST_RUNG = "Little Biscuit";
const LEAD = TEACHERS[0]; // Isla Penhallow leads First Steps

beforeAll(async () => {
  browser = await launch();
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
});
afterAll(async () => {
  await browser?.close();
});

async function signIn(email: string, password: string) {
  await hydrated(page.getByRole("button", { name: "Sign in" }));
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

describe("from paying to playing, in a real browser", () => {
  it("a visitor chooses a plan and signs up, and the plan is kept", async () => {
    await page.goto(BASE_URL);
    await follow(page, page.getByRole("banner").getByRole("link", { name: "Plans" }), /\/plans$/);
    await follow(page, page.getByRole("link", { name: "Choose Monthly membership" }), /\/sign-up\?plan=/);
    await page.getByText("You chose Monthly membership").waitFor();
    await hydrated(page.getByRole("button", { name: "Create my account" }));
    await page.getByLabel("Your name").fill(newcomer.name);
    await page.getByLabel("E-mail address").fill(newcomer.email);
    await page.getByLabel("Password").fill(newcomer.password);
    started = Date.now() - 1000; // the stand-in's clock and ours are the same machine's
    await press(page.getByRole("button", { name: "Create my account" }), page.getByText("Check your e-mail"));
    await screenshot(page, "journey-signed-up");
  });

  it("confirms the address from the captured e-mail and goes straight on to pay, then pays with 4242", async () => {
    // The job worker sends the outbox's message a moment after the sign-up: wait until the stand-in holds it,
    // then open it from the captured e-mail page as a person would.
    await mailedLink(newcomer.email, "/verify-email", { after: started });
    await follow(page, page.getByRole("link", { name: "open the captured e-mail" }), /\/dev\/mail/);
    const row = page.getByRole("row").filter({ hasText: newcomer.email });
    await follow(page, row.getByRole("link"), /\/dev\/mail\?id=/);
    await page.getByRole("heading", { level: 2, name: new RegExp(`Welcome to Rosinwood, ${newcomer.name}`) }).waitFor();
    await follow(page, page.getByRole("link", { name: /\/verify-email\?token=.*plan=/ }), /\/verify-email\?/);
    await hydrated(page.getByRole("button", { name: "Confirm my address" }));
    await Promise.all([
      page.waitForURL(/\/sign-in\?confirmed=1&next=%2Flearn%2Fbilling%2Fcheckout/),
      page.getByRole("button", { name: "Confirm my address" }).click(),
    ]);
    await signIn(newcomer.email, newcomer.password);
    // Signing in leads to the chosen plan's checkout, which opens the payment stand-in's card page.
    await page.waitForURL(/\/pay\/cs_/, { timeout: 30_000 });
    await screenshot(page, "journey-card-page");
    await page.getByLabel("Card number").fill("4242 4242 4242 4242");
    await page.getByLabel("Expiry date").fill("12 / 34");
    await page.getByLabel("Security code (CVC)").fill("123");
    await page.getByLabel("Name on card").fill(newcomer.name);
    await page.getByRole("button", { name: "Pay" }).click();
    // The welcome page waits for the webhook to write the membership, then shows the courses to choose from.
    await page.waitForURL(/\/learn\/courses\?welcome=1/, { timeout: 60_000 });
    await page.getByText("Your membership is active.").waitFor();
  });

  it("finds the course in the catalogue, reads its page and starts it", async () => {
    await follow(page, page.getByRole("main").getByRole("link", { name: "Browse the catalogue" }), /\/catalogue$/);
    await follow(page, page.getByRole("link", { name: COURSE, exact: true }), /\/catalogue\/courses\/first-steps$/);
    await page.getByRole("heading", { level: 1, name: COURSE }).waitFor();
    const offer = page.getByTestId("course-offer");
    expect(await offer.textContent()).toContain("Your membership opens this course.");
    expect(await page.getByRole("main").textContent()).toContain(`Led by ${LEAD.name}`);
    await screenshot(page, "journey-course-page");
    await hydrated(offer.getByRole("button", { name: "Start this course" }));
    await Promise.all([
      page.waitForURL(/\/learn\/courses\/first-steps$/),
      offer.getByRole("button", { name: "Start this course" }).click(),
    ]);
    await page.getByRole("heading", { level: 1, name: COURSE }).waitFor();
    expect(await page.getByTestId("ladder-pace").textContent()).toMatch(/^Self-paced course\. Each check-in opens/);
    expect(await page.locator("[data-rung-state]").first().getAttribute("data-rung-state")).toBe("open");
    expect(await page.locator("[data-rung-state]").nth(1).getAttribute("data-rung-state")).toBe("locked");
  });

  it("checks in the first stage played from memory; the next stage opens at once and the ladder moves on", async () => {
    await follow(page, page.getByRole("link", { name: `Practise ${FIRST_RUNG}` }), /\/learn\/tunes\//);
    await page.getByRole("heading", { level: 1, name: FIRST_RUNG }).waitFor();
    const next = page.getByTestId("climb-next");
    await next.waitFor();
    expect(await next.textContent()).toMatch(/^Stage 1 \(.+\)\. Checking in opens stage 2 \(.+\) at once\.$/);
    expect(await page.getByRole("radio", { name: /^2\. / }).isDisabled()).toBe(true);
    const form = page.getByRole("form", { name: "Check in stage 1" });
    await hydrated(form.getByRole("button", { name: "Check in stage 1" }));
    await form.getByRole("radio", { name: "4", exact: true }).check();
    await form.getByRole("checkbox", { name: "Played from memory" }).check();
    await press(form.getByRole("button", { name: "Check in stage 1" }), page.getByText(/stage 2 \(.+\) is open now/));
    // The stage selector moves to the stage just opened, and it is no longer locked.
    const stage2 = page.getByRole("radio", { name: /^2\. / });
    await page.waitForFunction((el) => el instanceof HTMLInputElement && el.checked, await stage2.elementHandle());
    expect(await stage2.isDisabled()).toBe(false);
    await page
      .getByTestId("climb-next")
      .filter({ hasText: /^Stage 2 \(.+\)\. Checking in opens stage 3/ })
      .waitFor();
    await screenshot(page, "journey-stage-opened");

    await follow(page, page.getByRole("main").getByRole("link", { name: COURSE, exact: true }), /\/learn\/courses\//);
    const first = page.locator("[data-rung-state]").first();
    await page.locator("[data-rung-state=done]").first().waitFor();
    expect(await first.getAttribute("data-rung-state")).toBe("done");
    expect(await page.locator("[data-rung-state]").nth(1).getAttribute("data-rung-state")).toBe("open");
    expect(await page.getByRole("main").textContent()).toMatch(/1 of \d+ rungs done/);
    await screenshot(page, "journey-ladder-progress");
  });

  it("the course's lead teacher sees the new member on the roster", async () => {
    await hydrated(page.getByRole("banner").getByRole("button", { name: "Sign out" }));
    await Promise.all([
      page.waitForURL((url) => !url.pathname.startsWith("/learn")),
      page.getByRole("banner").getByRole("button", { name: "Sign out" }).click(),
    ]);
    await follow(page, page.getByRole("banner").getByRole("link", { name: "Sign in" }), /\/sign-in/);
    await signIn(LEAD.email, DEMO_PASSWORD);
    await page.waitForURL(/\/teach$/);
    const member = page.getByRole("list", { name: "New members this week" }).getByRole("listitem", {
      name: `${newcomer.name}, new on ${COURSE}`,
    });
    await member.waitFor();
    expect(await member.textContent()).toContain("since");
    await screenshot(page, "journey-teacher-roster");
  });
});
