// The stand-in's clock: the machine's time plus an offset that POST /_fake/clock/advance grows (the
// idea of Stripe's test clocks, but one clock for the whole stand-in, and it keeps running between
// advances so a long-running `npm start` stays in step with the app). Objects take their timestamps
// from here; while due work runs, the clock reads the moment that work was due, so a renewal made by an
// advance of three months carries its own period's date, as on a Stripe test clock.
import type { Store } from "./state";

export class Clock {
  private pinned: number | null = null;

  constructor(private readonly store: Store) {}

  now(): number {
    return this.pinned ?? Math.floor(Date.now() / 1000) + this.store.clockOffset;
  }

  /** Real time, for webhook signatures: the receiver compares `t` with its own clock (300 s tolerance). */
  wallNow(): number {
    return Math.floor(Date.now() / 1000);
  }

  setStart(at: Date): void {
    this.store.clockOffset = Math.floor(at.getTime() / 1000) - Math.floor(Date.now() / 1000);
  }

  advance(seconds: number): void {
    this.store.clockOffset += seconds;
  }

  /** Runs fn with the clock reading `t`. */
  at<T>(t: number, fn: () => T): T {
    const before = this.pinned;
    this.pinned = t;
    try {
      return fn();
    } finally {
      this.pinned = before;
    }
  }
}

const DAY = 86_400;
const WEEK = 7 * DAY;

function addMonthsClamped(anchor: number, months: number): number {
  const a = new Date(anchor * 1000);
  const y = a.getUTCFullYear();
  const m = a.getUTCMonth() + months;
  const lastDay = new Date(Date.UTC(y, m + 1, 0)).getUTCDate();
  const day = Math.min(a.getUTCDate(), lastDay);
  return Date.UTC(y, m, day, a.getUTCHours(), a.getUTCMinutes(), a.getUTCSeconds()) / 1000;
}

/**
 * The end of the billing period that starts at `start`, keeping to the anchor's day of the month
 * (Stripe docs: "Set the subscription billing renewal date": an anchor on the 31st bills on the last
 * day of shorter months, then on the 31st again).
 */
export function periodEnd(
  anchor: number,
  start: number,
  interval: "day" | "week" | "month" | "year",
  count: number,
): number {
  if (interval === "day") return start + count * DAY;
  if (interval === "week") return start + count * WEEK;
  const step = interval === "year" ? 12 * count : count;
  // At least half a period: guards imported data whose period does not sit on its anchor's day.
  const minimum = start + step * 14 * DAY;
  let k = 1;
  while (addMonthsClamped(anchor, k * step) < minimum) k++;
  return addMonthsClamped(anchor, k * step);
}
