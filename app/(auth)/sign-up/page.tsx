import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { getCurrentUser } from "@/lib/auth/current-user";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/password-policy";
import { HOME } from "@/lib/auth/permissions";
import { AuthCard } from "../_components/auth-card";
import { SignUpForm } from "./sign-up-form";

export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage() {
  const user = await getCurrentUser();
  if (user) redirect(HOME[user.role]);
  return (
    <AuthCard
      title="Create an account"
      intro="Start with a free taster tune. We'll send a link to confirm your address before you first sign in."
      footer={
        <p>
          Already have an account? <Link href="/sign-in">Sign in</Link>
        </p>
      }
    >
      <SignUpForm minLength={MIN_PASSWORD_LENGTH} />
    </AuthCard>
  );
}
