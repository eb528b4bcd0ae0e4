import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { authWorld, type AuthWorld } from "./helpers/auth-world";
import { emailTokens, rateLimits } from "@/db/schema";

// Accounts probed as an attacker would: redirects after sign-in, a second sign-up for a taken
// address, guessing passwords, flooding an address with e-mail, racing one invitation.

let w: AuthWorld;
let A: typeof import("@/lib/auth/actions");
let signUpSent: (email: string) => string;
let resetSent: (email: string) => string;

beforeAll(async () => {
  w = await authWorld();
  A = await import("@/lib/auth/actions");
  signUpSent = (await import("@/lib/auth/sign-up")).signUpSentMessage;
  resetSent = (await import("@/lib/auth/password-reset")).resetSentMessage;
});
afterAll(async () => {
  await w?.close();
});

let ipN = 0;
/** A visitor from an address of its own (per-IP limits stay out of the way unless a test shares one). */
const visitor = async (ip = `198.51.100.${++ipN}`) => (await w.context(undefined, ip)).ctx;
const templates = async (email: string) => (await w.mailsTo(email)).map((m) => m.template);
/** Moves every e-mailed link of a person into the past, as if `minutes` had gone by. */
const ageTokens = (userId: string, minutes: number) =>
  w.db
    .update(emailTokens)
    .set({ createdAt: sql`${emailTokens.createdAt} - make_interval(mins => ${minutes})` })
    .where(eq(emailTokens.userId, userId));

describe("the return address after sign-in", () => {
  it("follows a path on this site and sends everything else home", async () => {
    await w.person("student", { email: "next@people.example", password: "next-person-pw" });
    const go = async (next: string) =>
      (await A.signInAction(await visitor(), { email: "next@people.example", password: "next-person-pw", next }))
        .redirectTo;
    expect(await go("/learn/practice")).toBe("/learn/practice");
    for (const bad of ["/\t/evil.example", "/\n/evil.example", "//evil.example", "/\\evil.example", "/%09/x.example"])
      expect(await go(bad)).toBe("/learn");
  });
});

describe("a second sign-up for an address that has an account", () => {
  it("never changes an unconfirmed account's password or name, and mails the owner a fresh link", async () => {
    const first = await A.signUpAction(await visitor(), {
      name: "Briony Owner",
      email: "briony@new.example",
      password: "briony-owns-this",
    });
    const owner = (await w.userByEmail("briony@new.example"))!;
    await ageTokens(owner.id, 10); // past the one-mail-per-few-minutes rule
    const second = await A.signUpAction(await visitor(), {
      name: "Mallory Taker",
      email: "Briony@new.example",
      password: "mallory-took-it",
    });
    // Same answer as a fresh address (no account enumeration).
    expect(first).toEqual({ status: 200, message: signUpSent("briony@new.example") });
    expect(second).toEqual({ status: 200, message: signUpSent("Briony@new.example") });
    const after = (await w.userByEmail("briony@new.example"))!;
    expect(after.passwordHash).toBe(owner.passwordHash);
    expect(after.name).toBe("Briony Owner");
    expect(after.emailVerifiedAt).toBeNull();
    expect(await templates("briony@new.example")).toEqual(["verify-email", "welcome"]);

    // The link confirms the owner's account, with the owner's password; the second one opens nothing.
    const token = await w.tokenMailed("briony@new.example", "verify-email");
    expect((await A.verifyEmailAction(await visitor(), { token })).status).toBe(200);
    const taker = await A.signInAction(await visitor(), { email: "briony@new.example", password: "mallory-took-it" });
    expect(taker.status).toBe(401);
    const ok = await A.signInAction(await visitor(), { email: "briony@new.example", password: "briony-owns-this" });
    expect(ok.status).toBe(200);
  });

  it("answers a sign-up for a confirmed account the same way, and leaves it alone", async () => {
    const owner = await w.person("student", { email: "kept@people.example", name: "Kept Name" });
    const res = await A.signUpAction(await visitor(), {
      name: "Someone New",
      email: "kept@people.example",
      password: "someone-new-pw",
    });
    expect(res).toEqual({ status: 200, message: signUpSent("kept@people.example") });
    const after = (await w.userByEmail("kept@people.example"))!;
    expect([after.passwordHash, after.name]).toEqual([owner.passwordHash, "Kept Name"]);
  });

  it("makes one account of two sign-ups at once for a new address, and answers both alike", async () => {
    const both = await Promise.all(
      [1, 2, 3].map(async (i) =>
        A.signUpAction(await visitor(), { name: `Racer ${i}`, email: "race@new.example", password: `racer-pw-${i}xx` }),
      ),
    );
    expect(both.map((r) => r.status)).toEqual([200, 200, 200]);
    expect(new Set(both.map((r) => r.message)).size).toBe(1);
    const n = await w.db.execute(sql`select count(*)::int as n from users where lower(email) = 'race@new.example'`);
    expect(n[0].n).toBe(1);
  });
});

describe("guessing a password", () => {
  it("slows the guessing address, and still lets the right password in from another address", async () => {
    const admin = await w.person("admin", { email: "head@people.example", password: "the-real-admin-pw" });
    const attacker = "203.0.113.66";
    const answers: number[] = [];
    for (let i = 0; i < 10; i++)
      answers.push(
        (await A.signInAction(await visitor(attacker), { email: admin.email, password: `guess-${i}-xyz` })).status,
      );
    expect(answers.filter((s) => s === 401).length).toBeGreaterThanOrEqual(5);
    const blocked = await A.signInAction(await visitor(attacker), { email: admin.email, password: "guess-x-xyz" });
    expect(blocked.status).toBe(429);
    expect(blocked.message).toMatch(/try again in/i);
    // Even the right password waits on the guessing address ...
    const slowed = await A.signInAction(await visitor(attacker), { email: admin.email, password: "the-real-admin-pw" });
    expect(slowed.status).toBe(429);
    // ... but the admin from their own address, never wrong before, gets in.
    const real = await A.signInAction(await visitor("192.0.2.200"), {
      email: admin.email,
      password: "the-real-admin-pw",
    });
    expect(real).toMatchObject({ status: 200, redirectTo: "/admin/people" });
  });

  it("refuses parallel guesses from one address past the back-off, not only one at a time", async () => {
    const p = await w.person("student", { email: "burst@people.example", password: "burst-real-pw" });
    const ip = "203.0.113.99";
    const burst = await Promise.all(
      Array.from(
        { length: 24 },
        async (_, i) =>
          (await A.signInAction(await visitor(ip), { email: p.email, password: `burst-guess-${i}` })).status,
      ),
    );
    expect(burst.filter((s) => s === 401).length).toBeLessThanOrEqual(10);
    expect(burst.filter((s) => s === 429).length).toBeGreaterThanOrEqual(14);
  });

  it("counts per address: many accounts tried from one address trip its limit", async () => {
    const ip = "203.0.113.150";
    // The per-IP window is pre-filled to its limit, as a hundred attempts would leave it.
    const { ipKey, LIMITS } = await import("@/lib/auth/rate-limit");
    const windowMs = LIMITS.signInIp.windowSeconds * 1000;
    const windowStart = new Date(Math.floor(Date.now() / windowMs) * windowMs);
    await w.db.insert(rateLimits).values({ key: ipKey("sign-in", ip), windowStart, count: LIMITS.signInIp.max });
    const res = await A.signInAction(await visitor(ip), { email: "anyone@people.example", password: "whatever-pw" });
    expect(res.status).toBe(429);
  });
});

describe("e-mail to one address", () => {
  it("sends at most one reset link per few minutes, answering every request alike", async () => {
    const p = await w.person("student", { email: "flood@people.example" });
    const answers = [];
    for (let i = 0; i < 4; i++) answers.push(await A.requestResetAction(await visitor(), { email: p.email }));
    expect(answers.every((a) => a.message === resetSent(p.email) && a.status === 200)).toBe(true);
    expect(await templates(p.email)).toEqual(["password-reset"]);
    await ageTokens(p.id, 10);
    await A.requestResetAction(await visitor(), { email: p.email });
    expect(await templates(p.email)).toEqual(["password-reset", "password-reset"]);
  });

  it("sends at most one confirmation per few minutes however often an unconfirmed account signs in", async () => {
    await A.signUpAction(await visitor(), { name: "Quiet One", email: "quiet@new.example", password: "quiet-one-pw" });
    for (let i = 0; i < 3; i++) {
      const res = await A.signInAction(await visitor(), { email: "quiet@new.example", password: "quiet-one-pw" });
      expect(res.status).toBe(403);
    }
    expect(await templates("quiet@new.example")).toEqual(["welcome"]);
  });

  it("sends one link when several requests arrive at once", async () => {
    const p = await w.person("student", { email: "burstmail@people.example" });
    await Promise.all(Array.from({ length: 6 }, async () => A.requestResetAction(await visitor(), { email: p.email })));
    expect(await templates(p.email)).toEqual(["password-reset"]);
  });
});

describe("one invitation accepted many times at once", () => {
  it("makes one account; the others are told it was just accepted (409) or is used up (404), never a 500", async () => {
    const teacher = await w.person("teacher");
    const { ctx } = await w.context(await w.cookieFor(teacher.id));
    await A.inviteStudentsAction(ctx, { addresses: "eight@new.example" });
    const token = await w.tokenMailed("eight@new.example", "invitation");
    const answers = await Promise.all(
      Array.from({ length: 8 }, async (_, i) =>
        A.acceptInvitationAction(await visitor(), { token, name: `Eight ${i}`, password: "eight-ways-pw" }),
      ),
    );
    const statuses = answers.map((a) => a.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.every((s) => s === 200 || s === 409 || s === 404)).toBe(true);
    for (const a of answers.filter((x) => x.status === 409)) expect(a.message).toMatch(/just accepted/);
    const n = await w.db.execute(sql`select count(*)::int as n from users where email = 'eight@new.example'`);
    expect(n[0].n).toBe(1);
  });
});
