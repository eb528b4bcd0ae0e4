/** @jsxRuntime automatic @jsxImportSource react */
import { Heading, Text } from "@react-email/components";
import type { TeachingMail } from "@/lib/mail/types-teaching";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "../layout";

type Data = TeachingMail["assignment-new"];

export default function AssignmentNewEmail({
  studentName,
  teacherName,
  tuneTitle,
  dueLocal,
  note,
  assignmentUrl,
  appUrl,
  schoolName,
}: Data & MailFrame) {
  return (
    <MailLayout
      preview={`${teacherName} gave you “${tuneTitle}”, due ${dueLocal}.`}
      appUrl={appUrl}
      schoolName={schoolName}
    >
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {studentName},
      </Heading>
      <Text style={paragraph}>
        {teacherName} has given you a new tune to learn: <strong>{tuneTitle}</strong>, due {dueLocal}. You start with
        its first stage; the next ones open as you go.
      </Text>
      {note ? <Text style={{ ...paragraph, fontStyle: "italic" }}>“{note}”</Text> : null}
      <MailAction href={absoluteUrl(assignmentUrl, appUrl)} label="Open the assignment" />
    </MailLayout>
  );
}
