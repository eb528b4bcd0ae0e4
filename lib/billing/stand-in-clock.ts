import { z } from "zod";

// The local Stripe stand-in's own controls (scripts/fakes/stripe/fake-routes.ts), for the /dev/stripe page only:
// a real Stripe has no such endpoints, so nothing outside that page and its route calls these.
const clock = z.object({ iso: z.string(), offset_seconds: z.number() });
const event = z.object({
  id: z.string(),
  type: z.string(),
  created: z.number(),
  delivery: z.object({ status: z.string() }).partial().passthrough().optional(),
});
export type StandInEvent = z.infer<typeof event>;

export async function standInClock(fakeUrl: string): Promise<z.infer<typeof clock>> {
  const res = await fetch(new URL("/_fake/clock", fakeUrl), { cache: "no-store" });
  if (!res.ok) throw new Error(`the stand-in answered ${res.status}`);
  return clock.parse(await res.json());
}

export async function standInEvents(fakeUrl: string, limit: number): Promise<StandInEvent[]> {
  const res = await fetch(new URL("/_fake/events", fakeUrl), { cache: "no-store" });
  if (!res.ok) throw new Error(`the stand-in answered ${res.status}`);
  return z
    .object({ data: z.array(event) })
    .parse(await res.json())
    .data.slice(0, limit);
}

/** Moves the stand-in's clock forward; renewals, failed renewals and period ends that fall due happen at once. */
export async function advanceStandIn(fakeUrl: string, seconds: number): Promise<void> {
  const res = await fetch(new URL("/_fake/clock/advance", fakeUrl), {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ seconds }),
  });
  if (!res.ok) throw new Error(`the stand-in answered ${res.status}`);
}
