"use client";
// The student's billing page (issue 7 item 5): plan, status in words, next charge, cancel/resume,
// change plan with Stripe's proration shown first, new card, invoices with refunds and receipts.
// Changes go to Stripe; the page asks again for a few seconds while the webhook brings them home.
import { useState } from "react";
import Link from "next/link";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { LinkButton } from "@/components/ui/link-button";
import type { BillingSummary } from "@/lib/billing/account";
import { formatMoney } from "@/lib/billing/money";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import { ChangePlan } from "./change-plan";
import { InvoiceList } from "./invoice-list";

const day = (iso: string) =>
  new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric" });

export function BillingView({ notice }: { notice: string | null }) {
  const client = useQueryClient();
  const [watchUntil, setWatchUntil] = useState(0);
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const summary = useQuery({
    queryKey: ["billing"],
    queryFn: () => fetchJson<BillingSummary>("/api/billing"),
    refetchInterval: () => (Date.now() < watchUntil ? 1000 : false),
  });
  async function act(what: string, url: string, then?: (body: { url?: string }) => void) {
    setBusy(what);
    setError(null);
    try {
      const body = await fetchJson<{ url?: string }>(url, { method: "POST", body: {} });
      if (then) then(body);
      else {
        setWatchUntil(Date.now() + 8000);
        await client.invalidateQueries({ queryKey: ["billing"] });
      }
    } catch (e) {
      setError(errorWords(e));
    } finally {
      setBusy(null);
    }
  }
  if (summary.isPending) return <p role="status">Loading your membership…</p>;
  if (summary.isError) return <Alert tone="error">{errorWords(summary.error)}</Alert>;
  const { membership: m, payments, plans } = summary.data;
  const live = m && m.status !== "canceled" && m.status !== "incomplete_expired";
  return (
    <div className="flex flex-col gap-6">
      {notice ? (
        <Alert tone="success" live>
          {notice}
        </Alert>
      ) : null}
      {error ? (
        <Alert tone="error" live>
          {error}
        </Alert>
      ) : null}
      <Card as="section" aria-labelledby="membership" className="flex flex-col gap-3">
        <h2 id="membership" className="font-serif text-h3 font-semibold">
          Membership
        </h2>
        {!m ? (
          <>
            <p className="text-bark">
              You have no membership yet. Taster tunes are open; a membership opens every course.
            </p>
            <div>
              <LinkButton href="/plans">See the membership plans</LinkButton>
            </div>
          </>
        ) : (
          <dl className="grid grid-cols-1 gap-x-6 gap-y-2 sm:grid-cols-[auto_1fr]">
            <dt className="font-semibold">Plan</dt>
            <dd>{`${m.planName} · ${formatMoney(m.amount, m.currency)} ${m.interval === "month" ? "per month" : "per year"}`}</dd>
            <dt className="font-semibold">Status</dt>
            <dd data-testid="membership-status">{m.statusWords}</dd>
            <dt className="font-semibold">Next charge</dt>
            <dd>
              {m.nextCharge
                ? `${formatMoney(m.nextCharge.amount, m.nextCharge.currency)} on ${day(m.nextCharge.date)}`
                : "None"}
            </dd>
          </dl>
        )}
        {live ? (
          <div className="flex flex-wrap gap-3">
            {m.cancelAtPeriodEnd ? (
              <Button onClick={() => act("resume", "/api/billing/resume")} disabled={busy !== null}>
                {busy === "resume" ? "Resuming…" : "Resume my membership"}
              </Button>
            ) : (
              <Button variant="secondary" onClick={() => act("cancel", "/api/billing/cancel")} disabled={busy !== null}>
                {busy === "cancel" ? "Cancelling…" : "Cancel at the end of this period"}
              </Button>
            )}
            <Button
              variant="secondary"
              onClick={() => act("card", "/api/billing/update-card", (b) => b.url && window.location.assign(b.url))}
              disabled={busy !== null}
            >
              {busy === "card" ? "Opening…" : m.status === "past_due" ? "Update card and pay" : "Update card"}
            </Button>
          </div>
        ) : m ? (
          <div>
            <LinkButton href="/plans">Choose a plan to rejoin</LinkButton>
          </div>
        ) : null}
      </Card>
      {live ? <ChangePlan current={m.planId} plans={plans} onChanged={() => setWatchUntil(Date.now() + 8000)} /> : null}
      <InvoiceList payments={payments} />
      <p className="text-small text-bark">
        Payments are taken by Stripe; Rosinwood never sees your card number. Questions about a charge?{" "}
        <Link href="/learn">Ask your teacher</Link> or the school office.
      </p>
    </div>
  );
}
