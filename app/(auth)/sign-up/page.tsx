import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { db } from "@/db/client";
import { findPlan } from "@/db/queries/billing";
import { findCourse } from "@/db/queries/catalogue";
import { Alert } from "@/components/ui/alert";
import { chosenPlan } from "@/lib/auth/chosen-plan";
import { getCurrentUser } from "@/lib/auth/current-user";
import { formatMoney } from "@/lib/billing/money";
import { env } from "@/lib/env";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/password-policy";
import { HOME } from "@/lib/auth/permissions";
import { AuthCard } from "../_components/auth-card";
import { SignUpForm } from "./sign-up-form";

export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage({
  searchParams,
}: {
  searchParams: Promise<{ plan?: string; course?: string }>;
}) {
  const [user, q] = await Promise.all([getCurrentUser(), searchParams]);
  if (user) redirect(HOME[user.role]);
  // The plan chosen on the plans page (and the course it came from) is carried to its checkout.
  const chosen = chosenPlan(q);
  const [plan, course] = await Promise.all([
    chosen ? findPlan(db(), chosen.plan) : null,
    chosen?.course ? findCourse(db(), chosen.course) : null,
  ]);
  const offered = plan && !plan.retiredAt ? plan : null;
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
      {offered ? (
        <Alert tone="info" title={`You chose ${offered.name}`}>
          {`${formatMoney(offered.amount, offered.currency)} ${offered.interval === "month" ? "per month" : "per year"}${course?.published ? `, starting with “${course.title}”` : ""}. Once you have confirmed your address and signed in, you go straight to its payment page.`}
        </Alert>
      ) : null}
      <SignUpForm
        minLength={MIN_PASSWORD_LENGTH}
        mailbox={Boolean(env().RESEND_FAKE_URL)}
        chosen={offered && chosen ? { plan: offered.id, course: course?.published ? course.slug : undefined } : null}
      />
    </AuthCard>
  );
}
