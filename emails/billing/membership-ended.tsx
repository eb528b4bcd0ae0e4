/** @jsxRuntime automatic @jsxImportSource react */
import { Heading, Text } from "@react-email/components";
import type { BillingMail } from "@/lib/mail/types-billing";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "../layout";

type Data = BillingMail["membership-ended"];

export default function MembershipEndedEmail({
  name,
  planName,
  endedOn,
  plansUrl,
  appUrl,
  schoolName,
}: Data & MailFrame) {
  const line = `Your ${planName} ended on ${endedOn}.`;
  return (
    <MailLayout preview={line} appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {name},
      </Heading>
      <Text style={paragraph}>
        {line} Your notes and progress are kept: the taster tunes stay open, and the whole catalogue opens again
        whenever you rejoin.
      </Text>
      <MailAction href={absoluteUrl(plansUrl, appUrl)} label="See the membership plans" />
    </MailLayout>
  );
}
