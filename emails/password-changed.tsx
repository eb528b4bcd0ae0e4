/** @jsxRuntime automatic @jsxImportSource react */
// The pragma: tsx reads the root tsconfig, which keeps JSX as is for Next ("preserve"); this names the runtime.
import { Heading, Link, Text } from "@react-email/components";
import type { MailTemplates } from "@/lib/mail/types";
import { subjects } from "./subjects";
import { MailLayout, absoluteUrl, paragraph, type MailFrame } from "./layout";

type Data = MailTemplates["password-changed"];

export const subject = subjects["password-changed"];

export default function PasswordChangedEmail({ name, appUrl, schoolName }: Data & MailFrame) {
  const forgot = absoluteUrl("/forgot-password", appUrl);
  return (
    <MailLayout preview="Your password was just changed." appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {name},
      </Heading>
      <Text style={paragraph}>
        The password for your Rosinwood account was just changed, and every device that was signed in has been signed
        out. If that was you, all is well and there is nothing more to do.
      </Text>
      <Text style={paragraph}>
        If it was not you, please{" "}
        <Link href={forgot} style={{ color: "#8A3B12" }}>
          choose a new password
        </Link>{" "}
        straight away, and reply to this message so we can help.
      </Text>
    </MailLayout>
  );
}
