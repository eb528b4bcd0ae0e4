// The Stripe webhook route as an attacker and a careless sender meet it: signed but malformed events are
// answered 400 and stored for a look, a timestamp from beyond the tolerance ahead is refused, and any
// event Stripe can send (a NUL in free text included) is stored.
import { eq } from "drizzle-orm";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { webhookEvents } from "@/db/schema";
import { authWorld, type AuthWorld } from "./helpers/auth-world";

const SECRET = "whsec_webhooks_integrity";
let w: AuthWorld;
let POST: (r: Request) => Promise<Response>;
const sdk = new Stripe("sk_test_webhooks_integrity");

beforeAll(async () => {
  w = await authWorld();
  process.env.STRIPE_SECRET_KEY = "sk_test_webhooks_integrity";
  process.env.STRIPE_WEBHOOK_SECRET = SECRET;
  POST = ((await import("@/app/api/webhooks/stripe/route")) as { POST: typeof POST }).POST;
});
afterAll(async () => w?.close());

let n = 0;
/** Delivers `payload` signed as Stripe signs (Stripe docs: "Check the webhook signatures"). */
async function deliver(payload: string, timestamp = Math.floor(Date.now() / 1000)) {
  const signature = sdk.webhooks.generateTestHeaderString({ payload, secret: SECRET, timestamp });
  const res = await POST(
    new Request("http://127.0.0.1/api/webhooks/stripe", {
      method: "POST",
      headers: { "stripe-signature": signature, "content-type": "application/json" },
      body: payload,
    }),
  );
  return { status: res.status, body: (await res.json()) as { received: boolean; error?: string } };
}
const event = (type: string, object: unknown) =>
  JSON.stringify({ id: `evt_integrity_${++n}`, object: "event", type, created: 1_800_000_000, data: { object } });
const stored = async (id: string) => (await w.db.select().from(webhookEvents).where(eq(webhookEvents.id, id)))[0];

describe("signed webhooks", () => {
  it("answer a malformed object 400 and store it with the reason, unapplied", async () => {
    const body = event("charge.refunded", { id: "ch_1", currency: 42, refunds: "not a list" });
    const res = await deliver(body);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/malformed charge\.refunded object/);
    const row = await stored(`evt_integrity_${n}`);
    expect(row).toMatchObject({ type: "charge.refunded", processedAt: null });
    expect(row?.error).toMatch(/currency/);
  });

  it("answer a body that is no event 400, and keep it too", async () => {
    for (const body of ['{"hello":"there"}', "[1,2,3]", '{"id":"evt_x","type":7,"data":null}']) {
      const res = await deliver(body);
      expect(res.status, body).toBe(400);
      expect(res.body.error).toMatch(/malformed event/);
    }
    const kept = await w.db.select().from(webhookEvents).where(eq(webhookEvents.type, "malformed"));
    expect(kept.length).toBeGreaterThanOrEqual(3);
  });

  it("refuse a timestamp from beyond the tolerance ahead, and store nothing", async () => {
    const body = event("customer.created", { id: "cus_future" });
    const res = await deliver(body, Math.floor(Date.now() / 1000) + 3600);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/future/);
    expect(await stored(`evt_integrity_${n}`)).toBeUndefined();
    // Within the tolerance (clocks differ a little) is accepted.
    expect(
      (await deliver(event("customer.created", { id: "cus_soon" }), Math.floor(Date.now() / 1000) + 60)).status,
    ).toBe(200);
  });

  it("store an event whose free text holds a NUL (jsonb cannot), answered 200", async () => {
    const body = event("customer.created", {
      id: "cus_nul",
      name: "Nul\u0000Name",
      metadata: { "k\u0000": "v\u0000" },
    });
    expect(body).toContain("\\u0000");
    const res = await deliver(body);
    expect(res.status).toBe(200);
    const row = await stored(`evt_integrity_${n}`);
    expect(JSON.stringify(row?.payload)).toContain("Nul\ufffdName");
    expect(row?.processedAt).not.toBeNull();
  });

  it("refuse an unsigned or wrongly signed body with 400, storing nothing", async () => {
    const before = (await w.db.select().from(webhookEvents)).length;
    const res = await POST(
      new Request("http://127.0.0.1/api/webhooks/stripe", {
        method: "POST",
        headers: { "stripe-signature": "t=1,v1=00" },
        body: event("charge.refunded", {}),
      }),
    );
    expect(res.status).toBe(400);
    expect((await w.db.select().from(webhookEvents)).length).toBe(before);
  });
});
