// The teaching e-mails' part of the mail contract (lib/mail/types.ts): template name → the data it needs.
// Each entry needs a subject in emails/teaching/subjects.ts and a component in emails/teaching/index.ts.
// Dates arrive already written out in the student's own time zone (e.g. "Friday 11 December, 18:00").
export interface TeachingMail {
  "assignment-new": {
    studentName: string;
    teacherName: string;
    tuneTitle: string;
    dueLocal: string;
    note: string;
    assignmentUrl: string;
  };
  "checkin-feedback": {
    studentName: string;
    teacherName: string;
    tuneTitle: string;
    stageName: string;
    outcome: "signed_off" | "needs_more_time";
    feedback: string;
    /** The stage that opened with this sign-off; null when none did (last stage, or "needs more time"). */
    nextStageName: string | null;
    assignmentUrl: string;
  };
  "due-reminder": {
    studentName: string;
    tuneTitle: string;
    dueLocal: string;
    when: "two_days" | "due_today" | "overdue";
    assignmentUrl: string;
  };
}
