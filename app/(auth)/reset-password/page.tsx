import type { Metadata } from "next";
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import { db } from "@/db/client";
import { peekEmailToken } from "@/db/queries/auth";
import { RESET_LINK_DEAD } from "@/lib/auth/password-reset";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/password-policy";
import { hashToken } from "@/lib/auth/tokens";
import { AuthCard } from "../_components/auth-card";
import { ResetForm } from "./reset-form";

export const metadata: Metadata = { title: "Choose a new password" };
export const dynamic = "force-dynamic";

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  // Looking is free; the link is only used up when the new password is saved.
  const usable = token ? await peekEmailToken(db(), hashToken(token), "reset_password") : false;
  return (
    <AuthCard title="Choose a new password" footer={<Link href="/forgot-password">Ask for a new link</Link>}>
      {usable && token ? (
        <ResetForm token={token} minLength={MIN_PASSWORD_LENGTH} />
      ) : (
        <Alert tone="warning">{RESET_LINK_DEAD}</Alert>
      )}
    </AuthCard>
  );
}
