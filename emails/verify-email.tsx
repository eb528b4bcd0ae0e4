/** @jsxRuntime automatic @jsxImportSource react */
// The pragma: tsx reads the root tsconfig, which keeps JSX as is for Next ("preserve"); this names the runtime.
import { Heading, Text } from "@react-email/components";
import type { MailTemplates } from "@/lib/mail/types";
import { subjects } from "./subjects";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "./layout";

type Data = MailTemplates["verify-email"];

export const subject = subjects["verify-email"];

export default function VerifyEmail({ name, verifyUrl, appUrl, schoolName }: Data & MailFrame) {
  return (
    <MailLayout
      preview="Confirm your address so your teacher's messages reach you."
      appUrl={appUrl}
      schoolName={schoolName}
    >
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {name},
      </Heading>
      <Text style={paragraph}>
        Please confirm that this is your address, so that assignments and your teacher&apos;s feedback reach you.
      </Text>
      <MailAction href={absoluteUrl(verifyUrl, appUrl)} label="Confirm my address" />
      <Text style={paragraph}>If you did not ask for this, you can let this message go.</Text>
    </MailLayout>
  );
}
