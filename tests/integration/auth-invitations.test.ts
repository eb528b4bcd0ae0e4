import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { authWorld, type AuthWorld } from "./helpers/auth-world";
import { invitations } from "@/db/schema";

let w: AuthWorld;
let A: typeof import("@/lib/auth/actions");
let INV: typeof import("@/lib/auth/accept-invitation");
let roster: (teacherId: string) => Promise<string[]>;

beforeAll(async () => {
  w = await authWorld();
  A = await import("@/lib/auth/actions");
  INV = await import("@/lib/auth/accept-invitation");
  const { listRoster } = await import("@/db/queries/people");
  roster = async (id) => (await listRoster(w.db, id)).map((r) => r.email);
});
afterAll(async () => {
  await w?.close();
});

const as = async (user: { id: string } | null) => (await w.context(user ? await w.cookieFor(user.id) : undefined)).ctx;

describe("a teacher invites students", () => {
  it("mails each pasted address once and lists the ones that are not addresses", async () => {
    const teacher = await w.person("teacher", { name: "Isolde Marsh" });
    const bad = await A.inviteStudentsAction(await as(teacher), { addresses: "ok@new.example, nope" });
    expect(bad.status).toBe(400);
    expect(bad.fieldErrors?.addresses).toMatch(/nope/);
    expect(await w.mailsTo("ok@new.example")).toHaveLength(0);

    const res = await A.inviteStudentsAction(await as(teacher), {
      addresses: "wren@new.example\nOak@new.example, wren@NEW.example",
    });
    expect(res.status).toBe(200);
    expect(res.message).toMatch(/2 addresses/);
    const mails = [...(await w.mailsTo("wren@new.example")), ...(await w.mailsTo("oak@new.example"))];
    expect(mails.map((m) => m.template)).toEqual(["invitation", "invitation"]);
    expect(JSON.stringify(mails[0].payload)).toContain("Isolde Marsh");
  });

  it("the link creates the account, signs it in and puts it on that teacher's roster, once", async () => {
    const teacher = (await w.userByEmail("teacher1@people.example"))!;
    const token = await w.tokenMailed("wren@new.example", "invitation");
    const shown = await INV.describeInvitation(token);
    expect(shown).toMatchObject({ email: "wren@new.example", role: "student", needsSignIn: false });

    const weak = await A.acceptInvitationAction(await as(null), { token, name: "Wren", password: "short" });
    expect(weak.status).toBe(400);
    expect(weak.fieldErrors?.password).toMatch(/at least/);

    const v = await w.context();
    const ok = await A.acceptInvitationAction(v.ctx, { token, name: "Wren Tally", password: "wren-tally-reel" });
    expect(ok).toMatchObject({ status: 200, redirectTo: "/learn" });
    expect(v.set.find((c) => c.name === "rosinwood_session")?.value).toBeTruthy();
    const wren = (await w.userByEmail("wren@new.example"))!;
    expect(wren.role).toBe("student");
    expect(wren.emailVerifiedAt).not.toBeNull(); // the link reached the address
    expect(await roster(teacher.id)).toEqual(["wren@new.example"]);

    const again = await A.acceptInvitationAction(await as(null), {
      token,
      name: "Someone",
      password: "another-long-pw",
    });
    expect(again).toMatchObject({ status: 404, message: INV.INVITATION_DEAD });
    expect(await INV.describeInvitation(token)).toBeNull();
  });

  it("cannot be used by another signed-in address, nor after it expires", async () => {
    const token = await w.tokenMailed("oak@new.example", "invitation");
    const stranger = await w.person("student");
    const res = await A.acceptInvitationAction(await as(stranger), { token });
    expect(res).toMatchObject({ status: 403, message: INV.INVITATION_OTHER_ADDRESS });
    await w.db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) });
    const late = await A.acceptInvitationAction(await as(null), { token, name: "Oak", password: "oak-leaf-hornpipe" });
    expect(late.status).toBe(404);
    expect(await w.userByEmail("oak@new.example")).toBeNull();
  });

  it("links an existing account: sign in first, then the same link joins the roster", async () => {
    const teacher = await w.person("teacher");
    const student = await w.person("student", { email: "existing@people.example" });
    await A.inviteStudentsAction(await as(teacher), { addresses: "existing@people.example" });
    const token = await w.tokenMailed(student.email, "invitation");
    expect((await INV.describeInvitation(token))?.needsSignIn).toBe(true);
    const anonymous = await A.acceptInvitationAction(await as(null), {
      token,
      name: "X",
      password: "someone-elses-pw",
    });
    expect(anonymous).toMatchObject({ status: 409, message: INV.INVITATION_SIGN_IN_FIRST });
    const ok = await A.acceptInvitationAction(await as(student), { token });
    expect(ok).toMatchObject({ status: 200, redirectTo: "/learn" });
    expect(await roster(teacher.id)).toEqual([student.email]);
  });
});

describe("an admin invites teachers and changes roles", () => {
  it("a teacher invitation makes the invited person a teacher", async () => {
    const admin = await w.person("admin");
    expect((await A.inviteTeacherAction(await as(admin), { email: "fiddler@new.example" })).status).toBe(200);
    const token = await w.tokenMailed("fiddler@new.example", "invitation");
    const res = await A.acceptInvitationAction(await as(null), {
      token,
      name: "Bran Fiddler",
      password: "bran-plays-reels",
    });
    expect(res).toMatchObject({ status: 200, redirectTo: "/teach" });
    expect((await w.userByEmail("fiddler@new.example"))?.role).toBe("teacher");
  });

  it("a signed-in student who takes a teacher invitation is a teacher on the next request", async () => {
    const admin = await w.person("admin");
    const student = await w.person("student", { email: "promoted@people.example" });
    const cookie = await w.cookieFor(student.id);
    const before = (await w.context(cookie)).ctx; // the session is now looked up (and kept a few seconds)
    expect(before.user?.role).toBe("student");
    expect((await A.inviteTeacherAction(await as(admin), { email: student.email })).status).toBe(200);
    const token = await w.tokenMailed(student.email, "invitation");
    expect(await A.acceptInvitationAction(before, { token })).toMatchObject({ status: 200, redirectTo: "/teach" });
    expect((await w.context(cookie)).ctx.user?.role).toBe("teacher");
  });

  it("changes another person's role, but never the admin's own", async () => {
    const admin = await w.person("admin");
    const student = await w.person("student");
    const res = await A.changeRoleAction(await as(admin), { userId: student.id, role: "teacher" });
    expect(res.status).toBe(200);
    expect((await w.userByEmail(student.email))?.role).toBe("teacher");
    expect((await A.changeRoleAction(await as(admin), { userId: admin.id, role: "student" })).status).toBe(409);
    expect((await w.userByEmail(admin.email))?.role).toBe("admin");
    const missing = await A.changeRoleAction(await as(admin), {
      userId: "00000000-0000-4000-8000-000000000000",
      role: "teacher",
    });
    expect(missing.status).toBe(404);
  });
});
