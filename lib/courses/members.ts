// Every member has a teacher: the teacher's new members (the roster's "new this week"), their welcome
// note, and the admin handing enrolments to another teacher, one or many at once.
import { z } from "zod";
import type { Tx as Db } from "@/db/queries/auth";
import {
  existingEnrolments,
  markWelcomed,
  memberOf,
  newMembers,
  reassignEnrolments,
  teachingStaff,
  type NewMemberRow,
} from "@/db/queries/enrolments";
import { conflict, notFound, unprocessable } from "@/lib/auth/errors";
import { appLink } from "@/lib/auth/links";
import { enqueueEmail } from "@/lib/mail/outbox";

type Me = { id: string; role: "student" | "teacher" | "admin" };

/** How far back "new this week" looks. */
export const NEW_MEMBER_DAYS = 7;

export type NewMember = {
  enrolmentId: string;
  student: { id: string; name: string; email: string };
  course: { id: string; title: string; slug: string };
  since: string;
  welcomedAt: string | null;
};

const json = (r: NewMemberRow): NewMember => ({
  enrolmentId: r.enrolmentId,
  student: { id: r.studentId, name: r.studentName, email: r.studentEmail },
  course: { id: r.courseId, title: r.courseTitle, slug: r.courseSlug },
  since: r.since.toISOString(),
  welcomedAt: r.welcomedAt?.toISOString() ?? null,
});

/** Members who came to this teacher in the last week (an admin sees everyone's), newest first. */
export async function newMembersOf(db: Db, me: Me, now: Date): Promise<NewMember[]> {
  const from = new Date(now.getTime() - NEW_MEMBER_DAYS * 86_400_000);
  const rows = await newMembers(db, me.role === "admin" ? null : me.id, from, new Date(now.getTime() + 1));
  return rows.map(json);
}

export const welcomeInput = z.object({
  enrolmentId: z.uuid("Unknown enrolment."),
  note: z
    .string({ error: "Write a few words of welcome." })
    .trim()
    .min(1, "Write a few words of welcome.")
    .max(2000, "Keep the note under 2,000 characters."),
});

/** The teacher's welcome note to a member they follow: one per enrolment and teacher. */
export async function sendWelcome(db: Db, me: Me, enrolmentId: string, note: string, now: Date): Promise<NewMember> {
  return db.transaction(async (tx) => {
    const member = await memberOf(tx, enrolmentId);
    // Another teacher's member is "not found": whom they follow is not this teacher's business.
    if (!member || (me.role !== "admin" && member.teacherId !== me.id)) throw notFound("We couldn't find that member.");
    if (!(await markWelcomed(tx, enrolmentId, now))) throw conflict("You have already welcomed this member.");
    const [teacher] = (await teachingStaff(tx)).filter((s) => s.id === member.teacherId);
    await enqueueEmail(tx, {
      to: member.studentEmail,
      template: "welcome-note",
      data: {
        studentName: member.studentName,
        teacherName: teacher?.name ?? "Your teacher",
        courseTitle: member.courseTitle,
        note,
        courseUrl: appLink(`/learn/courses/${member.courseSlug}`),
      },
      dedupeKey: `welcome-note:${enrolmentId}:${member.since.toISOString()}`,
    });
    return json({ ...member, welcomedAt: now });
  });
}

export const reassignInput = z.object({
  enrolmentIds: z
    .array(z.uuid("Unknown enrolment."), { error: "Choose the enrolments to reassign." })
    .min(1, "Choose at least one enrolment.")
    .max(500, "Reassign at most 500 enrolments at a time."),
  teacherId: z.uuid("Choose the teacher."),
});

/** The admin hands enrolments to another teacher; returns how many changed (the rest had that teacher already). */
export async function reassignTeacher(
  db: Db,
  input: { enrolmentIds: string[]; teacherId: string },
  now: Date,
): Promise<{ changed: number; teacherName: string }> {
  const teacher = (await teachingStaff(db)).find((s) => s.id === input.teacherId);
  if (!teacher)
    throw unprocessable("Choose one of the school's teachers.", { teacherId: "Choose one of the school's teachers." });
  const ids = [...new Set(input.enrolmentIds)];
  return db.transaction(async (tx) => {
    const known = new Set(await existingEnrolments(tx, ids));
    const missing = ids.filter((id) => !known.has(id));
    if (missing.length)
      throw notFound(`${missing.length} of the chosen enrolments no longer exist${missing.length === 1 ? "s" : ""}.`);
    const changed = await reassignEnrolments(tx, ids, teacher.id, now);
    return { changed: changed.length, teacherName: teacher.name };
  });
}
