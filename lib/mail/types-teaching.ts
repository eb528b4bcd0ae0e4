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
    /** "comment": the teacher's words on a check-in that opened the next stage by itself (a self-paced course). */
    outcome: "signed_off" | "needs_more_time" | "comment";
    feedback: string;
    /** The stage that opened with this sign-off; null when none did (last stage, or "needs more time"). */
    nextStageName: string | null;
    /** Where the work is: the assignment, or the tune page of a course's tune. */
    assignmentUrl: string;
    /** Set on a course's stage: the course's title (the link then opens the tune). */
    courseTitle?: string | null;
    /** False when the check-in had no recording ("played from memory"). */
    recorded?: boolean;
  };
  "due-reminder": {
    studentName: string;
    tuneTitle: string;
    dueLocal: string;
    when: "two_days" | "due_today" | "overdue";
    assignmentUrl: string;
  };
  /** A teacher's welcome to a member who started one of their courses (or was handed to them). */
  "welcome-note": {
    studentName: string;
    teacherName: string;
    courseTitle: string;
    note: string;
    courseUrl: string;
  };
  /** Once a day to a teacher: the members who came to them the day before. */
  "new-members": {
    teacherName: string;
    day: string;
    members: { name: string; courseTitle: string }[];
    rosterUrl: string;
  };
}
