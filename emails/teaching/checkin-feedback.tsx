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
  const heard = props.recorded === false ? "looked at your check-in of" : "listened to your recording of";
  const verdict =
    outcome === "signed_off"
      ? `${teacherName} ${heard} ${tuneTitle} and signed off ${stageName}.`
      : outcome === "comment"
        ? `${teacherName} has a word on your check-in of ${tuneTitle} (${stageName}).`
        : `${teacherName} ${heard} ${tuneTitle} (${stageName}) and suggests a little more time with it before moving on.`;
  return (
    <MailLayout preview={verdict} appUrl={appUrl} schoolName={schoolName}>
      <Heading as="h1" style={{ ...paragraph, fontSize: "24px", lineHeight: "32px" }}>
        Hello {studentName},
      </Heading>
      <Text style={paragraph}>{verdict}</Text>
      {feedback ? <Text style={{ ...paragraph, fontStyle: "italic" }}>“{feedback}”</Text> : null}
      {nextStageName ? <Text style={paragraph}>{nextStageName} is now open for you.</Text> : null}
      <MailAction
        href={absoluteUrl(assignmentUrl, appUrl)}
        label={props.courseTitle ? `Open ${tuneTitle}` : "Open the assignment"}
      />
    </MailLayout>
  );
}
