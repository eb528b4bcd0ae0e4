// The membership gate (issue 7 item 4): the one server-side decision on whether a person's membership
// opens the catalogue beyond the taster rungs. The catalogue, the tune pages, assignments and the API
// all ask here (through lib/catalogue/access.ts and lib/teaching/); nothing else reads subscriptions
// to decide access.
import type { Tx as Db } from "@/db/queries/auth";
import { membershipsOf, type MembershipRow } from "@/db/queries/membership";

export type Role = "student" | "teacher" | "admin";

export type MemberStanding =
  { good: true; reason: "staff" | "active" | "grace"; until: Date | null } | { good: false; why: string };

/** Pure: the standing one subscription gives at `now`. */
export function standingOf(row: MembershipRow, now: Date): MemberStanding {
  const periodOpen = row.currentPeriodEnd === null || row.currentPeriodEnd > now;
  switch (row.status) {
    case "active":
    case "trialing":
      // Cancelled at period end keeps access until that end (Stripe keeps the status "active" until then).
      return periodOpen
        ? { good: true, reason: "active", until: row.currentPeriodEnd }
        : { good: false, why: "Your membership has ended." };
    case "past_due":
      if (row.graceUntil && row.graceUntil > now) return { good: true, reason: "grace", until: row.graceUntil };
      return {
        good: false,
        why: "Your last membership payment failed: update your card on the billing page to open the catalogue again.",
      };
    case "unpaid":
      return {
        good: false,
        why: "Your membership is unpaid: pay the open invoice on the billing page to open the catalogue again.",
      };
    case "canceled":
    case "incomplete_expired":
      return { good: false, why: "Your membership has ended: choose a plan to open the catalogue again." };
    case "incomplete":
      return { good: false, why: "Your first membership payment has not gone through yet." };
    case "paused":
      return { good: false, why: "Your membership is paused." };
  }
}

/** Whether this person's membership opens the member-only catalogue now; teachers and admins always. */
export async function memberStanding(
  db: Db,
  person: { id: string; role: Role } | null,
  now: Date = new Date(),
): Promise<MemberStanding> {
  if (!person) return { good: false, why: "Join the school and choose a membership plan to open this." };
  if (person.role !== "student") return { good: true, reason: "staff", until: null };
  const rows = await membershipsOf(db, person.id);
  if (rows.length === 0) return { good: false, why: "Choose a membership plan to open the whole catalogue." };
  const standings = rows.map((r) => standingOf(r, now));
  // The best of a person's subscriptions counts (a new one may start while an old one is past due).
  return standings.find((s) => s.good) ?? standings[0];
}
