/** @jsxRuntime automatic @jsxImportSource react */
import { Heading, Text } from "@react-email/components";
import type { BillingMail } from "@/lib/mail/types-billing";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "../layout";

type Data = BillingMail["refund-issued"];

export default function RefundIssuedEmail({
  name,
  amount,
  receiptNumber,
  reason,
  receiptUrl,
  appUrl,
  schoolName,
}: Data & MailFrame) {
  const line = `We have refunded ${amount} on receipt ${receiptNumber}.`;
  return (
    <MailLayout preview={line} appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {name},
      </Heading>
      <Text style={paragraph}>{line} Banks usually take five to ten working days to show it on your statement.</Text>
      {reason ? <Text style={paragraph}>Reason: {reason}</Text> : null}
      <MailAction href={absoluteUrl(receiptUrl, appUrl)} label="View the receipt" />
    </MailLayout>
  );
}
