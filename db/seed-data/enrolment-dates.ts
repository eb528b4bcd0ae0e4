// When each demo enrolment began (and ended), spread over the year like the billing history: a student
// joins a course a day after their membership starts, a second course some weeks later; an ended
// enrolment ends with the membership. Plain and deterministic, so a re-seed writes the same dates.
import { and, eq, sql } from "drizzle-orm";
import type { Db } from "../client";
import { courses, enrolments, users } from "../schema";
import { DAY, type DemoMembership } from "./billing-history";
import { DEMO_COURSES } from "./catalogue";
import { STUDENTS } from "./people";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

export interface DemoEnrolmentDate {
  student: number;
  course: string; // slug
  enrolledAt: number; // unix seconds
  endedAt: number | null;
}

const iso = (unix: number | null) => (unix === null ? null : new Date(unix * 1000).toISOString());
const SECOND_COURSE_GAP = 24 * DAY; // a second course some weeks after the first (invented)

export function demoEnrolmentDates(history: DemoMembership[], anchor: number): DemoEnrolmentDate[] {
  const seen = new Map<number, number>(); // courses each student has joined so far
  const out: DemoEnrolmentDate[] = [];
  for (const course of DEMO_COURSES) {
    for (const e of course.enrolments) {
      const m = history.find((h) => h.student === e.student);
      const nth = seen.get(e.student) ?? 0;
      seen.set(e.student, nth + 1);
      // A student with no membership in the history joined some weeks back, by their place in the list.
      const joined = m ? m.start + DAY : anchor - (20 + 9 * e.student) * DAY;
      const enrolledAt = Math.min(joined + nth * SECOND_COURSE_GAP, anchor - DAY);
      const ended = e.status === "ended" ? (m?.endedAt ?? m?.canceledAt ?? anchor - 2 * DAY) : null;
      out.push({
        student: e.student,
        course: course.slug,
        enrolledAt,
        endedAt: ended === null ? null : Math.max(ended, enrolledAt),
      });
    }
  }
  return out;
}

/** Dates the demo enrolments the catalogue seed made; enrolments made in the app are left alone. */
export async function dateDemoEnrolments(tx: Tx, history: DemoMembership[], anchor: number): Promise<void> {
  for (const d of demoEnrolmentDates(history, anchor)) {
    const student = STUDENTS[d.student];
    if (!student) continue;
    await tx
      .update(enrolments)
      .set({
        enrolledAt: new Date(d.enrolledAt * 1000),
        teacherSince: new Date(d.enrolledAt * 1000), // their teacher has followed them since they enrolled
        endedAt: sql`case when ${enrolments.status} = 'ended' then ${iso(d.endedAt)}::timestamptz else ${enrolments.endedAt} end`,
      })
      .where(
        and(
          eq(
            enrolments.userId,
            sql`(select ${users.id} from ${users} where lower(${users.email}) = ${student.email.toLowerCase()})`,
          ),
          eq(enrolments.courseId, sql`(select ${courses.id} from ${courses} where ${courses.slug} = ${d.course})`),
        ),
      );
  }
}
