// The plan (and course) a visitor chose before signing up, carried through sign-up, the confirmation
// link and sign-in to its checkout. It travels in the addresses themselves, so it survives the
// confirmation being opened in another browser; the checkout checks both again.
import { z } from "zod";

export type ChosenPlan = { plan: string; course?: string };

// A plan id is a uuid; a course is named by its slug (lib/courses/bench.ts makes them).
export const chosenPlanFields = {
  plan: z.uuid().optional().catch(undefined),
  course: z
    .string()
    .regex(/^[a-z0-9-]{1,120}$/)
    .optional()
    .catch(undefined),
};
const chosen = z.object(chosenPlanFields);

/** The choice from loose values (a page's search params, a form); null when there is no valid plan. */
export function chosenPlan(v: { plan?: unknown; course?: unknown }): ChosenPlan | null {
  const c = chosen.parse({ plan: v.plan ?? undefined, course: v.course ?? undefined });
  return c.plan ? { plan: c.plan, ...(c.course ? { course: c.course } : {}) } : null;
}

/** The choice as query parameters (for the sign-up page's and the confirmation link's address). */
export function chosenQuery(c: ChosenPlan | null): Record<string, string> {
  return c ? { plan: c.plan, ...(c.course ? { course: c.course } : {}) } : {};
}

/** Where the member goes once signed in: straight to this plan's checkout. */
export function checkoutPath(c: ChosenPlan): string {
  return `/learn/billing/checkout?${new URLSearchParams(chosenQuery(c)).toString()}`;
}
