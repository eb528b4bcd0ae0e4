// The revenue report follows the payment service's clock: renewals the stand-in charges after its clock
// has moved months ahead of this machine's are dated in those months, and the report shows each of them
// (not only the twelve months up to the machine's today).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { reportMonths } from "@/lib/billing/admin/revenue";
import { billingWorld, type BillingWorld } from "./helpers/billing-world";

let w: BillingWorld;
let adminCookie: string;
const DAY = 86_400;
const monthOf = (unix: number) => new Date(unix * 1000).toISOString().slice(0, 7);

beforeAll(async () => {
  w = await billingWorld();
  const admin = await w.person("admin");
  adminCookie = await w.cookieFor(admin.id);
  const plan = await w.plan(adminCookie, {
    name: "Monthly membership",
    amount: 1800,
    currency: "GBP",
    interval: "month",
  });
  const student = await w.person("student");
  await w.subscribe(await w.cookieFor(student.id), plan.id);
}, 60_000);
afterAll(async () => w?.close());

type Report = { months: string[]; rows: { month: string; currency: string; new: number; renewals: number }[] };

describe("revenue after the stand-in's clock moved on", () => {
  it("lists twelve months up to today, and later months only when money is dated in them", () => {
    const now = new Date("2026-03-10T12:00:00Z");
    expect(reportMonths(now)).toEqual([
      "2025-04",
      "2025-05",
      "2025-06",
      "2025-07",
      "2025-08",
      "2025-09",
      "2025-10",
      "2025-11",
      "2025-12",
      "2026-01",
      "2026-02",
      "2026-03",
    ]);
    expect(reportMonths(now, "2026-02")).toHaveLength(12);
    expect(reportMonths(now, "2026-06").slice(-4)).toEqual(["2026-03", "2026-04", "2026-05", "2026-06"]);
  });

  it("shows every month a renewal was charged in, including those after today", async () => {
    const start = w.fake.now();
    await w.fake.advanceClock(100 * DAY); // three monthly renewals
    await w.fake.settled();
    const res = await w.call("admin/revenue", "GET", { cookie: adminCookie });
    expect(res.status).toBe(200);
    const report = await w.json<Report>(res);
    const gbp = report.rows.filter((r) => r.currency === "GBP");
    const withMoney = gbp.filter((r) => r.new + r.renewals > 0);
    expect(withMoney.reduce((s, r) => s + r.new, 0)).toBe(1800);
    expect(withMoney.reduce((s, r) => s + r.renewals, 0)).toBe(3 * 1800);
    expect(report.months.at(-1)).toBe(monthOf(w.fake.now()));
    expect(report.months.at(-1)! > monthOf(start)).toBe(true);
    expect(report.months).toHaveLength(new Set(report.months).size);
    // No gap: consecutive months from the first to the last.
    for (let i = 1; i < report.months.length; i++) {
      const [y, m] = report.months[i - 1].split("-").map(Number);
      expect(report.months[i]).toBe(new Date(Date.UTC(y, m, 1)).toISOString().slice(0, 7));
    }
  });
});
