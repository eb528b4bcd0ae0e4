// The admin payments search keeps the ids of the people it found (db/queries/payer-search.ts) only
// while this process hears people change (migration 0006's notices), and only for its own handles on
// DATABASE_URL, which the routes read through: a person added, renamed or given a new address is
// found, or no longer found, on the next page once the notice arrives.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { eq } from "drizzle-orm";
import { payments, users } from "@/db/schema";
import { authWorld, type AuthWorld } from "./helpers/auth-world";

let w: AuthWorld;
let S: typeof import("@/db/queries/payer-search");
let A: typeof import("@/db/queries/admin-payments");
let query: typeof import("@/lib/billing/admin/params").paymentsQuery;
let app: import("@/db/client").Db; // the routes' handle (reportsDb), on this world's database
let n = 0;

beforeAll(async () => {
  w = await authWorld();
  S = await import("@/db/queries/payer-search");
  A = await import("@/db/queries/admin-payments");
  query = (await import("@/lib/billing/admin/params")).paymentsQuery;
  app = (await import("@/db/client")).reportsDb();
  await S.peopleNoticesReady();
}, 60_000);
afterAll(async () => w?.close());

async function payer(name: string, email = `${name.toLowerCase().replace(/\W+/g, ".")}@notices.example`) {
  const [p] = await w.db.insert(users).values({ name, email, role: "student" }).returning();
  await w.db
    .insert(payments)
    .values({
      userId: p.id,
      stripeInvoiceId: `in_notices_${++n}`,
      kind: "new",
      amount: 1800,
      currency: "GBP",
      status: "paid",
      createdAt: new Date(),
    });
  return p;
}

const names = async (q: string) => (await A.listPayments(app, query.parse({ q }))).rows.map((r) => r.name).sort();

describe("the people a payments search keeps", () => {
  it("keeps no ids for a database handle of a script's or test's own, which this process does not hear", async () => {
    await payer("Demelza Rosewarne");
    expect(await S.payerFilter(w.db, "rosewarne")).toMatchObject({ kind: "people", ids: [expect.any(String)] });
    expect(await S.payerFilter(w.db, "rosewarne")).toEqual({ kind: "people", pattern: "%rosewarne%" }); // the choice only: read inside the statement
  });

  it("keeps the ids it read, and reads them again after a person is added", async () => {
    const first = await payer("Wenna Polglase");
    expect(await names("polglase")).toEqual(["Wenna Polglase"]);
    expect(await S.payerFilter(app, "POLGLASE")).toEqual({ kind: "people", ids: [first.id] }); // kept, whatever the case
    await payer("Jory Polglase");
    await vi.waitFor(async () => expect(await names("polglase")).toEqual(["Jory Polglase", "Wenna Polglase"]), {
      timeout: 2000,
      interval: 10,
    });
  });

  it("no longer finds a person renamed out of the search, nor finds one at an address they left", async () => {
    const p = await payer("Tressa Carthew", "tressa@carthew.example");
    expect(await names("carthew")).toEqual(["Tressa Carthew"]);
    await w.db.update(users).set({ name: "Tressa Hosking" }).where(eq(users.id, p.id));
    expect(await names("carthew")).toEqual(["Tressa Hosking"]); // still in the address
    await w.db.update(users).set({ email: "tressa@hosking.example" }).where(eq(users.id, p.id));
    await vi.waitFor(async () => expect(await names("carthew")).toEqual([]), { timeout: 2000, interval: 10 });
  });

  it("keeps nothing found while a notice came in: the read may not have seen that change", async () => {
    await payer("Kerensa Nancarrow");
    const reading = S.payerFilter(app, "nancarrow");
    S.forgetPeople(); // as a notice arriving during the read does
    expect((await reading).kind).toBe("people");
    expect(S.keptSearch("nancarrow")).toEqual({ kind: "people" }); // the choice only
    const again = await S.payerFilter(app, "nancarrow"); // hearing: reads the ids and keeps them this time
    expect(S.keptSearch("nancarrow")).toEqual(again);
    expect("ids" in again && again.ids).toHaveLength(1);
  });

  it("finds nobody until someone matching is added", async () => {
    expect(await names("trebilcock")).toEqual([]);
    expect(await S.payerFilter(app, "trebilcock")).toEqual({ kind: "people", ids: [] });
    await payer("Morvoren Trebilcock");
    await vi.waitFor(async () => expect(await names("trebilcock")).toEqual(["Morvoren Trebilcock"]), {
      timeout: 2000,
      interval: 10,
    });
  });
});
