import { sql } from "drizzle-orm";
import {
  boolean,
  check,
  char,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { users } from "./people";

export const planIntervalEnum = pgEnum("plan_interval", ["month", "year"]);

// Money is always integer minor units (pence, cents) with an ISO 4217 currency code.
export const plans = pgTable(
  "plans",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    amount: integer("amount").notNull(),
    currency: char("currency", { length: 3 }).notNull(),
    interval: planIntervalEnum("interval").notNull(),
    opens: text("opens").notNull().default("The whole catalogue"),
    stripeProductId: text("stripe_product_id").unique(),
    stripePriceId: text("stripe_price_id").unique(),
    // A plan in use is retired, never deleted.
    retiredAt: timestamp("retired_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check("plans_amount_nonneg", sql`${t.amount} >= 0`)],
);

export const subscriptionStatusEnum = pgEnum("subscription_status", [
  "incomplete",
  "incomplete_expired",
  "trialing",
  "active",
  "past_due",
  "canceled",
  "unpaid",
  "paused",
]);

export const subscriptions = pgTable(
  "subscriptions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    planId: uuid("plan_id")
      .notNull()
      .references(() => plans.id, { onDelete: "restrict" }),
    stripeSubscriptionId: text("stripe_subscription_id").notNull().unique(),
    status: subscriptionStatusEnum("status").notNull(),
    currentPeriodStart: timestamp("current_period_start", { withTimezone: true }),
    currentPeriodEnd: timestamp("current_period_end", { withTimezone: true }),
    canceledAt: timestamp("canceled_at", { withTimezone: true }),
    cancelAtPeriodEnd: boolean("cancel_at_period_end").notNull().default(false),
    graceUntil: timestamp("grace_until", { withTimezone: true }),
    // Stripe's event time of the last applied change, so an older event arriving late changes nothing.
    stripeUpdatedAt: timestamp("stripe_updated_at", { withTimezone: true }),
    startedAt: timestamp("started_at", { withTimezone: true }).notNull().defaultNow(),
    endedAt: timestamp("ended_at", { withTimezone: true }),
  },
  (t) => [index("subscriptions_user_idx").on(t.userId), index("subscriptions_status_idx").on(t.status)],
);

export const paymentStatusEnum = pgEnum("payment_status", ["paid", "failed", "refunded", "partially_refunded"]);
export const paymentKindEnum = pgEnum("payment_kind", ["new", "renewal", "plan_change"]);

export const payments = pgTable(
  "payments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    subscriptionId: uuid("subscription_id").references(() => subscriptions.id, { onDelete: "set null" }),
    planId: uuid("plan_id").references(() => plans.id, { onDelete: "set null" }),
    stripeInvoiceId: text("stripe_invoice_id").notNull().unique(),
    stripePaymentIntentId: text("stripe_payment_intent_id"),
    kind: paymentKindEnum("kind").notNull(),
    amount: integer("amount").notNull(),
    refundedAmount: integer("refunded_amount").notNull().default(0),
    currency: char("currency", { length: 3 }).notNull(),
    status: paymentStatusEnum("status").notNull(),
    // Why a charge failed, in the card network's words as Stripe reports them (failed payments only).
    failureMessage: text("failure_message"),
    receiptNumber: text("receipt_number"),
    periodStart: timestamp("period_start", { withTimezone: true }),
    periodEnd: timestamp("period_end", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull(),
  },
  (t) => [
    index("payments_created_idx").on(t.createdAt),
    index("payments_status_created_idx").on(t.status, t.createdAt),
    index("payments_plan_created_idx").on(t.planId, t.createdAt),
    // The admin table's usual filters (status, plan) then its sort, so a page is read in order from
    // one index and stops after the page; the date last in the amount one lets a range be tested inside it.
    index("payments_status_plan_created_idx").on(t.status, t.planId, t.createdAt, t.id),
    index("payments_status_plan_amount_idx").on(t.status, t.planId, t.amount, t.id, t.createdAt),
    // No index on user_id alone: payments_user_created_idx (user_id, created_at, migration 0003) serves
    // every lookup by person, and each index more costs the planner time on every admin-table page.
    check("payments_refund_within_amount", sql`${t.refundedAmount} between 0 and ${t.amount}`),
  ],
);

export const refunds = pgTable(
  "refunds",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    paymentId: uuid("payment_id")
      .notNull()
      .references(() => payments.id, { onDelete: "restrict" }),
    stripeRefundId: text("stripe_refund_id").notNull().unique(),
    amount: integer("amount").notNull(),
    currency: char("currency", { length: 3 }).notNull(),
    reason: text("reason").notNull(),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("refunds_payment_idx").on(t.paymentId), check("refunds_amount_pos", sql`${t.amount} > 0`)],
);

export const refundAttemptStatusEnum = pgEnum("refund_attempt_status", ["pending", "done", "failed"]);

/**
 * A refund asked of Stripe, written before the call. At most one is pending per payment (a second
 * refund at the same time is told another is in progress), and a refund Stripe made while the local
 * write failed is found again from here by the charge.refunded webhook or the worker's repair pass.
 */
export const refundAttempts = pgTable(
  "refund_attempts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    paymentId: uuid("payment_id")
      .notNull()
      .references(() => payments.id, { onDelete: "restrict" }),
    amount: integer("amount").notNull(),
    reason: text("reason").notNull(),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    idempotencyKey: text("idempotency_key").notNull(),
    stripeRefundId: text("stripe_refund_id").unique(),
    status: refundAttemptStatusEnum("status").notNull().default("pending"),
    // Why Stripe refused it (status failed).
    error: text("error"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [
    uniqueIndex("refund_attempts_one_pending_idx")
      .on(t.paymentId)
      .where(sql`${t.status} = 'pending'`),
    check("refund_attempts_amount_pos", sql`${t.amount} > 0`),
  ],
);

/** Each Stripe event id is stored once: a redelivered event is recognised and changes nothing. */
export const webhookEvents = pgTable("webhook_events", {
  id: text("id").primaryKey(),
  type: text("type").notNull(),
  // The event as received, with NUL characters (which jsonb cannot hold) replaced by U+FFFD.
  payload: jsonb("payload").notNull(),
  receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
  processedAt: timestamp("processed_at", { withTimezone: true }),
  // Why it was not applied (a malformed object, or the handler's failure): kept for inspection.
  error: text("error"),
});
