// The admin money tables: sorting, filtering and paging happen on the server and
// match what this test works out on its own from the rows it made; the CSV export is the filtered
// table (parsed back); bad parameters are refused with 422 naming them.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { payments, plans, subscriptions, users } from "@/db/schema";
import { authWorld, type AuthWorld } from "./helpers/auth-world";
import { callRoute } from "./helpers/teach-world";

/**
 * Reads CSV back per RFC 4180 §2 (quoted fields, doubled quotes, CRLF). Written here because no CSV
 * parser is among the project's packages (csv-stringify only writes).
 */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = "";
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') ((field += '"'), i++);
      else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ",") (row.push(field), (field = ""));
    else if (c === "\r" && text[i + 1] === "\n") {
      (row.push(field), rows.push(row), (row = []), (field = ""), i++);
    } else field += c;
  }
  if (field || row.length) (row.push(field), rows.push(row));
  return rows;
}

let w: AuthWorld;
let cookie: string;
type P = {
  id: string;
  name: string;
  email: string;
  planId: string;
  status: "paid" | "failed" | "refunded" | "partially_refunded";
  amount: number;
  refunded: number;
  createdAt: Date;
};
const made: P[] = [];
const planIds = { monthly: "", yearly: "" };
const NAMES = [
  "Quentin Alder",
  "Beatrix Moss",
  "Cormac Fenwick",
  "Dorcas Hale",
  "Edwin Tarrant",
  "Freya Lowick",
  "Gareth Oakes",
  "Hilda Pym",
  "Ianthe Rowe",
  "Jasper Vane",
  "Keziah Wynn",
  "Lorcan Ashby",
];
const DAY = 86_400_000;
const T0 = Date.UTC(2026, 0, 1);

beforeAll(async () => {
  w = await authWorld();
  const admin = await w.person("admin");
  cookie = await w.cookieFor(admin.id);
  const [m, y] = await w.db
    .insert(plans)
    .values([
      { name: "Monthly", amount: 1800, currency: "GBP", interval: "month" },
      { name: "Yearly", amount: 18000, currency: "GBP", interval: "year" },
    ])
    .returning();
  planIds.monthly = m.id;
  planIds.yearly = y.id;
  const people = await w.db
    .insert(users)
    .values(
      NAMES.map((name) => ({
        name,
        email: `${name.toLowerCase().replace(" ", ".")}@tables.example`,
        role: "student" as const,
      })),
    )
    .returning();
  // 1,200 payments (more than two CSV batches), spread over a year with every status and both plans.
  const statuses = ["paid", "paid", "paid", "failed", "refunded", "partially_refunded"] as const;
  const rows = Array.from({ length: 1200 }, (_, i) => {
    const u = people[(i * 7) % people.length];
    const yearly = i % 5 === 0;
    const status = statuses[(i * 11) % statuses.length];
    const amount = yearly ? 18000 : 1800 + (i % 3) * 100;
    const refunded = status === "refunded" ? amount : status === "partially_refunded" ? 500 : 0;
    return {
      userId: u.id,
      planId: yearly ? y.id : m.id,
      stripeInvoiceId: `in_tables_${i}`,
      kind: "renewal" as const,
      amount,
      refundedAmount: refunded,
      currency: "GBP",
      status,
      createdAt: new Date(T0 + ((i * 37) % 365) * DAY + i * 1000),
    };
  });
  for (let i = 0; i < rows.length; i += 400) {
    const got = await w.db
      .insert(payments)
      .values(rows.slice(i, i + 400))
      .returning();
    for (const g of got) {
      const u = people.find((p) => p.id === g.userId);
      made.push({
        id: g.id,
        name: u?.name ?? "",
        email: u?.email ?? "",
        planId: g.planId ?? "",
        status: g.status,
        amount: g.amount,
        refunded: g.refundedAmount,
        createdAt: g.createdAt,
      });
    }
  }
  await w.db.insert(subscriptions).values(
    people.slice(0, 6).map((u, i) => ({
      userId: u.id,
      planId: i % 2 ? y.id : m.id,
      stripeSubscriptionId: `sub_tables_${i}`,
      status: i === 5 ? ("canceled" as const) : ("active" as const),
      startedAt: new Date(T0 + i * 20 * DAY),
      currentPeriodEnd: new Date(T0 + (i + 30) * 10 * DAY),
    })),
  );
}, 60_000);
afterAll(async () => w?.close());

const get = (file: string, query: string) => callRoute(`admin/${file}`, "GET", { cookie, query });
const byId = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/** The test's own filter and order, written from the words, not from the server's code. */
function expected(o: {
  status?: string;
  plan?: string;
  from?: string;
  to?: string;
  q?: string;
  sort: "date" | "amount" | "status" | "name";
  dir: "asc" | "desc";
}) {
  const lo = o.from ? Date.parse(`${o.from}T00:00:00Z`) : -Infinity;
  const hi = o.to ? Date.parse(`${o.to}T00:00:00Z`) + DAY : Infinity;
  const q = o.q?.toLowerCase();
  const key = (p: P): number | string =>
    o.sort === "date"
      ? p.createdAt.getTime()
      : o.sort === "amount"
        ? p.amount
        : o.sort === "status"
          ? p.status
          : p.name;
  const sign = o.dir === "asc" ? 1 : -1;
  return made
    .filter(
      (p) =>
        (!o.status || p.status === o.status) &&
        (!o.plan || p.planId === o.plan) &&
        p.createdAt.getTime() >= lo &&
        p.createdAt.getTime() < hi,
    )
    .filter((p) => !q || p.name.toLowerCase().includes(q) || p.email.toLowerCase().includes(q))
    .sort((a, b) => {
      const [x, y] = [key(a), key(b)];
      return sign * (x < y ? -1 : x > y ? 1 : byId(a.id, b.id));
    });
}

type PageJson = {
  rows: { id: string; amount: number; refundedAmount: number; status: string; name: string }[];
  hasMore: boolean;
  page: number;
  pageSize: number;
};
/** The table's total: its own request, with the same parameters as the page. */
const totalOf = async (file: string, query: string) => {
  const res = await get(`${file}/count`, query);
  expect(res.status).toBe(200);
  return ((await res.json()) as { total: number }).total;
};

describe("admin payments table", () => {
  it("answers the newest first by default, 25 to a page, with the total apart", async () => {
    const res = await get("payments", "");
    expect(res.status).toBe(200);
    const body = (await res.json()) as PageJson;
    const want = expected({ sort: "date", dir: "desc" });
    expect(await totalOf("payments", "")).toBe(1200);
    expect(body.pageSize).toBe(25);
    expect(body.hasMore).toBe(true);
    expect(body.rows.map((r) => r.id)).toEqual(want.slice(0, 25).map((p) => p.id));
  });

  it("filters by status, plan, dates and a name fragment together, sorts by amount and pages", async () => {
    const f = {
      status: "paid",
      plan: planIds.monthly,
      from: "2026-03-01",
      to: "2026-08-31",
      q: "OAKES",
      sort: "amount" as const,
      dir: "desc" as const,
    };
    const want = expected(f);
    expect(want.length).toBeGreaterThan(6);
    const res = await get("payments", `?${new URLSearchParams({ ...f, page: "2", pageSize: "5" })}`);
    const body = (await res.json()) as PageJson;
    expect(await totalOf("payments", `?${new URLSearchParams(f)}`)).toBe(want.length);
    expect(body.rows.map((r) => r.id)).toEqual(want.slice(5, 10).map((p) => p.id));
    expect(body.hasMore).toBe(want.length > 10);
  });

  it("says no page follows the last one", async () => {
    const f = { status: "failed", plan: planIds.yearly, sort: "date" as const, dir: "desc" as const };
    const want = expected(f);
    const size = 7;
    const last = Math.ceil(want.length / size);
    expect(last).toBeGreaterThan(1);
    const body = (await (
      await get("payments", `?${new URLSearchParams({ ...f, page: String(last), pageSize: String(size) })}`)
    ).json()) as PageJson;
    expect(body.rows.map((r) => r.id)).toEqual(want.slice((last - 1) * size).map((p) => p.id));
    expect(body.hasMore).toBe(false);
    const before = (await (
      await get("payments", `?${new URLSearchParams({ ...f, page: String(last - 1), pageSize: String(size) })}`)
    ).json()) as PageJson;
    expect(before.hasMore).toBe(true);
    const past = (await (
      await get("payments", `?${new URLSearchParams({ ...f, page: String(last + 1), pageSize: String(size) })}`)
    ).json()) as PageJson;
    expect(past).toMatchObject({ rows: [], hasMore: false });
  });

  for (const [sort, dir] of [
    ["name", "asc"],
    ["status", "asc"],
    ["amount", "asc"],
    ["date", "asc"],
  ] as const) {
    it(`sorts by ${sort} ${dir} across pages`, async () => {
      const want = expected({ sort, dir });
      const body = (await (await get("payments", `?sort=${sort}&dir=${dir}&page=3&pageSize=40`)).json()) as PageJson;
      expect(body.rows.map((r) => r.id)).toEqual(want.slice(80, 120).map((p) => p.id));
    });
  }

  it("finds a name or address fragment in any case, with the same rows in the page and the total", async () => {
    for (const search of ["OAKES", "a", "TABLES.example", "ow", "n M", "zz"]) {
      const f = {
        status: "paid",
        from: "2026-02-01",
        to: "2026-10-31",
        q: search,
        sort: "amount",
        dir: "desc",
      } as const;
      const want = expected(f);
      const page = (await (
        await get("payments", `?${new URLSearchParams({ ...f, page: "2", pageSize: "9" })}`)
      ).json()) as PageJson;
      expect(
        page.rows.map((r) => r.id),
        search,
      ).toEqual(want.slice(9, 18).map((p) => p.id));
      expect(page.hasMore, search).toBe(want.length > 18);
      expect(await totalOf("payments", `?${new URLSearchParams(f)}`), search).toBe(want.length);
    }
  });

  it("finds a person by their name as it is now", async () => {
    const [person] = await w.db
      .insert(users)
      .values({ name: "Ottoline Quarrie", email: "o.quarrie@tables.example", role: "student" })
      .returning();
    const payment = { userId: person.id, kind: "new", amount: 1500, currency: "GBP", status: "paid" } as const;
    await w.db.insert(payments).values({ ...payment, stripeInvoiceId: "in_tables_renamed", createdAt: new Date(T0) });
    await w.db.update(users).set({ name: "Ottoline Brisk" }).where(eq(users.id, person.id));
    expect(await totalOf("payments", "?q=brisk")).toBe(1);
    expect(await totalOf("payments", "?q=ottoline%20quarrie")).toBe(0);
    expect(await totalOf("payments", "?q=QUARRIE@")).toBe(1); // still in the address
    await w.db.delete(payments).where(eq(payments.userId, person.id));
  });

  it("refuses a search with a line break, naming the field", async () => {
    const res = await get("payments", "?q=Hilda%0APym");
    expect(res.status).toBe(422);
    expect(((await res.json()) as { fieldErrors: Record<string, string> }).fieldErrors.q).toMatch(/line breaks/);
  });

  it("treats LIKE wildcards in the search as plain characters", async () => {
    const body = (await (await get("payments", "?q=%25")).json()) as PageJson;
    expect(body.rows).toEqual([]);
    expect(await totalOf("payments", "?q=%25")).toBe(0);
  });

  it("refuses unknown sorts, values and parameters with 422 naming each", async () => {
    for (const [query, field] of [
      ["?sort=colour", "sort"],
      ["?status=lost", "status"],
      ["?pageSize=101", "pageSize"],
      ["?page=0", "page"],
      ["?from=2026-13-01", "from"],
      ["?from=2026-05-01&to=2026-04-01", "to"],
      ["?plan=monthly", "plan"],
      ["?colour=red", "colour"],
    ]) {
      const res = await get("payments", query);
      expect(res.status, query).toBe(422);
      const body = (await res.json()) as { error: string; fieldErrors: Record<string, string> };
      expect(Object.keys(body.fieldErrors), query).toContain(field);
      expect(body.error).toContain(field);
    }
  });

  it("exports exactly the filtered rows in the table's order as CSV (RFC 4180), streamed across batches", async () => {
    const f = { status: "paid", sort: "name", dir: "asc" } as const;
    const want = expected(f);
    expect(want.length).toBeGreaterThan(500); // more than one keyset batch
    const res = await get("payments/export", `?${new URLSearchParams(f)}`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="payments-\d{4}-\d{2}-\d{2}\.csv"$/);
    const text = await res.text();
    expect(text.includes("\r\n")).toBe(true); // RFC 4180 §2: CRLF line breaks
    const [header, ...lines] = parseCsv(text);
    expect(header).toContain("Amount");
    const col = (name: string) => header.indexOf(name);
    expect(lines.map((l) => l[col("Payment id")])).toEqual(want.map((p) => p.id));
    expect(await totalOf("payments", `?${new URLSearchParams(f)}`)).toBe(lines.length);
    const first = want[0];
    expect(lines[0][col("Amount")]).toBe((first.amount / 100).toFixed(2));
    expect(lines[0][col("Currency")]).toBe("GBP");
    expect(lines[0][col("Name")]).toBe(first.name);
  });
});

describe("admin memberships and enrolments tables", () => {
  it("filters memberships by status and plan, and exports the same rows", async () => {
    const body = (await (
      await get("memberships", `?status=active&plan=${planIds.monthly}&sort=name&dir=asc`)
    ).json()) as PageJson;
    expect(await totalOf("memberships", `?status=active&plan=${planIds.monthly}`)).toBe(3); // subscriptions 0, 2 and 4 are monthly and active
    expect(body.rows).toHaveLength(3);
    const names = body.rows.map((r) => r.name);
    expect(names).toEqual([...names].sort());
    const csv = parseCsv(
      await (await get("memberships/export", `?status=active&plan=${planIds.monthly}&sort=name&dir=asc`)).text(),
    );
    expect(csv.slice(1).map((l) => l[csv[0].indexOf("Name")])).toEqual(names);
  });

  it("refuses a sort the enrolments table does not have", async () => {
    const res = await get("enrolments", "?sort=amount");
    expect(res.status).toBe(422);
    expect(((await res.json()) as { fieldErrors: Record<string, string> }).fieldErrors.sort).toMatch(
      /date, name, status, course/,
    );
  });
});
