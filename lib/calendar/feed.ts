// A person's due dates as an iCalendar feed (RFC 5545) through ical-generator: a student sees their
// active assignments, a teacher the assignments they gave (one event each, naming the students).
import ical, { ICalCalendarMethod } from "ical-generator";
import { and, asc, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { assignments, assignmentStudents, tunes, users } from "@/db/schema";
import { env } from "@/lib/env";
import { isWellFormedToken } from "./tokens";

type Owner = { id: string; name: string; timeZone: string };
export type FeedEvent = { uid: string; start: Date; summary: string; description: string; url: string; revised: Date };

async function ownerOf(db: Db, token: string): Promise<Owner | null> {
  if (!isWellFormedToken(token)) return null;
  const [row] = await db
    .select({ id: users.id, name: users.name, timeZone: users.timeZone, disabled: users.disabled })
    .from(users)
    .where(eq(users.calendarToken, token));
  return row && !row.disabled ? row : null;
}

/** The assignments the person was given, each their own event. */
async function received(db: Db, owner: Owner, appUrl: string, host: string): Promise<FeedEvent[]> {
  const rows = await db
    .select({
      id: assignmentStudents.id,
      dueAt: assignments.dueAt,
      note: assignments.note,
      updatedAt: assignments.updatedAt,
      title: tunes.title,
    })
    .from(assignmentStudents)
    .innerJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .innerJoin(tunes, eq(tunes.id, assignments.tuneId))
    .where(and(eq(assignmentStudents.studentId, owner.id), eq(assignments.status, "active")))
    .orderBy(asc(assignments.dueAt));
  return rows.map((r) => ({
    uid: `assignment-student-${r.id}@${host}`,
    start: r.dueAt,
    summary: `Due: ${r.title}`,
    description: r.note ? `Note from your teacher: ${r.note}` : `Your assignment: ${r.title}.`,
    url: new URL(`/learn/assignments/${r.id}`, appUrl).toString(),
    revised: r.updatedAt,
  }));
}

/** The assignments the person gave, one event per assignment with its students' names. */
async function given(db: Db, owner: Owner, appUrl: string, host: string): Promise<FeedEvent[]> {
  const rows = await db
    .select({ id: assignments.id, dueAt: assignments.dueAt, updatedAt: assignments.updatedAt, title: tunes.title })
    .from(assignments)
    .innerJoin(tunes, eq(tunes.id, assignments.tuneId))
    .where(and(eq(assignments.teacherId, owner.id), eq(assignments.status, "active")))
    .orderBy(asc(assignments.dueAt));
  if (!rows.length) return [];
  const names = await db
    .select({ assignmentId: assignmentStudents.assignmentId, name: users.name })
    .from(assignmentStudents)
    .innerJoin(users, eq(users.id, assignmentStudents.studentId))
    .where(
      inArray(
        assignmentStudents.assignmentId,
        rows.map((r) => r.id),
      ),
    )
    .orderBy(asc(users.name));
  return rows.map((r) => {
    const students = names.filter((n) => n.assignmentId === r.id).map((n) => n.name);
    return {
      uid: `assignment-${r.id}@${host}`,
      start: r.dueAt,
      summary: `Due: ${r.title} (${students.join(", ")})`,
      description: `${r.title}, assigned to ${students.join(", ")}.`,
      url: new URL("/teach/assignments", appUrl).toString(),
      revised: r.updatedAt,
    };
  });
}

export function renderFeed(owner: { name: string; timeZone: string }, events: FeedEvent[]): string {
  const calendar = ical({
    name: `Rosinwood: ${owner.name}'s due dates`,
    prodId: { company: "Rosinwood", product: "Due dates", language: "EN" },
    // PUBLISH: a feed to subscribe to, not an invitation (RFC 5546 §3.2.1).
    method: ICalCalendarMethod.PUBLISH,
    // X-WR-TIMEZONE: the zone calendar programs show times in (a common extension, not in RFC 5545).
    timezone: owner.timeZone,
    // REFRESH-INTERVAL / X-PUBLISHED-TTL: ask subscribers to look again hourly (RFC 7986 §5.7).
    ttl: 60 * 60,
  });
  for (const e of events) {
    calendar.createEvent({
      // UID stays the same for an assignment, so an edited due date moves the event instead of adding one (RFC 5545 §3.8.4.7).
      id: e.uid,
      start: e.start,
      // DTSTART without DTEND: an event that takes up the instant it starts (RFC 5545 §3.6.1), i.e. a deadline.
      summary: e.summary,
      description: e.description,
      url: e.url,
      stamp: e.revised,
      lastModified: e.revised,
    });
  }
  return calendar.toString();
}

/** The feed of the token's owner, or null for an unknown, revoked or malformed token. */
export async function calendarFeed(db: Db, token: string, appUrl = env().APP_URL): Promise<string | null> {
  const owner = await ownerOf(db, token);
  if (!owner) return null;
  const host = new URL(appUrl).hostname;
  const events = [...(await received(db, owner, appUrl, host)), ...(await given(db, owner, appUrl, host))];
  events.sort((a, b) => a.start.getTime() - b.start.getTime());
  return renderFeed(owner, events);
}
