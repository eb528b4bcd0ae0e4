// Issue 7's rows of the authorization matrix (plans, checkout, billing, webhook, admin tables, refunds);
// spread into ROWS in tests/integration/authorization-matrix.test.ts. The inputs are chosen so each
// allowed call is answered before Stripe is asked (an unknown plan or course, no membership to
// change, no signature): the rows test who may ask, without a Stripe stand-in.
import { randomUUID } from "node:crypto";
import type { Db } from "@/db/client";
import { billingAdminRows } from "./billing-admin-matrix-rows";
import { callRoute } from "./teach-world";

type Who = "visitor" | "student" | "teacher" | "otherTeacher" | "admin";
type Person = { id: string; email: string };
type CallLike = {
  who: Who;
  n: number;
  cookie: string | undefined;
  people: { student: Person };
  w: { db: Db; person: (role: "student") => Promise<Person>; cookieFor: (id: string) => Promise<string> };
};
type RowLike = { covers: string[]; call: (c: CallLike) => Promise<number>; expect: Record<Who, number> };

const admin = (s: number): Record<Who, number> => ({
  visitor: 401,
  student: 403,
  teacher: 403,
  otherTeacher: 403,
  admin: s,
});
const member = (s: number): Record<Who, number> => ({
  visitor: 401,
  student: s,
  teacher: 403,
  otherTeacher: 403,
  admin: s,
});

/** The matrix's student may hold a test membership from other rows; these rows want one without. */
async function cookieOf(c: CallLike): Promise<string | undefined> {
  return c.who === "student" ? c.w.cookieFor((await c.w.person("student")).id) : c.cookie;
}

const status = async (
  c: CallLike,
  file: string,
  method: string,
  o: { params?: Record<string, string>; body?: unknown } = {},
) => (await callRoute(file, method, { ...o, cookie: await cookieOf(c) })).status;

export function billingRows(): RowLike[] {
  return [
    { covers: ["GET /api/admin/plans"], call: (c) => status(c, "admin/plans", "GET"), expect: admin(200) },
    // An empty plan is refused by validation (400) — reached only by someone allowed to make plans.
    {
      covers: ["POST /api/admin/plans"],
      call: (c) => status(c, "admin/plans", "POST", { body: {} }),
      expect: admin(400),
    },
    {
      covers: ["PATCH /api/admin/plans/[id]"],
      call: (c) => status(c, "admin/plans/[id]", "PATCH", { params: { id: randomUUID() }, body: { name: "Renamed" } }),
      expect: admin(404),
    },
    {
      covers: ["DELETE /api/admin/plans/[id]"],
      call: (c) => status(c, "admin/plans/[id]", "DELETE", { params: { id: randomUUID() } }),
      expect: admin(404),
    },
    {
      covers: ["POST /api/admin/plans/[id]"],
      call: (c) => status(c, "admin/plans/[id]", "POST", { params: { id: randomUUID() }, body: { action: "retire" } }),
      expect: admin(404),
    },
    {
      covers: ["POST /api/billing/checkout"],
      call: (c) => status(c, "billing/checkout", "POST", { body: { planId: randomUUID() } }),
      expect: member(404),
    },
    { covers: ["GET /api/billing"], call: (c) => status(c, "billing", "GET"), expect: member(200) },
    {
      covers: ["POST /api/billing/cancel"],
      call: (c) => status(c, "billing/cancel", "POST", { body: {} }),
      expect: member(409),
    },
    {
      covers: ["POST /api/billing/resume"],
      call: (c) => status(c, "billing/resume", "POST", { body: {} }),
      expect: member(409),
    },
    {
      covers: ["POST /api/billing/change-plan/preview"],
      call: (c) => status(c, "billing/change-plan/preview", "POST", { body: { planId: randomUUID() } }),
      expect: member(409),
    },
    {
      covers: ["POST /api/billing/change-plan"],
      call: (c) => status(c, "billing/change-plan", "POST", { body: { planId: randomUUID(), prorationDate: 1 } }),
      expect: member(409),
    },
    {
      covers: ["POST /api/billing/update-card"],
      call: (c) => status(c, "billing/update-card", "POST", { body: {} }),
      expect: member(409),
    },
    {
      covers: ["POST /api/learn/enrolments"],
      call: (c) => status(c, "learn/enrolments", "POST", { body: { courseId: randomUUID() } }),
      expect: member(404),
    },
    // Stripe calls it, not a person: without a valid signature everyone gets 400 and nothing is written.
    {
      covers: ["POST /api/webhooks/stripe"],
      call: (c) => status(c, "webhooks/stripe", "POST", { body: { id: `evt_matrix_${c.n}`, type: "invoice.paid" } }),
      expect: { visitor: 400, student: 400, teacher: 400, otherTeacher: 400, admin: 400 },
    },
    ...billingAdminRows(),
  ];
}
