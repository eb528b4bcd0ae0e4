// The payments' copy of the payer's name and address (migration 0005), which the admin payments
// table's broad searches test inside the index walk: it is filled when a payment is written and
// follows the person when their name or address changes, so a search never finds a stale name.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { payments, users } from "@/db/schema";
import { countPayments, listPayments } from "@/db/queries/admin-payments";
import { payerFilter } from "@/db/queries/payer-search";
import { paymentsQuery } from "@/lib/billing/admin/params";
import { createTestDatabase } from "./helpers/db";

let t: Awaited<ReturnType<typeof createTestDatabase>>;
let personId = "";

beforeAll(async () => {
  t = await createTestDatabase();
  const [p] = await t.db
    .insert(users)
    .values({ name: "Ottoline Quarrie", email: "O.Quarrie@Search.example", role: "student" })
    .returning();
  personId = p.id;
  await t.db
    .insert(payments)
    .values(
      [1, 2, 3].map((i) => ({
        userId: p.id,
        stripeInvoiceId: `in_search_${i}`,
        kind: "renewal" as const,
        amount: 1500 + i,
        currency: "GBP",
        status: "paid" as const,
        createdAt: new Date(Date.UTC(2026, 4, i)),
      })),
    );
}, 60_000);
afterAll(async () => t?.drop());

const searchCopies = async () =>
  (await t.db.select({ s: payments.payerSearch }).from(payments).where(eq(payments.userId, personId))).map((r) => r.s);

/** The walk form (the one that reads the copy), its page and its total. */
async function walkFinds(q: string) {
  const query = paymentsQuery.parse({ q });
  const walk = await payerFilter(t.db, q, 0);
  expect(walk.kind).toBe("walk");
  return { rows: (await listPayments(t.db, query, walk)).rows.length, total: await countPayments(t.db, query) };
}

describe("the payments' search copy of the payer", () => {
  it("is filled on insert, lower-cased, name and address apart", async () => {
    expect(await searchCopies()).toEqual(Array(3).fill("ottoline quarrie\no.quarrie@search.example"));
    expect(await walkFinds("QUARRIE")).toEqual({ rows: 3, total: 3 });
    // A fragment spanning the end of the name and the start of the address matches neither.
    expect(await walkFinds("quarrie o.q")).toEqual({ rows: 0, total: 0 });
  });

  it("follows a change of name or address, and a payment moved to another person", async () => {
    await t.db.update(users).set({ name: "Ottoline Brisk" }).where(eq(users.id, personId));
    expect(await walkFinds("brisk")).toEqual({ rows: 3, total: 3 });
    expect(await walkFinds("quarrie")).toEqual({ rows: 3, total: 3 }); // still in the address
    await t.db.update(users).set({ email: "ottoline@brisk.example" }).where(eq(users.id, personId));
    expect(await walkFinds("quarrie")).toEqual({ rows: 0, total: 0 });
    const [other] = await t.db
      .insert(users)
      .values({ name: "Piran Yelland", email: "piran@search.example", role: "student" })
      .returning();
    await t.db.execute(sql`update payments set user_id = ${other.id} where stripe_invoice_id = 'in_search_1'`);
    expect(await walkFinds("yelland")).toEqual({ rows: 1, total: 1 });
    expect(await walkFinds("brisk")).toEqual({ rows: 2, total: 2 });
  });

  it("keeps only the choice of form: a person added after it is found on the next page", async () => {
    const q = paymentsQuery.parse({ q: "tremayne" });
    expect((await listPayments(t.db, q)).rows).toHaveLength(0); // counts nobody, keeps "people"
    const kept = await payerFilter(t.db, "TREMAYNE");
    expect(kept.kind).toBe("people");
    expect("ids" in kept).toBe(false);
    const [p] = await t.db
      .insert(users)
      .values({ name: "Morwenna Tremayne", email: "morwenna@search.example", role: "student" })
      .returning();
    await t.db
      .insert(payments)
      .values({
        userId: p.id,
        stripeInvoiceId: "in_search_fresh",
        kind: "new",
        amount: 1800,
        currency: "GBP",
        status: "paid",
        createdAt: new Date(),
      });
    expect((await listPayments(t.db, q)).rows.map((r) => r.name)).toEqual(["Morwenna Tremayne"]);
    expect(await countPayments(t.db, q)).toBe(1);
  });
});
