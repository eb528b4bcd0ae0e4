"use client";
import { useState } from "react";
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ApiError, errorWords, fetchJson } from "@/lib/catalogue/fetch-json";

/** Starts a Stripe Checkout session and goes to its hosted page. */
export function ChoosePlanButton({
  planId,
  planName,
  courseId,
}: {
  planId: string;
  planName: string;
  courseId?: string;
}) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<{ text: string; member: boolean } | null>(null);
  async function choose() {
    setBusy(true);
    setError(null);
    try {
      const { url } = await fetchJson<{ url: string }>("/api/billing/checkout", {
        method: "POST",
        body: { planId, ...(courseId ? { courseId } : {}) },
      });
      window.location.assign(url);
    } catch (e) {
      setError({ text: errorWords(e), member: e instanceof ApiError && e.status === 409 });
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-col gap-2">
      <Button onClick={choose} disabled={busy}>
        {busy ? "Opening the payment page…" : `Choose ${planName}`}
      </Button>
      {error ? (
        <Alert tone="error" live>
          {error.text} {error.member ? <Link href="/learn/billing">Open the billing page</Link> : null}
        </Alert>
      ) : null}
    </div>
  );
}
