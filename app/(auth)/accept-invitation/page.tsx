import type { Metadata } from "next";
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import { LinkButton } from "@/components/ui/link-button";
import { describeInvitation, INVITATION_DEAD, INVITATION_OTHER_ADDRESS } from "@/lib/auth/accept-invitation";
import { getCurrentUser } from "@/lib/auth/current-user";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/password-policy";
import { AuthCard } from "../_components/auth-card";
import { AcceptForm } from "./accept-form";

export const metadata: Metadata = { title: "Your invitation" };
export const dynamic = "force-dynamic";

const JOIN_AS = { student: "as a student", teacher: "as a teacher", admin: "as an admin" } as const;

export default async function AcceptInvitationPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  const invitation = token ? await describeInvitation(token) : null;
  if (!token || !invitation) {
    return (
      <AuthCard title="Your invitation">
        <Alert tone="warning">{INVITATION_DEAD}</Alert>
      </AuthCard>
    );
  }
  const user = await getCurrentUser();
  const here = `/accept-invitation?token=${encodeURIComponent(token)}`;
  const intro = (
    <p>
      {invitation.inviterName} has invited <strong>{invitation.email}</strong> to Rosinwood {JOIN_AS[invitation.role]}.
      {invitation.role === "student" ? " You'll join their roster." : null}
    </p>
  );
  let body;
  if (user && user.email.toLowerCase() !== invitation.email.toLowerCase()) {
    body = <Alert tone="warning">{INVITATION_OTHER_ADDRESS}</Alert>;
  } else if (user) {
    body = <AcceptForm token={token} newAccount={false} minLength={MIN_PASSWORD_LENGTH} />;
  } else if (invitation.needsSignIn) {
    body = (
      <>
        <p>This address already has an account. Sign in, and you'll come back here to accept.</p>
        <LinkButton href={`/sign-in?next=${encodeURIComponent(here)}`}>Sign in to accept</LinkButton>
      </>
    );
  } else {
    body = <AcceptForm token={token} newAccount minLength={MIN_PASSWORD_LENGTH} />;
  }
  return (
    <AuthCard title="Your invitation" intro={intro} footer={<Link href="/">What is Rosinwood?</Link>}>
      {body}
    </AuthCard>
  );
}
