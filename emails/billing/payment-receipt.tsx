/** @jsxRuntime automatic @jsxImportSource react */
import { Heading, Text } from "@react-email/components";
import type { BillingMail } from "@/lib/mail/types-billing";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "../layout";

type Data = BillingMail["payment-receipt"];

export default function PaymentReceiptEmail({
  name,
  planName,
  amount,
  receiptNumber,
  paidOn,
  period,
  receiptUrl,
  appUrl,
  schoolName,
}: Data & MailFrame) {
  const line = `Thank you: ${schoolName} received ${amount} for your ${planName} on ${paidOn}.`;
  return (
    <MailLayout preview={line} appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {name},
      </Heading>
      <Text style={paragraph}>{line}</Text>
      <Text style={paragraph}>Receipt number: {receiptNumber}</Text>
      {period ? <Text style={paragraph}>Membership period: {period}</Text> : null}
      <MailAction href={absoluteUrl(receiptUrl, appUrl)} label="View or print the receipt" />
    </MailLayout>
  );
}
