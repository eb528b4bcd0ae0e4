import type { TeachingMail } from "@/lib/mail/types-teaching";

// Subjects of the teaching e-mails (apart from the JSX, like emails/subjects.ts).
export const teachingSubjects: { [T in keyof TeachingMail]: (data: TeachingMail[T]) => string } = {
  "assignment-new": (d) => `New tune from ${d.teacherName}: ${d.tuneTitle}`,
  "checkin-feedback": (d) =>
    d.outcome === "signed_off"
      ? `${d.tuneTitle}: ${d.stageName} signed off`
      : d.outcome === "comment"
        ? `${d.tuneTitle}: a word from ${d.teacherName} on ${d.stageName}`
        : `${d.tuneTitle}: feedback on ${d.stageName}`,
  "due-reminder": (d) =>
    d.when === "two_days"
      ? `${d.tuneTitle} is due in two days`
      : d.when === "due_today"
        ? `${d.tuneTitle} is due today`
        : `${d.tuneTitle} is now overdue`,
  "welcome-note": (d) => `${d.teacherName} welcomes you to ${d.courseTitle}`,
  "new-members": (d) =>
    d.members.length === 1 ? `A new member: ${d.members[0].name}` : `${d.members.length} new members since ${d.day}`,
};
