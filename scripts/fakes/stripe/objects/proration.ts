// A plan change as Stripe prices it (Stripe docs: "Prorations"; Stripe support: "How does Stripe handle
// subscription plan changes in the middle of a billing period?"):
// - same billing interval: a credit for the unused time on the old price and a charge for the remaining
//   time on the new price, each = amount × (period end − change time) / (period end − period start),
//   to the second, rounded to the minor unit; with proration_behavior=create_prorations they wait for
//   the next renewal invoice, with always_invoice they are invoiced at once, with none nothing is owed;
// - a different interval (monthly ↔ yearly): the billing cycle restarts at the change, and the customer
//   is invoiced at once for a full period of the new price less the credit for the unused old time.
import { periodEnd } from "../clock";
import { isoDate, type Fake } from "../context";
import { invalidParam } from "../errors";
import type { Params } from "../params";
import { newId } from "../state";
import type { InvoiceLine, Price, Subscription, SubscriptionItem } from "../types";
import { itemLine } from "./invoices-engine";

export type ProrationBehavior = "create_prorations" | "always_invoice" | "none";

export interface ItemChange {
  item: SubscriptionItem;
  price: Price;
  quantity: number;
}

export interface PlanChange {
  changes: ItemChange[];
  /** Proration lines (credits and charges for the rest of the current period). */
  prorations: InvoiceLine[];
  /** Set when the interval changes: the new period and its full-price lines, invoiced now. */
  reset: { start: number; end: number; lines: InvoiceLine[] } | null;
}

function prorationLine(
  fake: Fake,
  sub: Subscription,
  item: SubscriptionItem,
  price: Price,
  quantity: number,
  t: number,
  credit: boolean,
): InvoiceLine {
  const { current_period_start: start, current_period_end: end } = item;
  const share = end > start ? (end - Math.min(Math.max(t, start), end)) / (end - start) : 0;
  const amount = Math.round(price.unit_amount * quantity * share) * (credit ? -1 : 1);
  const name = fake.store.find("product", price.product)?.name ?? price.id;
  const when = new Date(t * 1000).toLocaleDateString("en-GB", {
    day: "numeric",
    month: "short",
    year: "numeric",
    timeZone: "UTC",
  });
  return {
    id: newId("il"),
    object: "line_item",
    amount,
    currency: price.currency,
    description: `${credit ? "Unused" : "Remaining"} time on ${quantity > 1 ? `${quantity} × ` : ""}${name} after ${when}`,
    quantity,
    period: { start: Math.max(t, start), end },
    price: price.id,
    proration: true,
    subscription: sub.id,
    subscription_item: item.id,
    metadata: { proration_date: isoDate(t) },
  };
}

/** Reads items[…] ({id, price, quantity}) against the subscription; nothing is changed yet. */
export function readItemChanges(fake: Fake, sub: Subscription, list: Params[], param: string): ItemChange[] {
  return list.map((p, i) => {
    const id = p.str("id");
    const item = id ? sub.items.find((x) => x.id === id) : sub.items.length === 1 ? sub.items[0] : undefined;
    if (!item)
      throw invalidParam(
        `${param}[${i}][id]`,
        id ? `No such subscription item: '${id}'` : `Missing required param: ${param}[${i}][id].`,
        id ? "resource_missing" : "parameter_missing",
      );
    const priceId = p.str("price") ?? item.price;
    const price = fake.store.get("price", priceId, `${param}[${i}][price]`);
    if (!price.active)
      throw invalidParam(
        `${param}[${i}][price]`,
        `The price specified (${price.id}) is inactive. This field only accepts active prices.`,
      );
    if (price.currency !== sub.currency)
      throw invalidParam(
        `${param}[${i}][price]`,
        `The price's currency (${price.currency}) must match the subscription's (${sub.currency}).`,
      );
    const quantity = p.int("quantity") ?? item.quantity;
    return { item, price, quantity };
  });
}

export function planChange(
  fake: Fake,
  sub: Subscription,
  changes: ItemChange[],
  behavior: ProrationBehavior,
  t: number,
): PlanChange {
  const prorations: InvoiceLine[] = [];
  let reset: PlanChange["reset"] = null;
  for (const { item, price, quantity } of changes) {
    const old = fake.store.get("price", item.price);
    if (old.id === price.id && quantity === item.quantity) continue;
    const intervalChanges =
      old.recurring?.interval !== price.recurring?.interval ||
      old.recurring?.interval_count !== price.recurring?.interval_count;
    if (behavior !== "none" || intervalChanges) {
      if (behavior !== "none") prorations.push(prorationLine(fake, sub, item, old, item.quantity, t, true));
      if (!intervalChanges) prorations.push(prorationLine(fake, sub, item, price, quantity, t, false));
    }
    if (intervalChanges) {
      const rec = price.recurring ?? { interval: "month" as const, interval_count: 1 };
      const end = periodEnd(t, t, rec.interval, rec.interval_count);
      reset ??= { start: t, end, lines: [] };
      reset.lines.push(itemLine(fake, sub, item.id, price, quantity, { start: t, end }));
    }
  }
  return { changes, prorations, reset };
}

/** The lines of the invoice a change would bring, as invoices.createPreview shows them. */
export function previewLines(
  fake: Fake,
  sub: Subscription,
  pc: PlanChange,
  behavior: ProrationBehavior,
): InvoiceLine[] {
  // Prorations waiting from earlier changes are swept into whichever invoice comes next.
  const waiting = sub.pending_lines ?? [];
  if (pc.reset) return [...waiting, ...pc.prorations, ...pc.reset.lines];
  if (behavior === "always_invoice" && pc.prorations.length > 0) return [...waiting, ...pc.prorations];
  // The next renewal: waiting prorations, then a full period of each item at its (new) price.
  const lines = [...waiting, ...pc.prorations];
  for (const item of sub.items) {
    const change = pc.changes.find((c) => c.item.id === item.id);
    const price = change?.price ?? fake.store.get("price", item.price);
    const rec = price.recurring ?? { interval: "month" as const, interval_count: 1 };
    const start = item.current_period_end;
    lines.push(
      itemLine(fake, sub, item.id, price, change?.quantity ?? item.quantity, {
        start,
        end: periodEnd(sub.billing_cycle_anchor, start, rec.interval, rec.interval_count),
      }),
    );
  }
  return lines;
}
