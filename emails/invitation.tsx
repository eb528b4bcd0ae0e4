/** @jsxRuntime automatic @jsxImportSource react */
// The pragma: tsx reads the root tsconfig, which keeps JSX as is for Next ("preserve"); this names the runtime.
import { Heading, Text } from "@react-email/components";
import type { MailTemplates } from "@/lib/mail/types";
import { subjects } from "./subjects";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "./layout";

type Data = MailTemplates["invitation"];

const asRole: Record<Data["role"], string> = {
  student: "to learn fiddle tunes with them",
  teacher: "to teach with the school",
  admin: "to help run the school",
};

export const subject = subjects.invitation;

export default function InvitationEmail({
  inviterName,
  role,
  acceptUrl,
  expiresInDays,
  appUrl,
  schoolName,
}: Data & MailFrame) {
  return (
    <MailLayout preview={`${inviterName} invited you ${asRole[role]}.`} appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        You are invited
      </Heading>
      <Text style={paragraph}>
        {inviterName} invited you to Rosinwood {asRole[role]}. Accepting takes a minute: if you already have an account,
        sign in; if not, you will choose a password.
      </Text>
      <MailAction href={absoluteUrl(acceptUrl, appUrl)} label="Accept the invitation" />
      <Text style={paragraph}>
        The invitation is for this address only and stays open for {expiresInDays}{" "}
        {expiresInDays === 1 ? "day" : "days"}. If you were not expecting it, you can let it go.
      </Text>
    </MailLayout>
  );
}
