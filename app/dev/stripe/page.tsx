import { notFound } from "next/navigation";
import { PageContainer } from "@/components/layout/page-container";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TBody, THead, TableShell, Td, Th } from "@/components/ui/table";
import { requireArea } from "@/lib/auth/next-context";
import { standInClock, standInEvents, type StandInEvent } from "@/lib/billing/stand-in-clock";
import { env } from "@/lib/env";

export const dynamic = "force-dynamic";
export function generateMetadata() {
  return { title: env().STRIPE_FAKE_URL ? "Payment stand-in clock" : "Page not found", robots: { index: false } };
}

const STEPS = [
  { days: 1, label: "Move 1 day on" },
  { days: 7, label: "Move 7 days on" },
  { days: 31, label: "Move 31 days on" },
];

// Present only while the local Stripe stand-in is configured: lets the demo's admin see renewals, failed renewals,
// grace periods and period ends happen without waiting for them.
export default async function StripeClockPage({ searchParams }: { searchParams: Promise<{ moved?: string }> }) {
  const fakeUrl = env().STRIPE_FAKE_URL;
  if (!fakeUrl) notFound();
  await requireArea("area:admin");
  const { moved } = await searchParams;
  let clock: Awaited<ReturnType<typeof standInClock>> | null = null;
  let events: StandInEvent[] = [];
  try {
    [clock, events] = await Promise.all([standInClock(fakeUrl), standInEvents(fakeUrl, 25)]);
  } catch {
    clock = null;
  }
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-col gap-2">
        <h1 className="text-h2 font-semibold">Payment stand-in clock</h1>
        <p className="max-w-prose text-bark">
          This copy of Rosinwood takes payments through a local stand-in for Stripe. Its clock can be moved forward so
          that renewals, failed renewals and the ends of grace periods happen now; the app hears of them through the
          same signed webhooks a real Stripe sends.
        </p>
      </header>
      {clock === null ? (
        <Alert tone="error" title="The stand-in does not answer">
          Rosinwood expected the local payment stand-in at {fakeUrl}. Is it still running?
        </Alert>
      ) : (
        <>
          {moved ? (
            <Alert>
              Moved the clock {moved} day{moved === "1" ? "" : "s"} on.
            </Alert>
          ) : null}
          <p>
            The stand-in&rsquo;s time: <strong>{new Date(clock.iso).toUTCString()}</strong>
            {clock.offset_seconds > 0
              ? ` (${Math.round(clock.offset_seconds / 86_400)} days ahead of this machine)`
              : ""}
          </p>
          <div className="flex flex-wrap gap-3">
            {STEPS.map((s) => (
              <form key={s.days} method="post" action="/api/dev/stripe-clock">
                <input type="hidden" name="days" value={s.days} />
                <Button type="submit">{s.label}</Button>
              </form>
            ))}
          </div>
          <TableShell caption="The latest events the stand-in sent to the app">
            <THead>
              <tr>
                <Th>Time</Th>
                <Th>Event</Th>
                <Th>Delivery</Th>
              </tr>
            </THead>
            <TBody>
              {events.map((e) => (
                <tr key={e.id}>
                  <Td>{new Date(e.created * 1000).toUTCString()}</Td>
                  <Td>{e.type}</Td>
                  <Td>{String(e.delivery?.status ?? "")}</Td>
                </tr>
              ))}
            </TBody>
          </TableShell>
        </>
      )}
    </PageContainer>
  );
}
