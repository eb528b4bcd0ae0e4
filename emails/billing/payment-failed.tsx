/** @jsxRuntime automatic @jsxImportSource react */
import { Heading, Text } from "@react-email/components";
import type { BillingMail } from "@/lib/mail/types-billing";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "../layout";

type Data = BillingMail["payment-failed"];

export default function PaymentFailedEmail({
  name,
  planName,
  amount,
  failureMessage,
  graceUntil,
  billingUrl,
  appUrl,
  schoolName,
}: Data & MailFrame) {
  const line = `We could not take ${amount} for your ${planName}. The bank said: “${failureMessage}”`;
  return (
    <MailLayout preview={line} appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {name},
      </Heading>
      <Text style={paragraph}>{line}</Text>
      <Text style={paragraph}>
        Your lessons stay open until {graceUntil}. Update your card before then and we will try the payment again
        straight away.
      </Text>
      <MailAction href={absoluteUrl(billingUrl, appUrl)} label="Update your card" />
    </MailLayout>
  );
}
