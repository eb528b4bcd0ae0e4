/** @jsxRuntime automatic @jsxImportSource react */
import { Heading, Text } from "@react-email/components";
import type { TeachingMail } from "@/lib/mail/types-teaching";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "../layout";

type Data = TeachingMail["welcome-note"];

export default function WelcomeNoteEmail({
  studentName,
  teacherName,
  courseTitle,
  note,
  courseUrl,
  appUrl,
  schoolName,
}: Data & MailFrame) {
  return (
    <MailLayout preview={`${teacherName} welcomes you to “${courseTitle}”.`} appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {studentName},
      </Heading>
      <Text style={paragraph}>
        {teacherName} follows you on <strong>{courseTitle}</strong> and has a word for you:
      </Text>
      <Text style={{ ...paragraph, fontStyle: "italic" }}>“{note}”</Text>
      <MailAction href={absoluteUrl(courseUrl, appUrl)} label="Open your ladder" />
    </MailLayout>
  );
}
