// Due-date reminders: two days before, on the day (in the student's own time zone) and once when
// overdue. Each is an outbox row whose dedupe key is unique, so running this every minute, from two
// workers at once or again after a restart sends each reminder at most once per assignment, student and
// due date: when the teacher moves the due date, the reminders for the new date go out in their turn.
import { and, eq, inArray, lte, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { assignments, assignmentStudents, emailOutbox, stageStates, tunes, users } from "@/db/schema";
import { enqueueEmail } from "@/lib/mail/outbox";
import type { TeachingMail } from "@/lib/mail/types-teaching";
import { dayIn } from "@/lib/teaching/learn-dates";
import { dueForMail, isTimeZone } from "@/lib/teaching/teach-time";

export type ReminderWhen = TeachingMail["due-reminder"]["when"];

const TWO_DAYS_MS = 2 * 24 * 60 * 60 * 1000;

export const reminderKey = (when: ReminderWhen, assignmentStudentId: string, dueAt: Date) =>
  `due-reminder:${when}:${assignmentStudentId}:${dueAt.toISOString()}`;

/**
 * Which reminder is due now, if any; only the most pressing one, so a worker that was down for days
 * sends "overdue" rather than a stale "two days to go". Pure, for the unit of the rule.
 */
export function reminderFor(dueAt: Date, now: Date, zone: string, allSignedOff: boolean): ReminderWhen | null {
  if (allSignedOff) return null;
  if (now.getTime() >= dueAt.getTime()) return "overdue";
  if (dayIn(zone, now) === dayIn(zone, dueAt)) return "due_today";
  if (dueAt.getTime() - now.getTime() <= TWO_DAYS_MS) return "two_days";
  return null;
}

type Candidate = {
  id: string;
  dueAt: Date;
  email: string;
  name: string;
  timeZone: string;
  title: string;
  stages: number;
  unsigned: number;
};

/** Active copies due within two days or already past, with their stage count and how many are not signed off. */
async function candidates(db: Db, now: Date): Promise<Candidate[]> {
  return db
    .select({
      id: assignmentStudents.id,
      dueAt: assignments.dueAt,
      email: users.email,
      name: users.name,
      timeZone: users.timeZone,
      title: tunes.title,
      stages: sql<number>`(select count(*)::int from ${stageStates} where ${stageStates.assignmentStudentId} = ${assignmentStudents.id})`,
      unsigned: sql<number>`(select count(*)::int from ${stageStates} where ${stageStates.assignmentStudentId} = ${assignmentStudents.id} and ${stageStates.state} <> 'signed_off')`,
    })
    .from(assignmentStudents)
    .innerJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .innerJoin(users, eq(users.id, assignmentStudents.studentId))
    .innerJoin(tunes, eq(tunes.id, assignments.tuneId))
    .where(
      and(
        eq(assignments.status, "active"),
        eq(users.disabled, false),
        lte(assignments.dueAt, new Date(now.getTime() + TWO_DAYS_MS)),
      ),
    );
}

/** Queues every reminder due at `now` that was not queued before; returns the keys queued by this call. */
export async function sendDueReminders(db: Db, now: Date): Promise<string[]> {
  const due: { c: Candidate; when: ReminderWhen; zone: string }[] = [];
  for (const c of await candidates(db, now)) {
    const zone = isTimeZone(c.timeZone) ? c.timeZone : "UTC"; // a bad stored zone must not stop everyone's reminders
    // Fully signed off means every stage row is; a copy without stage rows still has its work ahead.
    const when = reminderFor(c.dueAt, now, zone, c.stages > 0 && c.unsigned === 0);
    if (when) due.push({ c, when, zone });
  }
  if (!due.length) return [];
  // Skip the ones already in the outbox without a write; the unique key still decides any race.
  const keys = due.map((d) => reminderKey(d.when, d.c.id, d.c.dueAt));
  const done = new Set(
    (await db.select({ key: emailOutbox.dedupeKey }).from(emailOutbox).where(inArray(emailOutbox.dedupeKey, keys))).map(
      (r) => r.key,
    ),
  );
  const queued: string[] = [];
  for (const { c, when, zone } of due) {
    const key = reminderKey(when, c.id, c.dueAt);
    if (done.has(key)) continue;
    const row = await enqueueEmail(db, {
      to: c.email,
      template: "due-reminder",
      data: {
        studentName: c.name,
        tuneTitle: c.title,
        dueLocal: dueForMail(c.dueAt, zone),
        when,
        assignmentUrl: `/learn/assignments/${c.id}`,
      },
      dedupeKey: key,
    });
    if (row) queued.push(key);
  }
  return queued;
}
