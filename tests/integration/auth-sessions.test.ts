import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { authWorld, TEST_APP_URL, type AuthWorld } from "./helpers/auth-world";
import { rateLimits, sessions } from "@/db/schema";
import { connect } from "@/db/client";

let w: AuthWorld;
let A: typeof import("@/lib/auth/actions");
let signOutRoute: typeof import("@/app/api/auth/sign-out/route");
let RL: typeof import("@/lib/auth/rate-limit");
const DAY = 86_400_000;
const NO_PARAMS = { params: Promise.resolve({}) };

beforeAll(async () => {
  w = await authWorld();
  A = await import("@/lib/auth/actions");
  signOutRoute = await import("@/app/api/auth/sign-out/route");
  RL = await import("@/lib/auth/rate-limit");
});
afterAll(async () => {
  await w?.close();
});

describe("sessions", () => {
  it("expire: a session past its date signs nobody in and the cookie is blanked", async () => {
    const p = await w.person("student");
    const cookie = await w.cookieFor(p.id);
    await w.db
      .update(sessions)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(sessions.userId, p.id));
    const { ctx, set } = await w.context(cookie);
    expect(ctx.user).toBeNull();
    expect(set[0]?.value).toBe("");
  });

  it("slide: a session used in the second half of its 30 days is extended and re-sent", async () => {
    const p = await w.person("student");
    const cookie = await w.cookieFor(p.id);
    await w.db
      .update(sessions)
      .set({ expiresAt: new Date(Date.now() + 10 * DAY) })
      .where(eq(sessions.userId, p.id));
    const { ctx, set } = await w.context(cookie);
    expect(ctx.user?.id).toBe(p.id);
    expect(set[0]?.name).toBe("rosinwood_session");
    const [row] = await w.db.select().from(sessions).where(eq(sessions.userId, p.id));
    expect(row.expiresAt.getTime()).toBeGreaterThan(Date.now() + 29 * DAY);
    // The cookie lives exactly as long as the session it names (a browser keeps it no longer).
    const cookieEnds = Date.now() + (set[0]?.attributes.maxAge ?? 0) * 1000;
    expect(Math.abs(cookieEnds - row.expiresAt.getTime())).toBeLessThan(60_000);
  });

  it("end at sign-out (the header's form POST), which answers with a redirect home", async () => {
    const p = await w.person("teacher");
    const cookie = await w.cookieFor(p.id);
    const res = await signOutRoute.POST(
      new Request(`${TEST_APP_URL}/api/auth/sign-out`, { method: "POST", headers: { cookie, origin: TEST_APP_URL } }),
      NO_PARAMS,
    );
    expect(res.status).toBe(303);
    expect(res.headers.get("location")).toBe("/");
    expect(res.headers.get("set-cookie")).toMatch(/rosinwood_session=;/);
    expect((await w.context(cookie)).ctx.user).toBeNull();
  });

  it("a cross-site POST is refused by the Origin check and leaves the session alone", async () => {
    const p = await w.person("teacher");
    const cookie = await w.cookieFor(p.id);
    const attempts: Record<string, string>[] = [
      { cookie, origin: "https://elsewhere.example" },
      { cookie, "sec-fetch-site": "cross-site" },
    ];
    for (const headers of attempts) {
      const res = await signOutRoute.POST(
        new Request(`${TEST_APP_URL}/api/auth/sign-out`, { method: "POST", headers }),
        NO_PARAMS,
      );
      expect(res.status).toBe(403);
    }
    expect((await w.context(cookie)).ctx.user?.id).toBe(p.id);
  });
});

describe("rate limits", () => {
  it("trigger past the limit with a 'try again in N minutes' message, then lift when the window passes", async () => {
    const limit = { max: 3, windowSeconds: 15 * 60 };
    const start = new Date("2026-03-02T10:00:00Z");
    for (let i = 0; i < 3; i++) await RL.hit(w.db, "test:lift", limit, start);
    const late = new Date(start.getTime() + 60_000);
    const error = await RL.hit(w.db, "test:lift", limit, late).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(Error);
    expect((error as Error).message).toBe("Too many attempts. Please try again in 14 minutes.");
    await expect(RL.hit(w.db, "test:lift", limit, new Date(start.getTime() + 15 * 60_000))).resolves.toBeUndefined();
    // The spent window is tidied away when the next one starts.
    const rows = await w.db.select().from(rateLimits).where(eq(rateLimits.key, "test:lift"));
    expect(rows).toHaveLength(1);
  });

  it("are shared by every app instance: counts from two separate connections add up", async () => {
    const url = process.env.DATABASE_URL!;
    const [one, two] = [connect(url), connect(url)];
    try {
      const limit = { max: 4, windowSeconds: 60 };
      const now = new Date();
      await Promise.all([1, 2].map(() => RL.hit(one.db, "test:shared", limit, now)));
      await Promise.all([1, 2].map(() => RL.hit(two.db, "test:shared", limit, now)));
      await expect(RL.hit(one.db, "test:shared", limit, now)).rejects.toThrow(/try again/);
    } finally {
      await Promise.all([one.close(), two.close()]);
    }
  });

  it("slow guessing without locking the owner out, and limit per IP across many accounts", async () => {
    const p = await w.person("student", { email: "guessed@people.example" });
    const statuses: number[] = [];
    for (let i = 0; i <= RL.LIMITS.signInAddress.max + 2; i++) {
      const { ctx } = await w.context(undefined, `198.51.100.${i + 1}`);
      statuses.push((await A.signInAction(ctx, { email: p.email, password: `guess-number-${i}` })).status);
    }
    // Each address that has not failed on the account has its password checked (tests/integration/auth-abuse
    // shows an address that keeps guessing being made to wait).
    expect(statuses.every((s) => s === 401)).toBe(true);
    const res = await A.signInAction((await w.context(undefined, "203.0.113.250")).ctx, {
      email: p.email,
      password: "spruce-and-maple-top",
    });
    expect(res.status).toBe(200); // the right password from the owner's own address is never locked out

    const ip = "203.0.113.77";
    await w.db.insert(rateLimits).values({
      key: RL.ipKey("reset", ip),
      windowStart: new Date(Math.floor(Date.now() / 3_600_000) * 3_600_000),
      count: RL.LIMITS.resetIp.max,
    });
    const blocked = await A.requestResetAction((await w.context(undefined, ip)).ctx, {
      email: "anyone@people.example",
    });
    expect(blocked.status).toBe(429);
  });

  it("limit sign-ups per address", async () => {
    let status = 0;
    for (let i = 0; i <= RL.LIMITS.signUpAddress.max; i++) {
      const { ctx } = await w.context(undefined, `198.51.100.${100 + i}`);
      status = (
        await A.signUpAction(ctx, { name: "Repeat", email: "repeat@new.example", password: "repeat-sign-up-pw" })
      ).status;
    }
    expect(status).toBe(429);
  });
});

describe("every request asks PostgreSQL for the session and its person", () => {
  it("sees at once a role changed, an account disabled and sessions ended, whoever wrote them", async () => {
    const admin = await w.person("admin");
    const p = await w.person("student");
    const [cookie, other] = [await w.cookieFor(p.id), await w.cookieFor(p.id)];
    expect((await w.context(cookie)).ctx.user?.role).toBe("student");

    const { changeRole } = await import("@/lib/auth/people");
    const res = await changeRole((await w.context(await w.cookieFor(admin.id))).ctx, { userId: p.id, role: "teacher" });
    expect(res.status).toBe(200);
    expect((await w.context(cookie)).ctx.user?.role).toBe("teacher");

    await w.setUser(p.id, { disabled: true }); // another connection, as another process would write it
    expect((await w.context(cookie)).ctx.user).toBeNull();
    await w.setUser(p.id, { disabled: false });
    expect((await w.context(other)).ctx.user?.id).toBe(p.id);

    await w.lucia().invalidateUserSessions(p.id);
    expect((await w.context(cookie)).ctx.user).toBeNull();
    expect((await w.context(other)).ctx.user).toBeNull();
  });
});
