// A member starts a course: the enrolment that, with a membership in good standing, opens its ladder.
import { and, eq } from "drizzle-orm";
import type { Tx as Db } from "@/db/queries/auth";
import { findCourse } from "@/db/queries/catalogue";
import { insertEnrolment } from "@/db/queries/enrolments";
import { membershipsOf } from "@/db/queries/membership";
import { enrolments } from "@/db/schema";
import { conflict, forbidden, notFound } from "@/lib/auth/errors";
import { memberStanding, type Role } from "./gate";

export type StartCourseOffer =
  { kind: "start"; courseId: string; title: string } | { kind: "join"; href: string; label: string } | null;

/** What the ladder page offers a student: start this course, choose a plan, fix the payment, or nothing. */
export async function startCourseOffer(
  db: Db,
  person: { id: string; role: Role },
  idOrSlug: string,
): Promise<StartCourseOffer> {
  if (person.role !== "student") return null;
  const course = await findCourse(db, idOrSlug);
  if (!course || !course.published) return null;
  const standing = await memberStanding(db, person);
  if (!standing.good) {
    const hasAny = (await membershipsOf(db, person.id)).length > 0;
    return hasAny
      ? { kind: "join", href: "/learn/billing", label: "Open the billing page" }
      : { kind: "join", href: "/plans", label: "Choose a membership plan" };
  }
  const [row] = await db
    .select({ status: enrolments.status })
    .from(enrolments)
    .where(and(eq(enrolments.userId, person.id), eq(enrolments.courseId, course.id)))
    .limit(1);
  return row ? null : { kind: "start", courseId: course.id, title: course.title };
}

/** Enrols a member in good standing; returns whether a new enrolment was made. */
export async function startCourse(
  db: Db,
  person: { id: string; role: Role },
  courseId: string,
): Promise<{ created: boolean; slug: string }> {
  const course = await findCourse(db, courseId);
  if (!course || !course.published) throw notFound("We couldn't find that course.");
  const standing = await memberStanding(db, person);
  if (!standing.good) throw forbidden(standing.why);
  // The course's lead teacher follows the new member (and has them on their roster) from now on.
  const made = await db.transaction((tx) => insertEnrolment(tx, { userId: person.id, courseId: course.id }));
  if (made) return { created: true, slug: course.slug };
  const [row] = await db
    .select({ status: enrolments.status })
    .from(enrolments)
    .where(and(eq(enrolments.userId, person.id), eq(enrolments.courseId, course.id)))
    .limit(1);
  if (row?.status !== "active")
    throw conflict(
      `Your enrolment in “${course.title}” is ${row?.status ?? "not active"}: ask your teacher to resume it.`,
    );
  return { created: false, slug: course.slug };
}
