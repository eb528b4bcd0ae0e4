"use client";
// After Stripe's hosted page: waits until the webhook has written the membership, then goes to the
// course ladder. It only reads (GET /api/billing); the membership is written by the webhook alone.
import { useEffect, useState } from "react";
import { useRouter } from "next/navigation";
import { useQuery } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import type { BillingSummary } from "@/lib/billing/account";
import type { LadderJson } from "@/lib/catalogue/api-types";
import { fetchJson } from "@/lib/catalogue/fetch-json";

const PATIENCE_MS = 60_000;

export function WelcomeWait({ course }: { course: string | null }) {
  const router = useRouter();
  const [started] = useState(() => Date.now());
  const summary = useQuery({
    queryKey: ["billing"],
    queryFn: () => fetchJson<BillingSummary>("/api/billing"),
    refetchInterval: (q) => (q.state.data?.membership?.good || Date.now() - started > PATIENCE_MS ? false : 1000),
  });
  const member = summary.data?.membership?.good === true;
  // The chosen course's enrolment comes with checkout.session.completed, which may follow the
  // membership's own events: wait until the ladder itself is open, so the student lands on it walkable.
  const ladder = useQuery({
    queryKey: ["welcome-ladder", course],
    enabled: member && course !== null,
    queryFn: () => fetchJson<LadderJson>(`/api/courses/${encodeURIComponent(course ?? "")}/ladder`),
    refetchInterval: (q) =>
      (q.state.data && q.state.data.standing.pathway !== "taster") || Date.now() - started > PATIENCE_MS ? false : 1000,
  });
  const good = member && (course === null || (ladder.data !== undefined && ladder.data.standing.pathway !== "taster"));
  useEffect(() => {
    if (good) router.replace(course ? `/learn/courses/${encodeURIComponent(course)}` : "/learn/courses?welcome=1");
  }, [good, course, router]);
  if (good) return <p role="status">Your membership is active. Taking you to your course…</p>;
  if (Date.now() - started > PATIENCE_MS && !summary.isFetching) {
    return (
      <Alert tone="warning" title="Still waiting for the payment confirmation">
        Stripe has not confirmed the payment yet. This page will not charge you again; check the billing page in a few
        minutes.
      </Alert>
    );
  }
  return <p role="status">Thank you. Confirming your payment with Stripe…</p>;
}
