// In the browser (issue 7): the demo admin filters and sorts payments, exports the filtered rows as
// CSV, refunds part of a payment with a reason, and the student's billing page shows that refund.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator, Page } from "playwright-core";
import { BASE_URL, follow, hydrated, launch, screenshot } from "./helpers/browser";
import { ADMIN, DEMO_PASSWORD, STUDENTS } from "@/db/seed-data/people";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function signIn(page: Page, email: string) {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => u.pathname !== "/sign-in");
}

/** Acts once on a control of the table, when it has hydrated, and waits for the address the table writes. */
async function toAddress(page: Page, control: Locator, act: () => Promise<void>, address: RegExp) {
  await hydrated(control);
  await Promise.all([page.waitForURL(address), act()]);
}

/** The table's total: its own request, so "Counting…" (NaN here) until it lands. */
const totalOf = async (page: Page) =>
  Number(((await page.getByTestId("table-total").textContent()) ?? "").match(/^(\d+)/)?.[1] ?? NaN);
const countedTotal = async (page: Page) => {
  await expect.poll(() => totalOf(page)).not.toBeNaN();
  return totalOf(page);
};

// STUDENTS[1] has a demo history of paid monthly renewals and no refunds (db/seed-data/billing-history.ts).
const student = STUDENTS[1];
const first = student.name.split(" ")[0];
const reason = "Missed a lesson: browser test";

describe("admin payments in a real browser", () => {
  it("filters, sorts, exports, refunds — and the student sees the refund", async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, ADMIN.email);
    await page.goto(`${BASE_URL}/admin/payments`);
    await page.getByRole("cell").first().waitFor();
    const everything = await countedTotal(page);
    expect(everything).toBeGreaterThan(100); // a year of demo payments
    // The pager follows the total (25 to a page) and stops at the last page.
    const pages = Math.ceil(everything / 25);
    await page.getByText(`Page 1 of ${pages}`).waitFor();
    const next = page.getByRole("navigation", { name: "Pages" }).getByRole("link", { name: "Next" });
    await toAddress(page, next, () => next.click(), /page=2/);
    await page.getByText(`Page 2 of ${pages}`).waitFor();
    await page.goto(`${BASE_URL}/admin/payments?page=${pages}`);
    await page.getByText(`Page ${pages} of ${pages}`).waitFor();
    const pager = page.getByRole("navigation", { name: "Pages" });
    expect(await pager.getByRole("link", { name: "Next" }).count()).toBe(0); // no page after the last
    expect(await pager.getByText("Next").getAttribute("aria-disabled")).toBe("true");
    // The pager follows the total's request; the rows come with the page's, which may land later.
    await page.getByRole("cell").first().waitFor();
    expect(await page.locator("tbody tr").count()).toBe(everything - (pages - 1) * 25);
    await page.goto(`${BASE_URL}/admin/payments`);
    await page.getByRole("cell").first().waitFor();

    await toAddress(
      page,
      page.getByRole("search", { name: "Filter the table" }),
      async () => {
        await page.getByLabel("Status").selectOption("paid");
        await page.getByLabel("Name or e-mail").fill(first.toLowerCase());
        await page.getByRole("button", { name: "Apply filters" }).click();
      },
      /status=paid/,
    );
    await page.getByText(/^\d+ rows? match/).waitFor();
    await expect.poll(() => totalOf(page)).toBeLessThan(everything);
    const filtered = await totalOf(page);
    expect(filtered).toBeGreaterThan(3);

    // A new order changes the address without rebuilding the table: the same elements stay in the page.
    const form = await page.getByRole("search", { name: "Filter the table" }).elementHandle();
    const amount = page.getByRole("link", { name: /^Amount/ });
    await toAddress(page, amount, () => amount.click(), /sort=amount/);
    await page.getByText(/^\d+ rows? match/).waitFor();
    expect(await form?.evaluate((el) => el.isConnected)).toBe(true);
    await toAddress(page, amount, () => amount.click(), /dir=asc/);
    // A reload keeps the filters (they live in the URL).
    await page.reload();
    await page.getByText(/^\d+ rows? match/).waitFor();
    expect(await page.getByLabel("Name or e-mail").inputValue()).toBe(first.toLowerCase());
    await expect.poll(() => totalOf(page)).toBe(filtered);
    const members = await page.locator("tbody tr td:nth-child(2) span.font-semibold").allTextContents();
    expect(new Set(members)).toEqual(new Set([student.name]));
    await screenshot(page, "admin-payments-filtered");

    // The export link carries the same filters; fetched with the admin's session, it has one line per row.
    const href = await page.getByRole("link", { name: "Export CSV" }).getAttribute("href");
    expect(href).toMatch(/status=paid/);
    const csv = await context.request.get(`${BASE_URL}${href}`);
    expect(csv.status()).toBe(200);
    const lines = (await csv.text()).split("\r\n").filter((l) => l.length > 0);
    expect(lines.length - 1).toBe(filtered); // minus the header line (RFC 4180 §2)

    // Refund £5.00 of the first row.
    await page
      .getByRole("button", { name: /^Refund / })
      .first()
      .click();
    const dialog = page.getByRole("dialog");
    await dialog.waitFor();
    expect(await dialog.getByTestId("refundable").textContent()).toMatch(/£18\.00/);
    await dialog.getByLabel(/Amount to refund/).fill("25.00");
    await dialog.getByLabel("Reason").fill(reason);
    await dialog.getByRole("button", { name: "Refund" }).click();
    await dialog.getByText(/At most £18\.00/).waitFor(); // more than the payment: refused in place
    await dialog.getByLabel(/Amount to refund/).fill("5.00");
    await dialog.getByRole("button", { name: "Refund" }).click();
    await dialog.waitFor({ state: "hidden" });
    // Now partly refunded, the payment leaves the "paid" view and shows under its new status.
    await expect.poll(() => totalOf(page)).toBe(filtered - 1);
    await toAddress(
      page,
      page.getByRole("search", { name: "Filter the table" }),
      async () => {
        await page.getByLabel("Status").selectOption("partially_refunded");
        await page.getByRole("button", { name: "Apply filters" }).click();
      },
      /status=partially_refunded/,
    );
    await page.getByRole("cell", { name: "£5.00" }).first().waitFor();
    expect(await page.getByRole("cell", { name: "partially refunded" }).count()).toBeGreaterThan(0);
    await screenshot(page, "admin-payments-refunded");
    await context.close();

    const mine = await browser.newContext({ viewport: { width: 375, height: 800 } });
    const sp = await mine.newPage();
    await signIn(sp, student.email);
    await sp.goto(`${BASE_URL}/learn/billing`);
    await sp.getByText(reason, { exact: false }).waitFor();
    expect(await sp.getByText(`£5.00 on`, { exact: false }).count()).toBeGreaterThan(0);
    expect(await sp.getByText("Partly refunded").count()).toBeGreaterThan(0);
    await screenshot(sp, "student-billing-refund");
    await mine.close();
  }, 120_000);

  it("sorts, pages and filters before the page's script has run: links and a GET form", async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, ADMIN.email);
    // The page's own scripts arrive empty, so it never hydrates: what a click does before it has. (React's
    // inline scripts still reveal the parts streamed in later, as they do before hydration.)
    await page.route("**/_next/static/chunks/**", (route) =>
      route.fulfill({ status: 200, contentType: "text/javascript", body: "" }),
    );
    await page.goto(`${BASE_URL}/admin/payments?status=paid`);
    await page.getByRole("link", { name: /^Amount/ }).waitFor();
    expect(await page.locator("html[data-hydrated]").count()).toBe(0);
    await Promise.all([page.waitForURL(/sort=amount/), page.getByRole("link", { name: /^Amount/ }).click()]);
    expect(new URL(page.url()).searchParams.get("status")).toBe("paid"); // the filter is kept
    expect(new URL(page.url()).searchParams.get("dir")).toBe("desc");
    await page.getByLabel("Status").selectOption("refunded");
    await Promise.all([
      page.waitForURL(/status=refunded/),
      page.getByRole("button", { name: "Apply filters" }).click(),
    ]);
    expect(new URL(page.url()).searchParams.get("sort")).toBe("amount"); // the order is kept
    await Promise.all([
      page.waitForURL(/\/admin\/payments\?sort=amount&dir=desc$/),
      page.getByRole("link", { name: "Clear" }).click(),
    ]);
    await context.close();
  });

  it("shows memberships, enrolments and the revenue chart", async () => {
    const context = await browser.newContext({ viewport: { width: 375, height: 800 } });
    const page = await context.newPage();
    await signIn(page, ADMIN.email);
    await page.goto(`${BASE_URL}/admin/memberships?status=past_due`);
    await page
      .getByText(/grace until/)
      .first()
      .waitFor(); // the demo member in grace
    await page.goto(`${BASE_URL}/admin/enrolments?sort=course&dir=asc`);
    await page.getByRole("cell", { name: /Alder/ }).first().waitFor();
    expect(await countedTotal(page)).toBeGreaterThan(10);
    // The roster (an admin's is every student) shows 25 to a page.
    await page.goto(`${BASE_URL}/teach`);
    const caption = await page
      .locator("caption")
      .filter({ hasText: /students?$/ })
      .first()
      .textContent();
    const students = Number(caption?.match(/of (\d+) student/)?.[1] ?? NaN);
    expect(students).toBeGreaterThan(25); // 28 demo students, and any the other browser tests added
    const pages = Math.ceil(students / 25);
    await page.getByText(`Page 1 of ${pages}`).waitFor();
    expect(await page.locator("tbody tr").count()).toBe(25);
    await follow(
      page,
      page.getByRole("navigation", { name: "Roster pages" }).getByRole("link", { name: "Next" }),
      /\/teach\?page=2$/,
    );
    await page.getByText(`Page 2 of ${pages}`).waitFor();
    expect(await page.locator("tbody tr").count()).toBe(Math.min(25, students - 25));
    // Sorting is a link too: a new order starts again at page 1, and the header says how it is sorted.
    await follow(page, page.getByRole("link", { name: "Last practice" }), /\/teach\?sort=lastPractice&dir=asc$/);
    await page.locator("th[aria-sort=ascending]", { hasText: "Last practice" }).waitFor();
    await page.getByText(`Page 1 of ${pages}`).waitFor();
    // The name filter narrows the list as it is typed and is kept in the address, so a reload keeps it.
    await page.getByLabel("Filter by name").fill("Alder");
    await page.waitForURL(/\/teach\?sort=lastPractice&dir=asc&q=Alder$/);
    const names = await page.locator("tbody tr td:first-child").allInnerTexts();
    expect(names.length).toBeGreaterThan(0);
    expect(names.every((n) => n.includes("Alder"))).toBe(true);
    await page.reload();
    await page.locator("tbody tr td:first-child").first().waitFor();
    expect(await page.locator("tbody tr td:first-child").allInnerTexts()).toEqual(names);
    expect(await page.getByLabel("Filter by name").inputValue()).toBe("Alder");
    expect(await page.locator("th[aria-sort=ascending]").innerText()).toContain("Last practice");
    await page.goto(`${BASE_URL}/admin/revenue`);
    await page.getByRole("table", { name: "Revenue by month in GBP" }).waitFor();
    expect(await page.locator("table[aria-label], table").last().locator("tbody tr").count()).toBe(12);
    await page.locator(".recharts-bar-rectangle").first().waitFor(); // the bars are drawn
    await screenshot(page, "admin-revenue");
    await context.close();
  }, 60_000);
});
