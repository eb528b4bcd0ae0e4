/** @jsxRuntime automatic @jsxImportSource react */
// The pragma: tsx reads the root tsconfig, which keeps JSX as is for Next ("preserve"); this names the runtime.
import { Heading, Text } from "@react-email/components";
import type { MailTemplates } from "@/lib/mail/types";
import { subjects } from "./subjects";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "./layout";

type Data = MailTemplates["welcome"];

export const subject = subjects.welcome;

export default function WelcomeEmail({ name, verifyUrl, appUrl, schoolName }: Data & MailFrame) {
  return (
    <MailLayout
      preview="One small step before your first tune: confirm your address."
      appUrl={appUrl}
      schoolName={schoolName}
    >
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Welcome, {name}
      </Heading>
      <Text style={paragraph}>
        We are glad you are here. Rosinwood takes a tune apart into small steps, starting from the bare melody, so there
        is never too much on the page at once.
      </Text>
      <Text style={paragraph}>Before your first tune, please confirm that this address is yours:</Text>
      <MailAction href={absoluteUrl(verifyUrl, appUrl)} label="Confirm my address" />
      <Text style={paragraph}>If you did not sign up, you can let this message go: nothing happens without you.</Text>
    </MailLayout>
  );
}
