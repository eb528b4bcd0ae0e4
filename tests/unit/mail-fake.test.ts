import { Resend } from "resend";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { startResendFake, type ResendFake } from "@/scripts/fakes/resend";

// The stand-in is checked through the real `resend` SDK wherever the SDK can make the request,
// so it is held to what the SDK sends, not to what we believe it sends.
const KEY = "re_test_key";
let fake: ResendFake;
let resend: Resend;
const message = {
  from: "Rosinwood <hello@rosinwood.test>",
  to: "ann@example.com",
  subject: "Hello",
  html: "<p>Hi</p>",
  text: "Hi",
};

beforeAll(async () => {
  fake = await startResendFake({ port: 0, apiKey: KEY });
  resend = new Resend(KEY, { baseUrl: fake.url });
});
afterAll(() => fake.close());
beforeEach(async () => {
  fake.setFailRate(0);
  await fetch(`${fake.url}/_fake/emails`, { method: "DELETE" });
});

describe("the Resend stand-in", () => {
  it("stores a message sent through the SDK and answers with its id", async () => {
    const { data, error } = await resend.emails.send(message);
    expect(error).toBeNull();
    const stored = fake.emails();
    expect(stored).toHaveLength(1);
    expect(stored[0]).toMatchObject({
      id: data?.id,
      to: ["ann@example.com"],
      subject: "Hello",
      html: "<p>Hi</p>",
      text: "Hi",
    });
  });

  it("refuses a request without a key (401) and with a wrong key (403)", async () => {
    // Resend API reference, "Errors": missing_api_key is 401, invalid_api_key is 403.
    const bare = await fetch(`${fake.url}/emails`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(message),
    });
    expect(bare.status).toBe(401);
    expect(await bare.json()).toMatchObject({ statusCode: 401, name: "missing_api_key" });
    const wrong = await new Resend("re_other", { baseUrl: fake.url }).emails.send(message);
    expect(wrong.error).toMatchObject({ statusCode: 403, name: "invalid_api_key" });
    expect(fake.emails()).toHaveLength(0);
  });

  it("answers the same id for the same idempotency key and stores the message once", async () => {
    const first = await resend.emails.send(message, { idempotencyKey: "outbox-1" });
    const second = await resend.emails.send(message, { idempotencyKey: "outbox-1" });
    expect(first.data?.id).toBeTruthy();
    expect(second.data?.id).toBe(first.data?.id);
    expect(fake.emails()).toHaveLength(1);
    expect(fake.emails()[0]?.idempotency_key).toBe("outbox-1");
  });

  it("refuses the same key with another payload (409), as Resend does", async () => {
    await resend.emails.send(message, { idempotencyKey: "outbox-2" });
    const other = await resend.emails.send({ ...message, subject: "Changed" }, { idempotencyKey: "outbox-2" });
    expect(other.error).toMatchObject({ statusCode: 409, name: "invalid_idempotent_request" });
  });

  it("checks from, to and subject", async () => {
    const noSubject = await resend.emails.send({ ...message, subject: "" });
    expect(noSubject.error).toMatchObject({ statusCode: 422, name: "missing_required_field" });
    const badTo = await resend.emails.send({ ...message, to: "not an address" });
    expect(badTo.error).toMatchObject({ statusCode: 422, name: "validation_error" });
    const badFrom = await resend.emails.send({ ...message, from: "Rosinwood" });
    expect(badFrom.error?.statusCode).toBe(422);
    expect(fake.emails()).toHaveLength(0);
  });

  it("fails on purpose at the set rate, with a Resend-shaped body, storing nothing", async () => {
    fake.setFailRate(1);
    const failed = await resend.emails.send(message, { idempotencyKey: "outbox-3" });
    expect(failed.error).toMatchObject({ statusCode: 500, name: "internal_server_error" });
    expect(fake.emails()).toHaveLength(0);
    // The setting also changes over HTTP, which is how a person trying the demo would turn it off.
    const set = await fetch(`${fake.url}/_fake/settings`, { method: "POST", body: JSON.stringify({ failRate: 0 }) });
    expect(await set.json()).toEqual({ failRate: 0 });
    expect((await resend.emails.send(message, { idempotencyKey: "outbox-3" })).error).toBeNull();
    expect(fake.emails()).toHaveLength(1);
  });

  it("fails about the set share of requests", async () => {
    fake.setFailRate(0.3);
    const results = await Promise.all(
      Array.from({ length: 200 }, (_, i) => resend.emails.send({ ...message, subject: `n${i}` })),
    );
    const failed = results.filter((r) => r.error?.statusCode === 500).length;
    // Binomial(200, 0.3): mean 60, sd ≈ 6.5; ±30 is over four and a half standard deviations.
    expect(failed).toBeGreaterThan(30);
    expect(failed).toBeLessThan(90);
    expect(fake.emails()).toHaveLength(200 - failed);
  });

  it("lists messages newest first and serves one by id", async () => {
    await resend.emails.send({ ...message, subject: "older" });
    await resend.emails.send({ ...message, subject: "newer" });
    const list = (await (await fetch(`${fake.url}/_fake/emails`)).json()) as {
      data: { id: string; subject: string }[];
    };
    expect(list.data.map((e) => e.subject)).toEqual(["newer", "older"]);
    const one = await fetch(`${fake.url}/_fake/emails/${list.data[1]?.id}`);
    expect(((await one.json()) as { subject: string }).subject).toBe("older");
    expect((await fetch(`${fake.url}/_fake/emails/nope`)).status).toBe(404);
  });
});
