/** @jsxRuntime automatic @jsxImportSource react */
import { Heading, Text } from "@react-email/components";
import type { TeachingMail } from "@/lib/mail/types-teaching";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "../layout";

type Data = TeachingMail["due-reminder"];

const lines: Record<Data["when"], (tune: string, due: string) => string> = {
  two_days: (tune, due) => `A friendly reminder: ${tune} is due in two days, ${due}.`,
  due_today: (tune, due) => `${tune} is due today, ${due}. A short, relaxed run-through counts.`,
  overdue: (tune, due) =>
    `${tune} was due ${due}. No harm done: check in when you are ready, or tell your teacher you need more time.`,
};

export default function DueReminderEmail({
  studentName,
  tuneTitle,
  dueLocal,
  when,
  assignmentUrl,
  appUrl,
  schoolName,
}: Data & MailFrame) {
  const line = lines[when](tuneTitle, dueLocal);
  return (
    <MailLayout preview={line} appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {studentName},
      </Heading>
      <Text style={paragraph}>{line}</Text>
      <MailAction href={absoluteUrl(assignmentUrl, appUrl)} label="Open the assignment" />
    </MailLayout>
  );
}
