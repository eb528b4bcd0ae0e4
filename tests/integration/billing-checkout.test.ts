// Plans, checkout, the webhook and the gate, end to end against the in-process Stripe stand-in.
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { enrolments, payments, plans, subscriptions, tuneProgress, webhookEvents } from "@/db/schema";
import { makeCatalogueFixture, type CatalogueFixture } from "./helpers/catalogue-fixture";
import { billingWorld, type BillingWorld } from "./helpers/billing-world";

let w: BillingWorld;
let adminCookie: string;
let monthly: { id: string; stripePriceId: string };
let f: CatalogueFixture;
let teacher: { id: string };

beforeAll(async () => {
  w = await billingWorld();
  const admin = await w.person("admin");
  adminCookie = await w.cookieFor(admin.id);
  teacher = await w.person("teacher");
  // The fixture's own student gets a test membership; these tests use fresh students instead.
  f = await makeCatalogueFixture(w.db, { teacher, student: await w.person("student") });
  monthly = await w.plan(adminCookie, {
    name: "Monthly membership",
    amount: 1800,
    currency: "gbp",
    interval: "month",
    opens: "Every course",
  });
}, 60_000);
afterAll(async () => w?.close());

const eventCount = async () => (await w.db.select({ n: count() }).from(webhookEvents))[0].n;

describe("plans", () => {
  it("creates the Stripe product and price first, stored with their ids", async () => {
    const [row] = await w.db.select().from(plans).where(eq(plans.id, monthly.id));
    expect(row).toMatchObject({ amount: 1800, currency: "GBP", interval: "month", opens: "Every course" });
    const price = await w.stripe().prices.retrieve(monthly.stripePriceId);
    expect(price.unit_amount).toBe(1800);
    expect(price.currency).toBe("gbp");
    expect(price.recurring?.interval).toBe("month");
    expect(price.product).toBe(row.stripeProductId);
  });

  it("refuses bad input naming the field, and writes nothing", async () => {
    const before = (await w.db.select({ n: count() }).from(plans))[0].n;
    const cases: [Record<string, unknown>, string][] = [
      [{ name: "Free", amount: 0, currency: "GBP", interval: "month" }, "amount"],
      [{ name: "Pennies", amount: 12.5, currency: "GBP", interval: "month" }, "amount"],
      [{ name: "Yen", amount: 1800, currency: "JPY", interval: "month" }, "currency"],
      [{ name: "Weekly", amount: 500, currency: "GBP", interval: "week" }, "interval"],
      [{ name: "", amount: 500, currency: "GBP", interval: "year" }, "name"],
    ];
    for (const [body, field] of cases) {
      const res = await w.call("admin/plans", "POST", { cookie: adminCookie, body });
      expect(res.status).toBe(400);
      expect(Object.keys((await w.json<{ fieldErrors: Record<string, string> }>(res)).fieldErrors)).toContain(field);
    }
    expect((await w.db.select({ n: count() }).from(plans))[0].n).toBe(before);
  });

  it("renames in step with the Stripe product; a new price is a new Stripe price", async () => {
    const p = await w.plan(adminCookie, { name: "Spring term", amount: 4500, currency: "EUR", interval: "month" });
    const res = await w.call("admin/plans/[id]", "PATCH", {
      cookie: adminCookie,
      params: { id: p.id },
      body: { name: "Spring term (new)", amount: 4800 },
    });
    expect(res.status).toBe(200);
    const [row] = await w.db.select().from(plans).where(eq(plans.id, p.id));
    expect(row.stripePriceId).not.toBe(p.stripePriceId);
    expect((await w.stripe().products.retrieve(row.stripeProductId ?? "")).name).toBe("Spring term (new)");
    expect((await w.stripe().prices.retrieve(p.stripePriceId)).active).toBe(false); // Stripe prices are immutable: the old one is archived
    expect((await w.stripe().prices.retrieve(row.stripePriceId ?? "")).unit_amount).toBe(4800);
    // Never used: deleted outright, its product deactivated.
    expect((await w.call("admin/plans/[id]", "DELETE", { cookie: adminCookie, params: { id: p.id } })).status).toBe(
      204,
    );
    expect((await w.stripe().products.retrieve(row.stripeProductId ?? "")).active).toBe(false);
  });
});

describe("checkout → webhook → gate", () => {
  it("opens a member-only rung once Stripe's webhooks have written the membership", async () => {
    const student = await w.person("student");
    const cookie = await w.cookieFor(student.id);
    const { canOpenRung } = await import("@/lib/catalogue/access");
    const viewer = { id: student.id, role: "student" as const };
    // The taster is done, so only the membership stands between the student and rung B.
    await w.db.insert(tuneProgress).values({ userId: student.id, tuneId: f.tunes.A, reachedStage: 1 });
    expect((await canOpenRung(w.db, viewer, f.rungs.B))?.allowed).toBe(false);

    const paid = await w.subscribe(cookie, monthly.id, "4242 4242 4242 4242", f.courseId);
    // Stripe docs: Checkout redirects to success_url with {CHECKOUT_SESSION_ID} filled in.
    expect(paid.status).toBe(303);
    expect(paid.headers.get("location")).toMatch(/\/learn\/billing\/welcome\?session_id=cs_\w+&course=fixture-/);

    const [sub] = await w.db.select().from(subscriptions).where(eq(subscriptions.userId, student.id));
    expect(sub).toMatchObject({ status: "active", planId: monthly.id, cancelAtPeriodEnd: false, graceUntil: null });
    const [pay] = await w.db.select().from(payments).where(eq(payments.userId, student.id));
    expect(pay).toMatchObject({ kind: "new", status: "paid", amount: 1800, currency: "GBP", subscriptionId: sub.id });
    expect(pay.receiptNumber).toBeTruthy();
    const [enrolled] = await w.db.select().from(enrolments).where(eq(enrolments.userId, student.id));
    expect(enrolled).toMatchObject({ courseId: f.courseId, status: "active" });
    expect((await canOpenRung(w.db, viewer, f.rungs.A))?.allowed).toBe(true);
    expect((await canOpenRung(w.db, viewer, f.rungs.B))?.allowed).toBe(true);
    expect((await w.mailsTo(student.email)).map((m) => m.template)).toContain("payment-receipt");
    // The billing page's summary: status in words, the next charge, the invoice with its receipt number.
    const summary = await w.json<{
      membership: { statusWords: string; nextCharge: { amount: number; date: string } };
      payments: { receiptNumber: string }[];
    }>(await w.call("billing", "GET", { cookie }));
    expect(summary.membership.statusWords).toBe("Active");
    expect(summary.membership.nextCharge).toMatchObject({ amount: 1800, date: sub.currentPeriodEnd?.toISOString() });
    expect(summary.payments.map((p) => p.receiptNumber)).toEqual([pay.receiptNumber]);
    // Cancel at period end goes to Stripe; the row follows from the webhook, and resume undoes it.
    expect((await w.call("billing/cancel", "POST", { cookie, body: {} })).status).toBe(200);
    await w.fake.settled();
    expect((await w.db.select().from(subscriptions).where(eq(subscriptions.id, sub.id)))[0].cancelAtPeriodEnd).toBe(
      true,
    );
    expect((await canOpenRung(w.db, viewer, f.rungs.B))?.allowed).toBe(true); // open until the period ends
    expect((await w.call("billing/resume", "POST", { cookie, body: {} })).status).toBe(200);
    await w.fake.settled();
    expect((await w.db.select().from(subscriptions).where(eq(subscriptions.id, sub.id)))[0].cancelAtPeriodEnd).toBe(
      false,
    );
  });

  it("a declined card opens nothing and writes no membership", async () => {
    const student = await w.person("student");
    const res = await w.call("billing/checkout", "POST", {
      cookie: await w.cookieFor(student.id),
      body: { planId: monthly.id },
    });
    const page = await w.pay((await w.json<{ url: string }>(res)).url, "4000 0000 0000 0002");
    expect(page.status).toBe(402);
    // Stripe docs: Testing — 4000 0000 0000 0002 is a generic decline; the stand-in's page says so in its own words.
    expect(await page.text()).toContain("That card was turned down by its bank.");
    await w.fake.settled();
    expect(await w.db.select().from(subscriptions).where(eq(subscriptions.userId, student.id))).toEqual([]);
    expect(await w.db.select().from(payments).where(eq(payments.userId, student.id))).toEqual([]);
  });

  it("refuses a bad or missing signature with 400 and writes nothing", async () => {
    const before = await eventCount();
    const body = JSON.stringify({
      id: "evt_forged",
      object: "event",
      type: "customer.subscription.deleted",
      created: 1,
      data: { object: {} },
    });
    const { POST } = await import("@/app/api/webhooks/stripe/route");
    const t = Math.floor(Date.now() / 1000);
    const forged = w
      .stripe()
      .webhooks.generateTestHeaderString({ payload: body, secret: "whsec_someone_else", timestamp: t });
    for (const sig of [forged, null, "t=1,v1=00"]) {
      const headers = new Headers(sig ? { "stripe-signature": sig } : {});
      expect(
        (await POST(new Request("http://127.0.0.1/api/webhooks/stripe", { method: "POST", headers, body }))).status,
      ).toBe(400);
    }
    expect(await eventCount()).toBe(before);
  });

  it("stores each event once: a redelivery answers 200 and changes nothing", async () => {
    const sent = w.fake.events().find((e) => e.type === "invoice.paid");
    expect(sent).toBeDefined();
    const { delivery: _d, ...event } = sent ?? ({} as NonNullable<typeof sent>);
    const body = JSON.stringify(event);
    const sig = w.stripe().webhooks.generateTestHeaderString({ payload: body, secret: w.webhookSecret });
    const before = { events: await eventCount(), payments: await w.db.select().from(payments) };
    const { POST } = await import("@/app/api/webhooks/stripe/route");
    const res = await POST(
      new Request("http://127.0.0.1/api/webhooks/stripe", {
        method: "POST",
        headers: { "stripe-signature": sig },
        body,
      }),
    );
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ duplicate: true });
    expect(await eventCount()).toBe(before.events);
    expect(await w.db.select().from(payments)).toEqual(before.payments);
  });

  it("keeps a plan in use from being deleted (409, retire instead) and retires it", async () => {
    const res = await w.call("admin/plans/[id]", "DELETE", { cookie: adminCookie, params: { id: monthly.id } });
    expect(res.status).toBe(409);
    expect((await w.json<{ error: string }>(res)).error).toMatch(/retire it instead/);
    const retired = await w.call("admin/plans/[id]", "POST", {
      cookie: adminCookie,
      params: { id: monthly.id },
      body: { action: "retire" },
    });
    expect(retired.status).toBe(200);
    expect((await w.stripe().prices.retrieve(monthly.stripePriceId)).active).toBe(false);
    const visitorList = await w.call("billing/checkout", "POST", {
      cookie: await w.cookieFor((await w.person("student")).id),
      body: { planId: monthly.id },
    });
    expect(visitorList.status).toBe(404); // a retired plan is not on offer to new members
  });
});
