// A signed-out, signed-out-everywhere, demoted or disabled person loses access on the very next request
// in every web process. npm test serves the app with WEB_CONCURRENCY=2 (scripts/test.sh), and each
// request below goes on a connection of its own, which node:cluster hands to the processes in turn.
import { randomBytes } from "node:crypto";
import { request } from "node:http";
import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { connect, type Db } from "@/db/client";
import { sessions, users } from "@/db/schema";
import { BASE_URL, hydrated, launch } from "./helpers/browser";
import { mailedLink } from "./helpers/mail-link";

const TIMES = 50;
const stamp = Date.now().toString(36);
let browser: Browser;
let db: Db;
let close: () => Promise<void>;

beforeAll(async () => {
  browser = await launch();
  ({ db, close } = connect(process.env.DATABASE_URL ?? ""));
});
afterAll(async () => {
  await browser?.close();
  await close?.();
});

async function person(role: "student" | "teacher", label: string) {
  const [row] = await db
    .insert(users)
    .values({
      email: `${label}.${stamp}@sessions.example`,
      name: `Session ${label}`,
      role,
      emailVerifiedAt: new Date(),
    })
    .returning();
  return row;
}

/** A session as sign-in makes it (lucia: a row with a random id, 30 days), and its cookie. */
async function cookieFor(userId: string): Promise<string> {
  const id = randomBytes(20).toString("hex");
  await db.insert(sessions).values({ id, userId, expiresAt: new Date(Date.now() + 30 * 86_400_000) });
  return `rosinwood_session=${id}`;
}

function ask(path: string, cookie: string, method = "GET"): Promise<number> {
  return new Promise((resolve, reject) => {
    const headers = { cookie, origin: BASE_URL };
    request(`${BASE_URL}${path}`, { method, agent: false, headers }, (res) => {
      res.resume();
      resolve(res.statusCode ?? 0);
    })
      .on("error", reject)
      .end();
  });
}

async function statuses(path: string, cookie: string, times = TIMES): Promise<number[]> {
  const out: number[] = [];
  for (let i = 0; i < times; i++) out.push(await ask(path, cookie));
  return out;
}

describe("a change to a session or a person holds at once in every web process", () => {
  it("sign-out: the old cookie is refused", async () => {
    const p = await person("student", "out");
    const cookie = await cookieFor(p.id);
    expect(await statuses("/api/courses/mine", cookie, 10)).toEqual(Array(10).fill(200));
    expect(await ask("/api/auth/sign-out", cookie, "POST")).toBe(303);
    expect(await statuses("/api/courses/mine", cookie)).toEqual(Array(TIMES).fill(401));
  });

  it("sign-out everywhere (a password reset): every old cookie is refused", async () => {
    const p = await person("student", "reset");
    const [phone, laptop] = [await cookieFor(p.id), await cookieFor(p.id)];
    for (const cookie of [phone, laptop])
      expect(await statuses("/api/courses/mine", cookie, 10)).toEqual(Array(10).fill(200));

    const page = await (await browser.newContext()).newPage();
    const asked = Date.now() - 1000;
    await page.goto(`${BASE_URL}/forgot-password`);
    await page.getByLabel("E-mail address").fill(p.email);
    await hydrated(page.getByRole("button", { name: "Send me a reset link" }));
    await page.getByRole("button", { name: "Send me a reset link" }).click();
    await page.getByText(`If an account exists for ${p.email}`).waitFor();
    await page.goto(await mailedLink(p.email, "/reset-password", { after: asked }));
    await page.getByLabel("New password").fill("a-new-set-of-strings");
    await hydrated(page.getByRole("button", { name: "Save the new password" }));
    await page.getByRole("button", { name: "Save the new password" }).click();
    await page.waitForURL(/\/sign-in\?reset=done/);
    await page.context().close();

    for (const cookie of [phone, laptop])
      expect(await statuses("/api/courses/mine", cookie)).toEqual(Array(TIMES).fill(401));
  });

  // Written straight to the table, as the admin's page or another process would: no process is told.
  it("a role taken away: the teacher's old cookie is refused the teacher's data", async () => {
    const p = await person("teacher", "demoted");
    const cookie = await cookieFor(p.id);
    expect(await statuses("/api/teach/roster", cookie, 10)).toEqual(Array(10).fill(200));
    await db.update(users).set({ role: "student" }).where(eq(users.id, p.id));
    expect(await statuses("/api/teach/roster", cookie)).toEqual(Array(TIMES).fill(403));
  });

  it("a disabled account: the old cookie signs nobody in", async () => {
    const p = await person("student", "disabled");
    const cookie = await cookieFor(p.id);
    expect(await statuses("/api/courses/mine", cookie, 10)).toEqual(Array(10).fill(200));
    await db.update(users).set({ disabled: true }).where(eq(users.id, p.id));
    expect(await statuses("/api/courses/mine", cookie)).toEqual(Array(TIMES).fill(401));
    const [{ left }] = await db.execute<{ left: number }>(
      sql`select count(*)::int as left from sessions where user_id = ${p.id}`,
    );
    expect(left).toBe(1); // refused by the account's state, not by the session's removal
  });
});
