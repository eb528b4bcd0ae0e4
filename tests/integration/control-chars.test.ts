// One rule for text input (lib/validation/text.ts, applied by the guard to every route handler and
// server action): C0 control characters other than tab and line breaks are refused with 422 naming the
// field, before anything is written or any outside service is asked; and creating a plan never leaves
// a product on sale at Stripe without its row here.
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { billingWorld, type BillingWorld } from "./helpers/billing-world";

let w: BillingWorld;
let admin: string;
let teacher: string;
let student: string;
let A: typeof import("@/lib/auth/actions");

beforeAll(async () => {
  w = await billingWorld();
  admin = await w.cookieFor((await w.person("admin")).id);
  teacher = await w.cookieFor((await w.person("teacher")).id);
  student = await w.cookieFor((await w.person("student")).id);
  A = await import("@/lib/auth/actions");
}, 60_000);
afterAll(async () => w?.close());

type Answer = { status: number; fields: Record<string, string> };
async function answer(res: Response): Promise<Answer> {
  const body = (await res.json().catch(() => ({}))) as { fieldErrors?: Record<string, string> };
  return { status: res.status, fields: body.fieldErrors ?? {} };
}
const count = async (table: string) =>
  (await w.db.execute<{ n: number }>(sql.raw(`select count(*)::int as n from ${table}`)))[0].n;
const activeProducts = async () => (await w.stripe().products.list({ limit: 100 })).data.filter((p) => p.active).length;

const TUNE = "X:1\nT:Bell Reel\nM:4/4\nL:1/8\nK:D\n|:DFAF dFAF|GBdB AFDF:|\n";

describe("control characters in text input", () => {
  const cases: Array<[string, () => Promise<Answer>, string]> = [
    [
      "a tune's ABC",
      async () => answer(await w.call("teach/tunes", "POST", { cookie: teacher, body: { abc: `${TUNE}\u0000` } })),
      "abc",
    ],
    [
      "a course title",
      async () =>
        answer(await w.call("teach/courses", "POST", { cookie: teacher, body: { title: "Reels\u0001", summary: "" } })),
      "title",
    ],
    [
      "a practice note",
      async () =>
        answer(
          await w.call("learn/practice", "POST", {
            cookie: student,
            body: { practisedOn: "2026-03-01", minutes: 20, note: "scales\u001b[2J" },
          }),
        ),
      "note",
    ],
    ["a search", async () => answer(await w.call("people", "GET", { cookie: admin, query: "?q=ann%00e&page=1" })), "q"],
    [
      "a plan's name",
      async () =>
        answer(
          await w.call("admin/plans", "POST", {
            cookie: admin,
            body: { name: "Yearly\u0000", amount: 1000, currency: "GBP", interval: "year" },
          }),
        ),
      "name",
    ],
  ];
  for (const [what, call, field] of cases) {
    it(`refuses a NUL or other C0 character in ${what} with 422 naming “${field}”, writing nothing`, async () => {
      const before = await Promise.all(["tunes", "courses", "practice_logs", "plans"].map(count));
      const products = await activeProducts();
      const a = await call();
      expect(a.status).toBe(422);
      expect(a.fields[field]).toMatch(/control character/);
      expect(await Promise.all(["tunes", "courses", "practice_logs", "plans"].map(count))).toEqual(before);
      expect(await activeProducts()).toBe(products);
    });
  }

  it("names the field in a server action's answer too, and never echoes the character back", async () => {
    const ctx = (await w.context()).ctx;
    const res = await A.signUpAction(ctx, { name: "Ann\u0000", email: "ann@ctrl.example", password: "ann-ctrl-pw-1" });
    expect(res.status).toBe(422);
    expect(res.fieldErrors?.name).toMatch(/control character/);
    expect(res.values?.name).toBe("Ann");
    expect(await w.userByEmail("ann@ctrl.example")).toBeNull();
  });

  it("keeps tabs and line breaks, which are text", async () => {
    const res = await w.call("learn/practice", "POST", {
      cookie: student,
      body: { practisedOn: "2026-03-02", minutes: 15, note: "Slow bows:\r\n\tA string, then D" },
    });
    expect(res.status).toBe(201);
  });
});

describe("creating a plan", () => {
  it("leaves no product on sale at Stripe when the row cannot be written after Stripe said yes", async () => {
    const products = await activeProducts();
    const plans = await count("plans");
    await w.db.execute(sql`
      create or replace function refuse_plan_rows() returns trigger language plpgsql as
        $$ begin raise exception 'injected failure: the plans table cannot be written'; end $$;
      create trigger refuse_plan_rows before insert on plans for each row execute function refuse_plan_rows();`);
    let status: number;
    try {
      status = (
        await w.call("admin/plans", "POST", {
          cookie: admin,
          body: { name: "Orphan check", amount: 1500, currency: "GBP", interval: "month" },
        })
      ).status;
    } finally {
      await w.db.execute(sql`drop trigger refuse_plan_rows on plans`);
    }
    expect(status).toBe(500);
    expect(await count("plans")).toBe(plans);
    expect(await activeProducts()).toBe(products);
    const prices = (await w.stripe().prices.list({ limit: 100 })).data;
    expect(prices.filter((p) => p.active && p.unit_amount === 1500)).toHaveLength(0);
  });
});
