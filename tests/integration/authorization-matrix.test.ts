import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { authWorld, TEST_APP_URL, type AuthWorld } from "./helpers/auth-world";
import { catalogueRows } from "./helpers/catalogue-routes";
import { teachRows } from "./helpers/teach-matrix-rows";
import { teachingRows } from "./helpers/teaching-matrix-rows";
import { learningRows } from "./helpers/learning-matrix-rows";
import { recordingsRows } from "./helpers/recordings-matrix-rows";
import { billingRows } from "./helpers/billing-matrix-rows";
import { enrolRows } from "./helpers/enrol-matrix-rows";
import { routeModule } from "./helpers/route-module";
import type { RequestContext } from "@/lib/auth/context";
import type { GuardedAction } from "@/lib/auth/guard";

// Every route handler and server action, called as each kind of person; each answer asserted.
// Later issues add ROWS. The completeness test below fails when a route.ts method or a
// "use server" export exists without a row, so nothing new escapes the matrix.

type Who = "visitor" | "student" | "teacher" | "otherTeacher" | "admin";
const WHO: Who[] = ["visitor", "student", "teacher", "otherTeacher", "admin"];
type People = Record<Exclude<Who, "visitor">, { id: string; email: string }> & {
  otherStudent: { id: string; email: string };
};
/** What a row's call gets: a fresh session for the caller (null for the visitor), and helpers. */
type Call = {
  who: Who;
  me: { id: string; email: string } | null;
  ctx: RequestContext;
  cookie: string | undefined;
  people: People;
  w: AuthWorld;
  n: number;
};
type Row = { covers: string[]; call: (c: Call) => Promise<number>; expect: Record<Who, number> };

const all = (status: number): Record<Who, number> => ({
  visitor: status,
  student: status,
  teacher: status,
  otherTeacher: status,
  admin: status,
});
const only = (ok: number, allowed: Who[]): Record<Who, number> =>
  Object.fromEntries(WHO.map((w) => [w, allowed.includes(w) ? ok : w === "visitor" ? 401 : 403])) as Record<
    Who,
    number
  >;

let A: typeof import("@/lib/auth/actions");
const act = (name: keyof typeof import("@/lib/auth/actions")) => (c: Call, input: Record<string, unknown>) =>
  (A[name] as GuardedAction)(c.ctx, input).then((s) => s.status);

async function route(
  file: string,
  method: string,
  c: Call,
  o: { query?: string; params?: Record<string, string> } = {},
) {
  const handler = (await routeModule(file))[method];
  if (!handler) throw new Error(`${method} ${file} does not exist`);
  const headers = new Headers({ origin: TEST_APP_URL, "x-forwarded-for": `192.0.2.${c.n % 250}` });
  if (c.cookie) headers.set("cookie", c.cookie);
  const req = new Request(`${TEST_APP_URL}/api/${file}${o.query ?? ""}`, { method, headers });
  return (await handler(req, { params: Promise.resolve(o.params ?? {}) })).status;
}

/** A fresh address for calls that create or use up something. */
const fresh = (c: Call, what: string) => `${what}.${c.who}.${c.n}@matrix.example`;

const ROWS: Row[] = [
  // Public health check.
  { covers: ["GET /api/health"], call: (c) => route("health", "GET", c), expect: all(200) },
  {
    // The payment stand-in's clock (npm start / npm test only): admins; 0 days runs what is due without moving time.
    covers: ["POST /api/dev/stripe-clock"],
    call: async (c) => {
      const mod = (await import("@/app/api/dev/stripe-clock/route")) as {
        POST: (r: Request, a: unknown) => Promise<Response>;
      };
      const headers = new Headers({ origin: TEST_APP_URL, "content-type": "application/x-www-form-urlencoded" });
      if (c.cookie) headers.set("cookie", c.cookie);
      const req = new Request(`${TEST_APP_URL}/api/dev/stripe-clock`, { method: "POST", headers, body: "days=0" });
      return (await mod.POST(req, { params: Promise.resolve({}) })).status;
    },
    expect: only(process.env.STRIPE_FAKE_URL ? 303 : 404, ["admin"]),
  },
  // Accounts (issue 4).
  { covers: ["POST /api/auth/sign-out"], call: (c) => route("auth/sign-out", "POST", c), expect: all(303) },
  {
    covers: ["GET /api/auth/to-sign-in"],
    call: (c) => route("auth/to-sign-in", "GET", c, { query: "?next=%2Flearn" }),
    expect: all(307),
  },
  {
    covers: ["app/(auth)/actions.ts#signUp"],
    call: (c) => act("signUpAction")(c, { name: "New Person", email: fresh(c, "up"), password: "matrix-sign-up-pw" }),
    expect: all(200),
  },
  {
    covers: ["app/(auth)/actions.ts#signIn"],
    call: async (c) => {
      const p = await c.w.person("student", { email: fresh(c, "in"), password: "matrix-sign-in-pw" });
      return act("signInAction")(c, { email: p.email, password: "matrix-sign-in-pw" });
    },
    expect: all(200),
  },
  {
    covers: ["app/(auth)/actions.ts#requestReset"],
    call: (c) => act("requestResetAction")(c, { email: fresh(c, "reset") }),
    expect: all(200),
  },
  {
    covers: ["app/(auth)/actions.ts#resetPassword"],
    call: async (c) => {
      const p = await c.w.person("student", { email: fresh(c, "newpw") });
      await act("requestResetAction")(c, { email: p.email });
      return act("resetPasswordAction")(c, {
        token: await c.w.tokenMailed(p.email, "password-reset"),
        password: "matrix-new-password",
      });
    },
    expect: all(200),
  },
  {
    covers: ["app/(auth)/actions.ts#verifyEmail"],
    call: async (c) => {
      const email = fresh(c, "verify");
      await act("signUpAction")(c, { name: "To Confirm", email, password: "matrix-confirm-pw" });
      return act("verifyEmailAction")(c, { token: await c.w.tokenMailed(email, "welcome") });
    },
    expect: all(200),
  },
  {
    // Everyone may accept an invitation sent to their own address (a visitor: to a new one).
    covers: ["app/(auth)/actions.ts#acceptInvitation"],
    call: async (c) => {
      const email = c.me?.email ?? fresh(c, "invited");
      const admin = await import("@/lib/auth/invitations");
      // An admin's own address is skipped when they invite, so another person invites the admin.
      const by = c.who === "admin" ? await c.w.person("teacher") : c.people.admin;
      const inviter = (await c.w.context(await c.w.cookieFor(by.id))).ctx;
      await admin.inviteStudents(inviter, { addresses: email });
      return act("acceptInvitationAction")(c, {
        token: await c.w.tokenMailed(email, "invitation"),
        name: "Invited Person",
        password: "matrix-invited-pw",
      });
    },
    expect: all(200),
  },
  {
    covers: ["app/teach/invite/actions.ts#inviteStudents"],
    call: (c) => act("inviteStudentsAction")(c, { addresses: fresh(c, "pupil") }),
    expect: only(200, ["teacher", "otherTeacher", "admin"]),
  },
  {
    covers: ["app/admin/people/actions.ts#inviteTeacher"],
    call: (c) => act("inviteTeacherAction")(c, { email: fresh(c, "teach") }),
    expect: only(200, ["admin"]),
  },
  {
    covers: ["app/admin/people/actions.ts#changeRole"],
    call: async (c) => act("changeRoleAction")(c, { userId: (await c.w.person("student")).id, role: "student" }),
    expect: only(200, ["admin"]),
  },
  {
    covers: ["GET /api/people"],
    call: (c) => route("people", "GET", c, { query: "?q=matrix&page=1" }),
    expect: only(200, ["admin"]),
  },
  {
    // "A teacher reaches only their own roster; a student only their own data" (issue 4 §5).
    covers: ["GET /api/people/[id]"],
    call: (c) => route("people/[id]", "GET", c, { params: { id: c.people.student.id } }),
    expect: { visitor: 401, student: 200, teacher: 200, otherTeacher: 404, admin: 200 },
  },
  {
    covers: ["GET /api/people/[id]"],
    call: (c) => route("people/[id]", "GET", c, { params: { id: c.people.otherStudent.id } }),
    expect: { visitor: 401, student: 404, teacher: 404, otherTeacher: 200, admin: 200 },
  },
  // Catalogue, ladders, tune pages and margin notes (issue 5): rows in helpers/catalogue-routes.ts.
  ...catalogueRows(),
  // The teacher's tune editor, bulk import and ladder bench (issue 5): rows in helpers/teach-matrix-rows.ts.
  ...teachRows(),
  // Issue 6: the teacher's side, the student's side, recordings and the calendar feed.
  ...teachingRows(),
  ...learningRows(),
  ...recordingsRows(),
  // Issue 7: plans, checkout, billing, webhook, the admin's money tables.
  ...billingRows(),
  // Starting and climbing a course, the teacher's new members and self-paced check-ins, reassignment.
  ...enrolRows(),
];

let w: AuthWorld;
let people: People;
beforeAll(async () => {
  w = await authWorld();
  A = await import("@/lib/auth/actions");
  const { addToRoster } = await import("@/db/queries/auth");
  people = {
    student: await w.person("student"),
    teacher: await w.person("teacher"),
    otherTeacher: await w.person("teacher"),
    admin: await w.person("admin"),
    otherStudent: await w.person("student"),
  };
  await addToRoster(w.db, people.teacher.id, people.student.id);
  await addToRoster(w.db, people.otherTeacher.id, people.otherStudent.id);
});
afterAll(async () => {
  await w?.close();
});

describe("authorization matrix", () => {
  let n = 0;
  for (const [i, row] of ROWS.entries()) {
    for (const who of WHO) {
      it(`${row.covers.join(", ")} #${i} as ${who} → ${row.expect[who]}`, async () => {
        n += 1;
        const me = who === "visitor" ? null : people[who];
        const cookie = me ? await w.cookieFor(me.id) : undefined; // a fresh session per call
        const { ctx } = await w.context(cookie, `198.18.${Math.floor(n / 250)}.${n % 250}`);
        expect(await row.call({ who, me, ctx, cookie, people, w, n })).toBe(row.expect[who]);
      });
    }
  }

  it("has a row for every route handler method and server action", async () => {
    const walk = (dir: string): string[] =>
      readdirSync(dir).flatMap((f) =>
        statSync(path.join(dir, f)).isDirectory() ? walk(path.join(dir, f)) : [path.join(dir, f)],
      );
    const exist: string[] = [];
    for (const file of walk("app")) {
      const text = readFileSync(file, "utf8");
      if (/\/route\.ts$/.test(file)) {
        const url = "/" + path.dirname(file).split(path.sep).slice(1).join("/");
        for (const m of text.matchAll(/export (?:const|async function) (GET|POST|PUT|PATCH|DELETE)\b/g))
          exist.push(`${m[1]} ${url}`);
      } else if (/^\s*["']use server["']/.test(text)) {
        for (const m of text.matchAll(/export async function (\w+)/g))
          exist.push(`${file.split(path.sep).join("/")}#${m[1]}`);
      }
    }
    const covered = new Set(ROWS.flatMap((r) => r.covers));
    expect(exist.filter((e) => !covered.has(e))).toEqual([]);
    expect(exist.length).toBeGreaterThanOrEqual(12);
  });
});
