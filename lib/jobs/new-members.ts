// The teacher's daily e-mail of new members: once their day is over (in their own time zone), each
// teacher with members who came to them that day gets one message listing them. The outbox's dedupe
// key (new-members:<teacher>:<day>) makes it one a day whatever runs it — every quarter hour, from
// two workers at once, again after a restart.
import type { Db } from "@/db/client";
import { newMembers, teachersWithNewMembers } from "@/db/queries/enrolments";
import { appLink } from "@/lib/auth/links";
import { enqueueEmail } from "@/lib/mail/outbox";
import { addDays, dayIn } from "@/lib/teaching/learn-dates";
import { isTimeZone } from "@/lib/teaching/teach-time";

export const digestKey = (teacherId: string, day: string) => `new-members:${teacherId}:${day}`;

const DAY_MS = 86_400_000;

/** "Friday 4 December" for a YYYY-MM-DD day (the day itself, not an instant: no zone shifts it). */
function dayWords(day: string): string {
  return new Date(`${day}T12:00:00Z`).toLocaleDateString("en-GB", {
    timeZone: "UTC",
    weekday: "long",
    day: "numeric",
    month: "long",
  });
}

/** Queues yesterday's digest for every teacher who had new members then; returns the keys queued by this call. */
export async function sendNewMemberDigests(db: Db, now: Date): Promise<string[]> {
  // Two days back covers "yesterday" in every zone, from UTC−12 to UTC+14.
  const from = new Date(now.getTime() - 2 * DAY_MS - 3 * 3_600_000);
  const queued: string[] = [];
  for (const teacher of await teachersWithNewMembers(db, from, now)) {
    const zone = isTimeZone(teacher.timeZone) ? teacher.timeZone : "UTC";
    const yesterday = addDays(dayIn(zone, now), -1);
    const members = (await newMembers(db, teacher.id, from, now)).filter((m) => dayIn(zone, m.since) === yesterday);
    if (!members.length) continue;
    const key = digestKey(teacher.id, yesterday);
    const row = await enqueueEmail(db, {
      to: teacher.email,
      template: "new-members",
      data: {
        teacherName: teacher.name,
        day: dayWords(yesterday),
        members: members.map((m) => ({ name: m.studentName, courseTitle: m.courseTitle })),
        rosterUrl: appLink("/teach"),
      },
      dedupeKey: key,
    });
    if (row) queued.push(key);
  }
  return queued;
}
