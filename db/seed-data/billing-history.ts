// Twelve months of invented billing history for the demo students (issue 7 item 7), as a plain
// model that db/seed-data/billing.ts writes to the database and, in Stripe's shapes, to the local
// stand-in with the same ids. Deterministic: a seeded PRNG, and times counted back from `anchor`
// (the moment the demo was first seeded, kept as the plans' created_at so a re-seed rebuilds the same).
import { STUDENTS } from "./people";

export const DAY = 86_400;
export const GRACE_DAYS = 7; // as lib/billing/grace.ts (common practice)
export const RETRY_DAYS = [3, 5]; // the stand-in's retry schedule after a failed renewal (its README)
export const DECLINE = "Your card was declined."; // Stripe docs: testing, card_declined

export type PlanKey = "monthly" | "yearly";
export const DEMO_PLANS = {
  monthly: {
    id: "5e1d0000-7a11-4c0e-8000-00000000a001",
    name: "Monthly membership",
    amount: 1800,
    currency: "GBP",
    interval: "month",
    productId: "prod_LarchmoorMonthly",
    priceId: "price_LarchmoorMonthly1800",
  },
  yearly: {
    id: "5e1d0000-7a11-4c0e-8000-00000000a012",
    name: "Yearly membership",
    amount: 18000,
    currency: "GBP",
    interval: "year",
    productId: "prod_LarchmoorYearly",
    priceId: "price_LarchmoorYearly18000",
  },
} as const;

/** What happens to one student's membership (index into STUDENTS). */
type Story = {
  plan: PlanKey;
  monthsAgo: number;
  /** Renewal numbers (1 = first renewal) whose first charge failed and a retry paid. */
  recovered?: number[];
  /** This renewal failed for good: the subscription was cancelled after the last retry. */
  lapsedAt?: number;
  /** The newest renewal failed two days ago: past due, in grace. */
  inGrace?: boolean;
  /** Cancellation asked for: "end" = at the period end still to come; a number = ended after that many periods. */
  cancel?: "end" | number;
  /** Refunds: which payment (0 = first, -1 = last) and how much (null = all of it). */
  refunds?: { payment: number; amount: number | null; reason: string }[];
};

// Every student with an active enrolment in the demo catalogue (db/seed-data/catalogue.ts: 0–9, 11,
// 13, 15–17, 20, 23, 24, 27, 28, 30, 31) stays in good standing; 10, 12 and 14 (enrolment ended or paused) are the lapsed examples.
export const STORIES: Record<number, Story> = {
  0: { plan: "monthly", monthsAgo: 11 },
  1: { plan: "monthly", monthsAgo: 10, recovered: [4] },
  2: { plan: "yearly", monthsAgo: 11 },
  3: {
    plan: "monthly",
    monthsAgo: 9,
    refunds: [{ payment: 2, amount: 900, reason: "Half of March back: away on tour for two weeks" }],
  },
  4: { plan: "yearly", monthsAgo: 5 },
  5: { plan: "monthly", monthsAgo: 7, cancel: "end" },
  6: { plan: "monthly", monthsAgo: 11, recovered: [2, 7] },
  7: { plan: "monthly", monthsAgo: 6 },
  8: { plan: "yearly", monthsAgo: 2 },
  9: { plan: "monthly", monthsAgo: 8 },
  10: {
    plan: "monthly",
    monthsAgo: 11,
    cancel: 6,
    refunds: [{ payment: -1, amount: null, reason: "Charged after asking to stop: refunded in full" }],
  },
  11: { plan: "monthly", monthsAgo: 4 },
  12: { plan: "monthly", monthsAgo: 9, lapsedAt: 7 },
  13: {
    plan: "monthly",
    monthsAgo: 3,
    refunds: [{ payment: 0, amount: null, reason: "Paid twice by mistake on sign-up" }],
  },
  14: { plan: "monthly", monthsAgo: 8, cancel: 5 },
  15: { plan: "monthly", monthsAgo: 1 },
  16: { plan: "monthly", monthsAgo: 6 },
  17: { plan: "monthly", monthsAgo: 5, inGrace: true },
  19: { plan: "monthly", monthsAgo: 10, lapsedAt: 6 },
  20: {
    plan: "yearly",
    monthsAgo: 8,
    refunds: [{ payment: 0, amount: 6000, reason: "Goodwill: four months lost to a wrist injury" }],
  },
  21: { plan: "monthly", monthsAgo: 5, cancel: 3 },
  23: { plan: "monthly", monthsAgo: 2 },
  24: { plan: "monthly", monthsAgo: 11, recovered: [5] },
  26: {
    plan: "monthly",
    monthsAgo: 7,
    cancel: 4,
    refunds: [{ payment: -1, amount: null, reason: "Cancelled the day after renewing" }],
  },
  27: { plan: "yearly", monthsAgo: 10 },
  28: { plan: "monthly", monthsAgo: 4 },
  30: { plan: "monthly", monthsAgo: 8, cancel: "end" },
  31: { plan: "monthly", monthsAgo: 3 },
};

export type DemoAttempt = { at: number; ok: boolean; chargeId: string };
export type DemoRefund = { id: string; amount: number; created: number; reason: string };
export type DemoInvoice = {
  id: string;
  number: string;
  paymentIntentId: string;
  kind: "new" | "renewal";
  created: number;
  periodStart: number;
  periodEnd: number;
  amount: number;
  /** paid; failed for good (uncollectible); open = failed, retry to come. */
  status: "paid" | "failed" | "open";
  attempts: DemoAttempt[];
  nextAttempt: number | null;
  refunds: DemoRefund[];
};
export type DemoMembership = {
  student: number;
  name: string;
  email: string;
  customerId: string;
  paymentMethodId: string;
  invoicePrefix: string;
  card: "4242" | "0341";
  subscriptionId: string;
  itemId: string;
  plan: PlanKey;
  start: number;
  status: "active" | "past_due" | "canceled";
  periodStart: number;
  periodEnd: number;
  cancelAtPeriodEnd: boolean;
  canceledAt: number | null;
  endedAt: number | null;
  graceUntil: number | null;
  updatedAt: number;
  invoices: DemoInvoice[];
};

/** mulberry32: a small, well-known seeded PRNG (common practice for reproducible demo data). */
export function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** As the stand-in and Stripe: the anchor's day of month, clamped to shorter months. */
export function addMonths(anchor: number, months: number): number {
  const a = new Date(anchor * 1000);
  const lastDay = new Date(Date.UTC(a.getUTCFullYear(), a.getUTCMonth() + months + 1, 0)).getUTCDate();
  return (
    Date.UTC(
      a.getUTCFullYear(),
      a.getUTCMonth() + months,
      Math.min(a.getUTCDate(), lastDay),
      a.getUTCHours(),
      a.getUTCMinutes(),
      a.getUTCSeconds(),
    ) / 1000
  );
}

const pad = (n: number, w: number) => String(n).padStart(w, "0");

/** The whole demo history as of `anchor` (unix seconds). */
export function demoBillingHistory(anchor: number): DemoMembership[] {
  const rand = prng(0x1a2c4);
  const out: DemoMembership[] = [];
  for (const [key, story] of Object.entries(STORIES)) {
    const i = Number(key);
    const tag = `LmDemo${pad(i, 2)}`;
    const plan = DEMO_PLANS[story.plan];
    // Sign-ups spread over the year: whole months back, then a few days and hours either way.
    // The member in grace renewed (and failed) two days before the anchor.
    const spread = Math.floor(rand() * 20 - 2) * DAY + Math.floor(rand() * 12) * 3600;
    const start = story.inGrace
      ? addMonths(anchor - 2 * DAY, -story.monthsAgo)
      : Math.min(addMonths(anchor, -story.monthsAgo) + spread, anchor - 2 * DAY);
    const step = story.plan === "monthly" ? 1 : 12;
    const m: DemoMembership = {
      student: i,
      name: STUDENTS[i].name,
      email: STUDENTS[i].email,
      customerId: `cus_${tag}`,
      paymentMethodId: `pm_${tag}`,
      invoicePrefix: `LMF${pad(i, 3)}`,
      card: story.lapsedAt !== undefined || story.inGrace ? "0341" : "4242",
      subscriptionId: `sub_${tag}`,
      itemId: `si_${tag}`,
      plan: story.plan,
      start,
      status: "active",
      periodStart: start,
      periodEnd: addMonths(start, step),
      cancelAtPeriodEnd: false,
      canceledAt: null,
      endedAt: null,
      graceUntil: null,
      updatedAt: start,
      invoices: [],
    };
    const periods = typeof story.cancel === "number" ? story.cancel : Infinity;
    for (let k = 0; k < periods; k++) {
      const ps = addMonths(start, k * step);
      const pe = addMonths(start, (k + 1) * step);
      if (ps > anchor) break;
      const n = k + 1;
      const inv: DemoInvoice = {
        id: `in_${tag}n${pad(n, 2)}`,
        number: `${m.invoicePrefix}-${pad(n, 4)}`,
        paymentIntentId: `pi_${tag}n${pad(n, 2)}`,
        kind: k === 0 ? "new" : "renewal",
        created: ps,
        periodStart: ps,
        periodEnd: pe,
        amount: plan.amount,
        status: "paid",
        attempts: [],
        nextAttempt: null,
        refunds: [],
      };
      const charge = (at: number, ok: boolean) =>
        inv.attempts.push({ at, ok, chargeId: `ch_${tag}n${pad(n, 2)}a${inv.attempts.length + 1}` });
      if (story.inGrace && addMonths(start, (k + 1) * step) > anchor) {
        charge(ps, false);
        inv.status = "open";
        inv.nextAttempt = ps + RETRY_DAYS[0] * DAY;
        Object.assign(m, { status: "past_due", graceUntil: ps + GRACE_DAYS * DAY, updatedAt: ps });
      } else if (story.lapsedAt === k) {
        const last = ps + (RETRY_DAYS[0] + RETRY_DAYS[1]) * DAY;
        for (const at of [ps, ps + RETRY_DAYS[0] * DAY, last]) charge(at, false);
        inv.status = "failed";
        Object.assign(m, { status: "canceled", canceledAt: last, endedAt: last });
      } else if (story.recovered?.includes(k) && ps + RETRY_DAYS[0] * DAY < anchor) {
        charge(ps, false);
        charge(ps + RETRY_DAYS[0] * DAY, true);
      } else {
        charge(ps, true);
      }
      m.invoices.push(inv);
      m.periodStart = ps;
      m.periodEnd = pe;
      m.updatedAt = Math.max(m.updatedAt, inv.attempts.at(-1)?.at ?? ps);
      if (m.status !== "active") break;
    }
    if (typeof story.cancel === "number") {
      const asked = m.periodEnd - Math.floor(3 + rand() * 10) * DAY;
      Object.assign(m, { status: "canceled", canceledAt: asked, endedAt: m.periodEnd, updatedAt: m.periodEnd });
    } else if (story.cancel === "end") {
      Object.assign(m, {
        cancelAtPeriodEnd: true,
        canceledAt: Math.min(anchor - DAY, m.periodStart + 5 * DAY),
        updatedAt: Math.min(anchor - DAY, m.periodStart + 5 * DAY),
      });
    }
    for (const [r, ref] of (story.refunds ?? []).entries()) {
      const inv = ref.payment < 0 ? m.invoices.at(ref.payment) : m.invoices[ref.payment];
      if (!inv || inv.status !== "paid") continue;
      const paidAt = inv.attempts.at(-1)?.at ?? inv.created;
      const created = Math.min(anchor - 3600, paidAt + Math.floor(1 + rand() * 6) * DAY);
      inv.refunds.push({ id: `re_${tag}r${r + 1}`, amount: ref.amount ?? inv.amount, created, reason: ref.reason });
    }
    out.push(m);
  }
  return out;
}
