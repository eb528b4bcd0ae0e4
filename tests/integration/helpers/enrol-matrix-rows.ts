// The authorization matrix's rows (tests/integration/authorization-matrix.test.ts) for starting a
// course, climbing it, the teacher's new members and self-paced check-ins, undoing a "needs more
// time", and the admin's reassignment: as a visitor, the student, the student's teacher (the course's
// lead), another teacher and an admin.
import { randomUUID } from "node:crypto";
import type { Db } from "@/db/client";
import { insertEnrolment } from "@/db/queries/enrolments";
import type { RequestContext } from "@/lib/auth/context";
import { courses, grades, rungs } from "@/db/schema";
import { giveMembership, makeAssignment, makeTune, makeUpload } from "./learning-matrix-rows";
import { callRoute, type TeachCall } from "./teach-world";

type Who = "visitor" | "student" | "teacher" | "otherTeacher" | "admin";
type Person = { id: string; email: string };
type CallLike = {
  who: Who;
  ctx: RequestContext;
  cookie: string | undefined;
  people: { student: Person; teacher: Person; otherStudent: Person };
  w: { db: Db };
  n: number;
};
type RowLike = { covers: string[]; call: (c: CallLike) => Promise<number>; expect: Record<Who, number> };

const status = (c: CallLike, file: string, method: string, o: TeachCall = {}) =>
  callRoute(file, method, { ...o, cookie: c.cookie }).then((r) => r.status);

/** A published course led by the student's teacher, with one taster rung. */
async function courseOf(c: CallLike, pace: "self_paced" | "teacher_sign_off" = "self_paced") {
  const teacherId = c.people.teacher.id;
  const tune = await makeTune(c.w.db, teacherId, { taster: false });
  const [course] = await c.w.db
    .insert(courses)
    .values({
      teacherId,
      leadTeacherId: teacherId,
      pace,
      slug: `matrix-${randomUUID()}`,
      title: "Matrix course",
      publishedAt: new Date(),
    })
    .returning();
  const [grade] = await c.w.db
    .insert(grades)
    .values({ courseId: course.id, position: 1, title: "Grade 1" })
    .returning();
  await c.w.db.insert(rungs).values({ gradeId: grade.id, tuneId: tune.tuneId, position: 1, isTaster: true });
  return { courseId: course.id, tuneId: tune.tuneId };
}

/** The student enrolled (followed by their teacher) in a fresh course. */
async function enrolled(c: CallLike, pace?: "self_paced" | "teacher_sign_off") {
  const made = await courseOf(c, pace);
  const e = await insertEnrolment(c.w.db, { userId: c.people.student.id, courseId: made.courseId });
  return { ...made, enrolmentId: e?.id ?? "" };
}

const staff = (ok: number): Record<Who, number> => ({
  visitor: 401,
  student: 403,
  teacher: ok,
  otherTeacher: ok,
  admin: ok,
});

export function enrolRows(): RowLike[] {
  return [
    {
      // A member starts a course from its page; teachers have no memberships to start one with.
      covers: ["app/(marketing)/catalogue/courses/[slug]/actions.ts#startCourse"],
      call: async (c) => {
        const { courseId } = await courseOf(c);
        await giveMembership(c.w.db, c.people.student.id);
        const { startCourseAction } = await import("@/lib/courses/actions");
        return (await startCourseAction(c.ctx, { courseId })).status;
      },
      expect: { visitor: 401, student: 200, teacher: 403, otherTeacher: 403, admin: 200 },
    },
    {
      covers: ["GET /api/learn/tunes/[tuneId]/climb"],
      call: async (c) =>
        status(c, "learn/tunes/[tuneId]/climb", "GET", { params: { tuneId: (await enrolled(c)).tuneId } }),
      expect: { visitor: 401, student: 200, teacher: 403, otherTeacher: 403, admin: 200 },
    },
    {
      // Only an enrolled member climbs; an admin is enrolled in nothing here (403, with why).
      covers: ["POST /api/learn/tunes/[tuneId]/check-ins"],
      call: async (c) =>
        status(c, "learn/tunes/[tuneId]/check-ins", "POST", {
          params: { tuneId: (await enrolled(c)).tuneId },
          body: { stageIndex: 1, selfRating: 4, fromMemory: true },
        }),
      expect: { visitor: 401, student: 201, teacher: 403, otherTeacher: 403, admin: 403 },
    },
    { covers: ["GET /api/teach/new-members"], call: (c) => status(c, "teach/new-members", "GET"), expect: staff(200) },
    {
      covers: ["POST /api/teach/new-members/[enrolmentId]/welcome"],
      call: async (c) =>
        status(c, "teach/new-members/[enrolmentId]/welcome", "POST", {
          params: { enrolmentId: (await enrolled(c)).enrolmentId },
          body: { note: "Welcome to the course." },
        }),
      expect: { visitor: 401, student: 403, teacher: 201, otherTeacher: 404, admin: 201 },
    },
    { covers: ["GET /api/teach/check-ins"], call: (c) => status(c, "teach/check-ins", "GET"), expect: staff(200) },
    {
      covers: ["POST /api/teach/check-ins/[checkInId]/comment"],
      call: async (c) => {
        const { tuneId } = await enrolled(c, "self_paced");
        const { checkInRung } = await import("@/lib/teaching/course-check-in");
        const made = await checkInRung(c.w.db, { id: c.people.student.id, role: "student" }, tuneId, {
          stageIndex: 1,
          uploadId: null,
          selfRating: 4,
          fromMemory: true,
        });
        return status(c, "teach/check-ins/[checkInId]/comment", "POST", {
          params: { checkInId: made.checkInId },
          body: { comment: "Well played." },
        });
      },
      expect: { visitor: 401, student: 403, teacher: 201, otherTeacher: 404, admin: 201 },
    },
    {
      // Only whoever sent it back may undo it (an admin did not: 403).
      covers: ["POST /api/teach/review/[checkInId]/undo"],
      call: async (c) => {
        const f = await makeAssignment(c.w.db, { teacherId: c.people.teacher.id, studentIds: [c.people.student.id] });
        const id = f.students[c.people.student.id];
        const { checkIn } = await import("@/lib/teaching/check-in");
        const { reviewCheckIn } = await import("@/lib/teaching/review");
        const student = { id: c.people.student.id, role: "student" as const };
        const uploadId = await makeUpload(c.w.db, { ownerId: c.people.student.id, assignmentStudentId: id });
        const made = await checkIn(c.w.db, student, {
          assignmentStudentId: id,
          stageIndex: 1,
          uploadId,
          selfRating: 3,
          fromMemory: false,
        });
        await reviewCheckIn(
          c.w.db,
          { id: c.people.teacher.id, role: "teacher" },
          { checkInId: made.checkInId, outcome: "needs_more_time", feedback: "Hold the long notes longer." },
          new Date(),
        );
        return status(c, "teach/review/[checkInId]/undo", "POST", { params: { checkInId: made.checkInId } });
      },
      expect: { visitor: 401, student: 403, teacher: 200, otherTeacher: 404, admin: 403 },
    },
    {
      covers: ["POST /api/admin/enrolments/teacher"],
      call: async (c) =>
        status(c, "admin/enrolments/teacher", "POST", {
          body: { enrolmentIds: [(await enrolled(c)).enrolmentId], teacherId: c.people.teacher.id },
        }),
      expect: { visitor: 401, student: 403, teacher: 403, otherTeacher: 403, admin: 200 },
    },
  ];
}
