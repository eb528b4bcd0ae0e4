import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { db } from "@/db/client";
import { PageContainer } from "@/components/layout/page-container";
import { Alert } from "@/components/ui/alert";
import { chosenPlan } from "@/lib/auth/chosen-plan";
import { HttpError } from "@/lib/auth/errors";
import { requireArea } from "@/lib/auth/next-context";
import { startCheckout } from "@/lib/billing/checkout";
import { stripe } from "@/lib/billing/stripe";

export const metadata: Metadata = { title: "Payment" };
export const dynamic = "force-dynamic";

// Reached after sign-in with the plan chosen before signing up (lib/auth/chosen-plan.ts): straight on
// to that plan's checkout page. Stripe writes nothing until the card is paid (webhooks), so opening
// this twice costs nothing but a second checkout session that expires unused.
export default async function CheckoutPage({
  searchParams,
}: {
  searchParams: Promise<{ plan?: string; course?: string }>;
}) {
  const user = await requireArea("billing:subscribe");
  const chosen = chosenPlan(await searchParams);
  let url: string | null = null;
  let problem = "That plan is not on offer.";
  if (chosen) {
    try {
      url = (await startCheckout(db(), stripe(), user, { planId: chosen.plan, courseId: chosen.course })).url;
    } catch (e) {
      if (!(e instanceof HttpError)) throw e;
      problem = e.message;
    }
  }
  if (url) redirect(url);
  return (
    <PageContainer className="flex max-w-prose flex-col gap-4">
      <h1 className="text-h2 font-semibold">Payment</h1>
      <Alert tone="warning" title="The payment page could not be opened">
        <p>{problem}</p>
        <p className="mt-2">
          <Link href="/plans">See the plans</Link> or <Link href="/learn/billing">open your billing page</Link>.
        </p>
      </Alert>
    </PageContainer>
  );
}
