/** @jsxRuntime automatic @jsxImportSource react */
import { Heading, Text } from "@react-email/components";
import type { TeachingMail } from "@/lib/mail/types-teaching";
import { MailAction, MailLayout, absoluteUrl, paragraph, type MailFrame } from "../layout";

type Data = TeachingMail["checkin-feedback"];

export default function CheckinFeedbackEmail(props: Data & MailFrame) {
  const {
    studentName,
    teacherName,
    tuneTitle,
    stageName,
    outcome,
    feedback,
    nextStageName,
    assignmentUrl,
    appUrl,
    schoolName,
  } = props;
  const verdict =
    outcome === "signed_off"
      ? `${teacherName} listened to your recording of ${tuneTitle} and signed off ${stageName}.`
      : `${teacherName} listened to your recording of ${tuneTitle} (${stageName}) and suggests a little more time with it before moving on.`;
  return (
    <MailLayout preview={verdict} appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {studentName},
      </Heading>
      <Text style={paragraph}>{verdict}</Text>
      {feedback ? <Text style={{ ...paragraph, fontStyle: "italic" }}>“{feedback}”</Text> : null}
      {nextStageName ? <Text style={paragraph}>{nextStageName} is now open for you.</Text> : null}
      <MailAction href={absoluteUrl(assignmentUrl, appUrl)} label="Open the assignment" />
    </MailLayout>
  );
}
