"use client";
import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { Select } from "@/components/ui/input";
import type { BillingSummary } from "@/lib/billing/account";
import { formatMoney } from "@/lib/billing/money";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";

type Preview = {
  planId: string;
  planName: string;
  prorationDate: number;
  amountDue: number;
  total: number;
  currency: string;
  lines: { description: string; amount: number }[];
};

/** Choose a plan, see what Stripe would charge or credit now, then confirm. */
export function ChangePlan({
  current,
  plans,
  onChanged,
}: {
  current: string;
  plans: BillingSummary["plans"];
  onChanged: () => void;
}) {
  const client = useQueryClient();
  const others = plans.filter((p) => p.id !== current);
  const [planId, setPlanId] = useState(others[0]?.id ?? "");
  const [preview, setPreview] = useState<Preview | null>(null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  if (others.length === 0) return null;
  async function run<T>(f: () => Promise<T>): Promise<T | null> {
    setBusy(true);
    setMessage(null);
    try {
      return await f();
    } catch (e) {
      setMessage({ tone: "error", text: errorWords(e) });
      return null;
    } finally {
      setBusy(false);
    }
  }
  return (
    <Card as="section" aria-labelledby="change-plan" className="flex flex-col gap-3">
      <h2 id="change-plan" className="font-serif text-h3 font-semibold">
        Change plan
      </h2>
      <div className="flex flex-col gap-2 sm:flex-row sm:items-end">
        <div className="flex flex-col gap-1.5">
          <label htmlFor="new-plan" className="font-semibold">
            New plan
          </label>
          <Select
            id="new-plan"
            value={planId}
            onChange={(e) => {
              setPlanId(e.target.value);
              setPreview(null);
            }}
          >
            {others.map((p) => (
              <option
                key={p.id}
                value={p.id}
              >{`${p.name} (${formatMoney(p.amount, p.currency)} ${p.interval === "month" ? "per month" : "per year"})`}</option>
            ))}
          </Select>
        </div>
        <Button
          variant="secondary"
          disabled={busy || !planId}
          onClick={async () =>
            setPreview(
              await run(() =>
                fetchJson<Preview>("/api/billing/change-plan/preview", { method: "POST", body: { planId } }),
              ),
            )
          }
        >
          Show the cost
        </Button>
      </div>
      {preview ? (
        <div className="flex flex-col gap-2" aria-live="polite">
          <p className="font-semibold">Switching to {preview.planName} now, as Stripe works it out:</p>
          <ul className="list-disc pl-5">
            {preview.lines.map((l, i) => (
              <li key={i}>{`${l.description}: ${formatMoney(l.amount, preview.currency)}`}</li>
            ))}
          </ul>
          <p>
            {preview.amountDue > 0
              ? `You will be charged ${formatMoney(preview.amountDue, preview.currency)} today.`
              : `Nothing to pay today${preview.total < 0 ? `; ${formatMoney(-preview.total, preview.currency)} is kept as credit for your next payments` : ""}.`}
          </p>
          <div>
            <Button
              disabled={busy}
              onClick={async () => {
                const done = await run(() =>
                  fetchJson("/api/billing/change-plan", {
                    method: "POST",
                    body: { planId: preview.planId, prorationDate: preview.prorationDate },
                  }),
                );
                if (done !== null) {
                  setPreview(null);
                  setMessage({ tone: "success", text: `Your plan is now ${preview.planName}.` });
                  onChanged();
                  await client.invalidateQueries({ queryKey: ["billing"] });
                }
              }}
            >
              Confirm change
            </Button>
          </div>
        </div>
      ) : null}
      {message ? (
        <Alert tone={message.tone} live>
          {message.text}
        </Alert>
      ) : null}
    </Card>
  );
}
