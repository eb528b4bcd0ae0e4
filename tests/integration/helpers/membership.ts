// A membership straight in the database, for tests whose students must open member-only rungs
// (lib/billing/gate.ts). Real memberships are written by the Stripe webhook handlers only; the
// billing tests exercise that path (tests/integration/billing-*.test.ts).
import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { plans, subscriptions } from "@/db/schema";

type Status = (typeof subscriptions.$inferSelect)["status"];

async function testPlan(db: Db): Promise<string> {
  const [found] = await db.select({ id: plans.id }).from(plans).where(eq(plans.name, "Test membership")).limit(1);
  if (found) return found.id;
  const [row] = await db
    .insert(plans)
    .values({ name: "Test membership", amount: 1800, currency: "GBP", interval: "month" })
    .returning({ id: plans.id });
  return row.id;
}

/** Gives the person a subscription with this status, its period running a month either side of now. */
export async function giveMembership(
  db: Db,
  userId: string,
  status: Status = "active",
  o: { graceUntil?: Date | null } = {},
): Promise<string> {
  const now = Date.now();
  const [row] = await db
    .insert(subscriptions)
    .values({
      userId,
      planId: await testPlan(db),
      stripeSubscriptionId: `sub_test_${randomBytes(8).toString("hex")}`,
      status,
      currentPeriodStart: new Date(now - 15 * 86_400_000),
      currentPeriodEnd: new Date(now + 15 * 86_400_000),
      graceUntil: o.graceUntil ?? null,
    })
    .returning({ id: subscriptions.id });
  return row.id;
}
