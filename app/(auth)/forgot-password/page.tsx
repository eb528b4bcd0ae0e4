import type { Metadata } from "next";
import Link from "next/link";
import { AuthCard } from "../_components/auth-card";
import { ForgotForm } from "./forgot-form";

export const metadata: Metadata = { title: "Forgotten password" };

export default function ForgotPasswordPage() {
  return (
    <AuthCard
      title="Forgotten your password?"
      intro="Give us the address you signed up with and we'll e-mail you a link to choose a new password."
      footer={<Link href="/sign-in">Back to sign in</Link>}
    >
      <ForgotForm />
    </AuthCard>
  );
}
