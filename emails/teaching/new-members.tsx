/** @jsxRuntime automatic @jsxImportSource react */
import { Heading, Text } from "@react-email/components";
import type { TeachingMail } from "@/lib/mail/types-teaching";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "../layout";

type Data = TeachingMail["new-members"];

export default function NewMembersEmail({
  teacherName,
  day,
  members,
  rosterUrl,
  appUrl,
  schoolName,
}: Data & MailFrame) {
  const count = members.length === 1 ? "one new member" : `${members.length} new members`;
  return (
    <MailLayout preview={`You have ${count} from ${day}.`} appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {teacherName},
      </Heading>
      <Text style={paragraph}>{`You follow ${count} since ${day}:`}</Text>
      {members.map((m) => (
        <Text key={`${m.name}|${m.courseTitle}`} style={{ ...paragraph, margin: "0 0 8px" }}>
          {`${m.name}, on “${m.courseTitle}”`}
        </Text>
      ))}
      <Text style={paragraph}>A welcome note from you is sent from your roster.</Text>
      <MailAction href={absoluteUrl(rosterUrl, appUrl)} label="Open your roster" />
    </MailLayout>
  );
}
