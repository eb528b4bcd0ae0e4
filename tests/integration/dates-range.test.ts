// Dates from outside are real days in the years 1900–2999 (lib/validation/text.ts), everywhere one is
// taken: the admin tables and their CSV exports, the practice log, assignment due dates. Outside that
// range the answer is a 422 naming the field, never a database error or an export that never ends.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { authWorld, type AuthWorld } from "./helpers/auth-world";
import { callRoute } from "./helpers/teach-world";

let w: AuthWorld;
let admin: string;
let student: string;

beforeAll(async () => {
  w = await authWorld();
  admin = await w.cookieFor((await w.person("admin")).id);
  student = await w.cookieFor((await w.person("student")).id);
});
afterAll(async () => w?.close());

/** The answer's status and named fields, or "no answer" after thirty seconds (an export that hangs). */
async function ask(file: string, method: string, c: Parameters<typeof callRoute>[2]) {
  const res = await Promise.race([
    callRoute(file, method, c).then(async (r) => {
      const text = await r.text();
      const fields = (() => {
        try {
          return (JSON.parse(text) as { fieldErrors?: Record<string, string> }).fieldErrors ?? {};
        } catch {
          return {};
        }
      })();
      return { status: r.status, fields };
    }),
    new Promise<{ status: string; fields: Record<string, string> }>((resolve) =>
      setTimeout(() => resolve({ status: "no answer", fields: {} }), 30_000),
    ),
  ]);
  return res;
}

describe("dates in the admin tables and exports", () => {
  for (const file of [
    "admin/payments/export",
    "admin/memberships/export",
    "admin/enrolments/export",
    "admin/payments",
  ]) {
    for (const [from, to] of [
      ["0000-01-01", ""],
      ["1899-12-31", ""],
      ["", "3000-01-01"],
      ["2026-02-30", ""],
      ["+275760-09-13", ""],
    ]) {
      it(`${file}?from=${from}&to=${to} answers 422 naming the date`, async () => {
        const a = await ask(file, "GET", { cookie: admin, query: `?from=${from}&to=${to}` });
        expect(a.status).toBe(422);
        expect(a.fields[from ? "from" : "to"]).toMatch(/1900–2999/);
      });
    }
  }

  it("still takes the edges of the range", async () => {
    const a = await ask("admin/payments/export", "GET", { cookie: admin, query: "?from=1900-01-01&to=2999-12-31" });
    expect(a.status).toBe(200);
  });
});

describe("dates in the practice log", () => {
  for (const practisedOn of ["0000-01-01", "1899-12-31", "0001-01-01", "2026-02-29"]) {
    it(`refuses the day ${practisedOn} with 422 naming it`, async () => {
      const a = await ask("learn/practice", "POST", { cookie: student, body: { practisedOn, minutes: 10 } });
      expect(a.status).toBe(422);
      expect(a.fields.practisedOn).toBeTruthy();
    });
  }
});

describe("assignment due dates", () => {
  for (const dueLocal of ["0000-01-01T10:00", "9999-12-31T23:00", "2026-13-45T99:99"]) {
    it(`refuses ${dueLocal} before anything is checked`, async () => {
      const teacher = await w.cookieFor((await w.person("teacher")).id);
      const a = await ask("teach/assignments", "POST", {
        cookie: teacher,
        body: {
          tuneId: "6f1c2a9e-3b7d-4c1a-9e2f-0a1b2c3d4e5f",
          studentIds: ["6f1c2a9e-3b7d-4c1a-9e2f-0a1b2c3d4e5e"],
          dueLocal,
        },
      });
      expect([400, 422]).toContain(a.status);
      expect(a.fields.dueLocal).toBeTruthy();
    });
  }
});
