/** @jsxRuntime automatic @jsxImportSource react */
// The pragma: tsx reads the root tsconfig, which keeps JSX as is for Next ("preserve"); this names the runtime.
import { Heading, Text } from "@react-email/components";
import type { MailTemplates } from "@/lib/mail/types";
import { subjects } from "./subjects";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "./layout";

type Data = MailTemplates["password-reset"];

export const subject = subjects["password-reset"];

export default function PasswordResetEmail({ name, resetUrl, expiresInMinutes, appUrl, schoolName }: Data & MailFrame) {
  return (
    <MailLayout preview="A link to choose a new password." appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {name},
      </Heading>
      <Text style={paragraph}>
        Someone (we hope you) asked to choose a new password for your Rosinwood account. The link works once, for the
        next {expiresInMinutes} minutes.
      </Text>
      <MailAction href={absoluteUrl(resetUrl, appUrl)} label="Choose a new password" />
      <Text style={paragraph}>If you did not ask, you need not do anything: your password stays as it is.</Text>
    </MailLayout>
  );
}
