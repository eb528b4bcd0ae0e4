import type { Metadata } from "next";
import { Alert } from "@/components/ui/alert";
import { db } from "@/db/client";
import { peekEmailToken } from "@/db/queries/auth";
import { chosenPlan } from "@/lib/auth/chosen-plan";
import { hashToken } from "@/lib/auth/tokens";
import { VERIFY_LINK_DEAD } from "@/lib/auth/verify-email";
import { AuthCard } from "../_components/auth-card";
import { VerifyForm } from "./verify-form";

export const metadata: Metadata = { title: "Confirm your address" };
export const dynamic = "force-dynamic";

// A button rather than confirming on page load: mail scanners that open links must not use them up.
export default async function VerifyEmailPage({
  searchParams,
}: {
  searchParams: Promise<{ token?: string; plan?: string; course?: string }>;
}) {
  const q = await searchParams;
  const { token } = q;
  const chosen = chosenPlan(q); // the plan chosen before signing up: its checkout comes after signing in
  const usable = token ? await peekEmailToken(db(), hashToken(token), "verify_email") : false;
  return (
    <AuthCard title="Confirm your address" intro={usable ? "One click and your account is ready to use." : undefined}>
      {usable && token ? (
        <VerifyForm token={token} chosen={chosen} />
      ) : (
        <Alert tone="warning">{VERIFY_LINK_DEAD}</Alert>
      )}
    </AuthCard>
  );
}
