import type { TeachingMail } from "@/lib/mail/types-teaching";

// Subjects of the teaching e-mails (apart from the JSX, like emails/subjects.ts).
export const teachingSubjects: { [T in keyof TeachingMail]: (data: TeachingMail[T]) => string } = {};
