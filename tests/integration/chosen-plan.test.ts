// The plan chosen before signing up survives sign-up and the e-mail confirmation and leads straight
// to its checkout (issue "From paying to playing", item 4): it rides in the confirmation link, the
// confirmation sends the person to sign in with the checkout as the next address, and signing in
// goes there. (The checkout page itself, to the payment stand-in's card page, is walked in
// tests/e2e/enrol-journey.test.ts.)
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { authWorld, TEST_APP_URL, type AuthWorld } from "./helpers/auth-world";

let w: AuthWorld;
let A: typeof import("@/lib/auth/actions");
const PLAN = "5d3c1f0e-2b4a-4c6d-8e9f-0a1b2c3d4e5f";

beforeAll(async () => {
  w = await authWorld();
  A = await import("@/lib/auth/actions");
});
afterAll(async () => w?.close());

async function verifyUrlMailedTo(email: string): Promise<URL> {
  const mail = (await w.mailsTo(email)).find((m) => m.template === "welcome");
  return new URL((mail?.payload as { verifyUrl: string }).verifyUrl);
}

describe("the chosen plan through sign-up and confirmation", () => {
  it("rides in the confirmation link and leads, after sign-in, to its checkout", async () => {
    const email = "plan.chooser@new.example";
    const signUp = await A.signUpAction((await w.context()).ctx, {
      name: "Plan Chooser",
      email,
      password: "plenty-of-reels-here",
      plan: PLAN,
      course: "first-steps",
    });
    expect(signUp.status).toBe(200);
    const link = await verifyUrlMailedTo(email);
    expect(link.origin).toBe(TEST_APP_URL);
    expect(link.pathname).toBe("/verify-email");
    expect(link.searchParams.get("plan")).toBe(PLAN);
    expect(link.searchParams.get("course")).toBe("first-steps");

    const checkout = `/learn/billing/checkout?plan=${PLAN}&course=first-steps`;
    const verified = await A.verifyEmailAction((await w.context()).ctx, {
      token: link.searchParams.get("token") ?? "",
      plan: link.searchParams.get("plan") ?? undefined,
      course: link.searchParams.get("course") ?? undefined,
    });
    expect(verified).toEqual({
      status: 200,
      redirectTo: `/sign-in?confirmed=1&next=${encodeURIComponent(checkout)}`,
    });
    const signedIn = await A.signInAction((await w.context()).ctx, {
      email,
      password: "plenty-of-reels-here",
      next: checkout,
    });
    expect(signedIn).toMatchObject({ status: 200, redirectTo: checkout });
  });

  it("drops a malformed plan or course quietly: the confirmation then leads to a plain sign-in", async () => {
    const email = "odd.plan@new.example";
    await A.signUpAction((await w.context()).ctx, {
      name: "Odd Plan",
      email,
      password: "plenty-of-jigs-here",
      plan: "not-a-plan",
      course: "../../admin",
    });
    const link = await verifyUrlMailedTo(email);
    expect(link.searchParams.has("plan")).toBe(false);
    expect(link.searchParams.has("course")).toBe(false);
    const verified = await A.verifyEmailAction((await w.context()).ctx, {
      token: link.searchParams.get("token") ?? "",
      plan: "not-a-plan",
    });
    expect(verified).toEqual({ status: 200, redirectTo: "/sign-in?confirmed=1" });
  });
});
