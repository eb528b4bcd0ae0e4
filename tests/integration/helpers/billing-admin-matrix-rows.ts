// "billing-admin"'s rows of the authorization matrix (admin tables, CSV exports, refunds, revenue);
// spread into billingRows() in tests/integration/helpers/billing-matrix-rows.ts. Only an admin reads
// money (money:view) or refunds (payments:refund); the others get 401 (visitor) or 403.
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { payments, users } from "@/db/schema";
import { callRoute } from "./teach-world";

type Who = "visitor" | "student" | "teacher" | "otherTeacher" | "admin";
type Person = { id: string; email: string };
type CallLike = { who: Who; n: number; cookie: string | undefined; people: { student: Person }; w: { db: Db } };
type RowLike = { covers: string[]; call: (c: CallLike) => Promise<number>; expect: Record<Who, number> };

const adminOnly = (s: number): Record<Who, number> => ({
  visitor: 401,
  student: 403,
  teacher: 403,
  otherTeacher: 403,
  admin: s,
});

const status = (
  c: CallLike,
  file: string,
  method: string,
  o: { query?: string; params?: Record<string, string>; body?: unknown } = {},
) =>
  callRoute(`admin/${file}`, method, { ...o, cookie: c.cookie }).then(async (r) => {
    await r.arrayBuffer(); // a streamed CSV is read to its end, so its batches finish before the database goes
    return r.status;
  });

/** A failed payment of the matrix's student: refusing to refund it needs no Stripe, so the row tests only who may ask. */
async function failedPayment(c: CallLike): Promise<string> {
  const [u] = await c.w.db.select({ id: users.id }).from(users).where(eq(users.id, c.people.student.id));
  const [p] = await c.w.db
    .insert(payments)
    .values({
      userId: u.id,
      stripeInvoiceId: `in_matrix_${c.who}_${c.n}`,
      kind: "renewal",
      amount: 1800,
      currency: "GBP",
      status: "failed",
      failureMessage: "Your card was declined.",
      createdAt: new Date(),
    })
    .returning({ id: payments.id });
  return p.id;
}

export function billingAdminRows(): RowLike[] {
  return [
    {
      covers: ["GET /api/admin/payments"],
      call: (c) => status(c, "payments", "GET", { query: "?status=paid&sort=amount&dir=desc&page=1&pageSize=10" }),
      expect: adminOnly(200),
    },
    {
      covers: ["GET /api/admin/payments"],
      call: (c) => status(c, "payments", "GET", { query: "?sort=colour" }),
      expect: adminOnly(422),
    },
    {
      covers: ["GET /api/admin/payments/count"],
      call: (c) => status(c, "payments/count", "GET", { query: "?status=paid&q=matrix" }),
      expect: adminOnly(200),
    },
    {
      covers: ["GET /api/admin/payments/count"],
      call: (c) => status(c, "payments/count", "GET", { query: "?status=lost" }),
      expect: adminOnly(422),
    },
    {
      covers: ["GET /api/admin/payments/export"],
      call: (c) => status(c, "payments/export", "GET", { query: "?status=paid" }),
      expect: adminOnly(200),
    },
    {
      covers: ["POST /api/admin/payments/[id]/refunds"],
      call: async (c) =>
        status(c, "payments/[id]/refunds", "POST", {
          params: { id: await failedPayment(c) },
          body: { reason: "matrix" },
        }),
      expect: adminOnly(422),
    },
    {
      covers: ["GET /api/admin/memberships"],
      call: (c) => status(c, "memberships", "GET", { query: "?status=active&sort=renews" }),
      expect: adminOnly(200),
    },
    {
      covers: ["GET /api/admin/memberships/count"],
      call: (c) => status(c, "memberships/count", "GET", { query: "?status=active" }),
      expect: adminOnly(200),
    },
    {
      covers: ["GET /api/admin/memberships/export"],
      call: (c) => status(c, "memberships/export", "GET"),
      expect: adminOnly(200),
    },
    {
      covers: ["GET /api/admin/enrolments"],
      call: (c) => status(c, "enrolments", "GET", { query: "?sort=course&dir=asc" }),
      expect: adminOnly(200),
    },
    {
      covers: ["GET /api/admin/enrolments/count"],
      call: (c) => status(c, "enrolments/count", "GET", { query: "?status=active" }),
      expect: adminOnly(200),
    },
    {
      covers: ["GET /api/admin/enrolments/export"],
      call: (c) => status(c, "enrolments/export", "GET"),
      expect: adminOnly(200),
    },
    { covers: ["GET /api/admin/revenue"], call: (c) => status(c, "revenue", "GET"), expect: adminOnly(200) },
  ];
}
