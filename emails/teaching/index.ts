import type { TemplateEntry } from "@/lib/mail/templates";
import type { TeachingMail } from "@/lib/mail/types-teaching";
import AssignmentNewEmail from "./assignment-new";
import CheckinFeedbackEmail from "./checkin-feedback";
import DueReminderEmail from "./due-reminder";
import NewMembersEmail from "./new-members";
import WelcomeNoteEmail from "./welcome-note";
import { teachingSubjects } from "./subjects";

// The teaching e-mails' templates, spread into lib/mail/templates.ts.
export const teachingTemplates: { [T in keyof TeachingMail]: TemplateEntry<T> } = {
  "assignment-new": { subject: teachingSubjects["assignment-new"], Component: AssignmentNewEmail },
  "checkin-feedback": { subject: teachingSubjects["checkin-feedback"], Component: CheckinFeedbackEmail },
  "due-reminder": { subject: teachingSubjects["due-reminder"], Component: DueReminderEmail },
  "welcome-note": { subject: teachingSubjects["welcome-note"], Component: WelcomeNoteEmail },
  "new-members": { subject: teachingSubjects["new-members"], Component: NewMembersEmail },
};
