import type { Metadata } from "next";
import Link from "next/link";
import { PageContainer } from "@/components/layout/page-container";
import { Card } from "@/components/ui/card";
import { MAX_INVITES_AT_ONCE } from "@/lib/auth/invitations";
import { requireArea } from "@/lib/auth/next-context";
import { INVITATION_TTL_DAYS } from "@/lib/auth/tokens";
import { InviteStudentsForm } from "./invite-form";

export const metadata: Metadata = { title: "Invite students" };

export default async function InvitePage() {
  await requireArea("area:teach");
  return (
    <PageContainer className="flex max-w-3xl flex-col gap-6">
      <p>
        <Link href="/teach">← Back to your roster</Link>
      </p>
      <h1 className="text-h2 font-semibold">Invite students</h1>
      <p className="max-w-prose text-bark">
        Each address gets its own link, good for {INVITATION_TTL_DAYS} days. Opening it creates an account (or uses the
        one they already have) and puts them on your roster.
      </p>
      <Card>
        <InviteStudentsForm max={MAX_INVITES_AT_ONCE} />
      </Card>
    </PageContainer>
  );
}
