// What happens to a subscription over time: renewal at the end of each period, retries of a failed
// renewal, cancellation at the period end or after the last failed retry. Stripe lets an account choose
// what follows the last failed retry (cancel the subscription, mark it unpaid, or leave it past due —
// Stripe docs: "Automate payment retries", "Manage failed payments"); this stand-in cancels it, the
// choice the app is built for.
import { periodEnd } from "../clock";
import type { Fake } from "../context";
import { render } from "../render";
import type { Invoice, JsonObject, Subscription } from "../types";
import { createInvoice, itemLine, payInvoice } from "./invoices-engine";

/** previous_attributes as Stripe sends them on *.updated: the top-level fields that changed, before. */
export function changedFields(before: JsonObject, after: JsonObject): JsonObject {
  const prev: JsonObject = {};
  for (const [k, v] of Object.entries(before)) {
    if (JSON.stringify(v) !== JSON.stringify(after[k])) prev[k] = v ?? null;
  }
  return prev;
}

/** Runs a change on a subscription and sends customer.subscription.updated if anything changed. */
export function updateSubscription(fake: Fake, sub: Subscription, change: () => void): void {
  const before = render(fake.store, sub);
  change();
  const after = render(fake.store, sub);
  const prev = changedFields(before, after);
  if (Object.keys(prev).length > 0) fake.hooks.emit("customer.subscription.updated", sub, prev);
}

export function cancelNow(fake: Fake, sub: Subscription, reason: "cancellation_requested" | "payment_failed"): void {
  const now = fake.clock.now();
  sub.status = "canceled";
  sub.ended_at = now;
  if (reason === "payment_failed" || sub.canceled_at === null) sub.canceled_at = now;
  sub.cancel_at = null;
  sub.cancellation_details = { ...sub.cancellation_details, reason };
  fake.hooks.emit("customer.subscription.deleted", sub);
}

export function currentPeriod(sub: Subscription): { start: number; end: number } {
  const first = sub.items[0];
  return { start: first?.current_period_start ?? sub.start_date, end: first?.current_period_end ?? sub.start_date };
}

export function invoiceOutcome(fake: Fake, inv: Invoice, sub: Subscription, failed: boolean): void {
  fake.store.put(inv);
  if (inv.status === "paid") fake.hooks.emit("invoice.paid", inv);
  else if (failed) fake.hooks.emit("invoice.payment_failed", inv);
  if (failed && inv.next_payment_attempt === null && sub.status !== "canceled") cancelNow(fake, sub, "payment_failed");
}

/** The period ends: a new period starts, its invoice is made and charged. */
export function renew(fake: Fake, sub: Subscription): void {
  let inv: Invoice | undefined;
  let failed = false;
  updateSubscription(fake, sub, () => {
    const usage = currentPeriod(sub);
    const start = usage.end;
    const lines = [...(sub.pending_lines ?? [])];
    sub.pending_lines = [];
    for (const item of sub.items) {
      const price = fake.store.get("price", item.price);
      const rec = price.recurring ?? { interval: "month" as const, interval_count: 1 };
      item.current_period_start = start;
      item.current_period_end = periodEnd(sub.billing_cycle_anchor, start, rec.interval, rec.interval_count);
      lines.push(itemLine(fake, sub, item.id, price, item.quantity, { start, end: item.current_period_end }));
    }
    inv = createInvoice(fake, { sub, lines, reason: "subscription_cycle", usage });
    failed = payInvoice(fake, inv, sub) !== null;
    if (failed && sub.status === "active") sub.status = "past_due";
  });
  if (inv) invoiceOutcome(fake, inv, sub, failed);
}

/** A scheduled retry of an open invoice (or a payment asked for now, e.g. after a new card). */
export function retryInvoice(fake: Fake, inv: Invoice, sub: Subscription): boolean {
  let failed = false;
  updateSubscription(fake, sub, () => {
    failed = payInvoice(fake, inv, sub) !== null;
    const stillOpen = fake.store.all("invoice").some((i) => i.subscription === sub.id && i.status === "open");
    if (!failed && sub.status === "past_due" && !stillOpen) sub.status = "active";
  });
  invoiceOutcome(fake, inv, sub, failed);
  return !failed;
}

interface Due {
  at: number;
  run: () => void;
}

function nextDue(fake: Fake, upTo: number): Due | null {
  let best: Due | null = null;
  const consider = (at: number, run: () => void) => {
    if (at <= upTo && (!best || at < best.at)) best = { at, run };
  };
  for (const sub of fake.store.all("subscription")) {
    if (sub.status !== "active" && sub.status !== "past_due" && sub.status !== "trialing") continue;
    const { end } = currentPeriod(sub);
    if (sub.cancel_at !== null && sub.cancel_at < end)
      consider(sub.cancel_at, () => cancelNow(fake, sub, "cancellation_requested"));
    else
      consider(end, () =>
        sub.cancel_at_period_end ? cancelNow(fake, sub, "cancellation_requested") : renew(fake, sub),
      );
  }
  for (const inv of fake.store.all("invoice")) {
    if (inv.status !== "open" || inv.next_payment_attempt === null || !inv.subscription) continue;
    const sub = fake.store.find("subscription", inv.subscription);
    if (!sub || sub.status === "canceled") continue;
    consider(inv.next_payment_attempt, () => retryInvoice(fake, inv, sub));
  }
  return best;
}

/** Runs everything due up to `upTo`, earliest first, each at its own moment. Returns how many ran. */
export function runDue(fake: Fake, upTo: number): number {
  let count = 0;
  for (let due = nextDue(fake, upTo); due && count < 100_000; due = nextDue(fake, upTo)) {
    const { at, run } = due;
    fake.clock.at(at, run);
    count++;
  }
  if (count > 0) fake.store.save();
  return count;
}
