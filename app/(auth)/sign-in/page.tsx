import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { Alert } from "@/components/ui/alert";
import { getCurrentUser } from "@/lib/auth/current-user";
import { safeNext } from "@/lib/auth/links";
import { HOME } from "@/lib/auth/permissions";
import { AuthCard } from "../_components/auth-card";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

type Search = Promise<{ next?: string; reset?: string; confirmed?: string }>;

export default async function SignInPage({ searchParams }: { searchParams: Search }) {
  const params = await searchParams;
  const next = safeNext(params.next) ?? undefined;
  const user = await getCurrentUser();
  if (user) redirect(next ?? HOME[user.role]);
  return (
    <AuthCard
      title="Sign in"
      footer={
        <>
          <Link href="/forgot-password">Forgotten your password?</Link>
          <p>
            New to Rosinwood? <Link href="/sign-up">Create an account</Link>
          </p>
        </>
      }
    >
      {params.reset === "done" ? (
        <Alert tone="success">
          Your password has been changed and every other session signed out. Sign in with the new one.
        </Alert>
      ) : null}
      {params.confirmed ? (
        <Alert tone="success">Thank you: your address is confirmed. Sign in to carry on.</Alert>
      ) : null}
      <SignInForm next={next} />
    </AuthCard>
  );
}
