// Issue 6's learning rows of the authorization matrix (tests/integration/authorization-matrix.test.ts):
// every route under app/api/learn, as a visitor, the student, the student's teacher, another teacher
// and an admin. Only the student reaches their own assignment, check-in and practice entry; anyone
// else who may use the action at all is answered 404 (someone else's record is not found).
// The fixtures are exported for tests/integration/learning-*.test.ts too.
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { analyze } from "@/lib/abc";
import type { Db } from "@/db/client";
import {
  assignments,
  assignmentStudents,
  courses,
  grades,
  plans,
  practiceLogs,
  rungs,
  stageStates,
  subscriptions,
  tunes,
  tuneStages,
  uploads,
} from "@/db/schema";
import { fixtureTune } from "./catalogue-fixture";
import { callRoute } from "./teach-world";

type Who = "visitor" | "student" | "teacher" | "otherTeacher" | "admin";
type Person = { id: string; email: string };
type CallLike = {
  who: Who;
  cookie: string | undefined;
  people: { student: Person; teacher: Person; otherStudent: Person };
  w: { db: Db };
  n: number;
};
type RowLike = { covers: string[]; call: (c: CallLike) => Promise<number>; expect: Record<Who, number> };

/** A tune of a teacher with its stages; `taster` puts it on a taster rung of a published course (open without a membership). */
export async function makeTune(
  db: Db,
  teacherId: string,
  o: { title?: string; taster?: boolean } = {},
): Promise<{ tuneId: string; stageCount: number }> {
  const title = o.title ?? `Learn Fixture ${randomUUID().slice(0, 8)}`;
  const abc = fixtureTune(title, 1);
  const result = analyze(abc);
  if (!result.ok) throw new Error(`fixture tune refused: ${result.problems.map((p) => p.message).join("; ")}`);
  const [tune] = await db
    .insert(tunes)
    .values({ teacherId, title, tuneType: "polka", key: "D", meter: "2/4", abc })
    .returning({ id: tunes.id });
  await db
    .insert(tuneStages)
    .values(
      result.value.stages.map((s) => ({ tuneId: tune.id, index: s.index, name: s.name, kinds: s.kinds, abc: s.abc })),
    );
  if (o.taster !== false) {
    const [course] = await db
      .insert(courses)
      .values({
        teacherId,
        leadTeacherId: teacherId,
        slug: `learn-${randomUUID()}`,
        title: `Course of ${title}`,
        publishedAt: new Date(),
      })
      .returning({ id: courses.id });
    const [grade] = await db
      .insert(grades)
      .values({ courseId: course.id, position: 1, title: "Grade 1" })
      .returning({ id: grades.id });
    await db
      .insert(rungs)
      .values({ gradeId: grade.id, tuneId: tune.id, position: 1, requiredStage: 1, isTaster: true });
  }
  return { tuneId: tune.id, stageCount: result.value.stages.length };
}

export type AssignmentFixture = {
  assignmentId: string;
  tuneId: string;
  stageCount: number;
  students: Record<string, string>;
};

/** An assignment as the teacher's side makes it: one row per student, stage 1 open, the rest locked. */
export async function makeAssignment(
  db: Db,
  o: {
    teacherId: string;
    studentIds: string[];
    tuneId?: string;
    taster?: boolean;
    dueAt?: Date;
    unlockRule?: "teacher_sign_off" | "self_check_in";
    unlockMinutes?: number;
    openedAt?: Date;
  },
): Promise<AssignmentFixture> {
  const tune = o.tuneId
    ? {
        tuneId: o.tuneId,
        stageCount: (await db.select({ i: tuneStages.index }).from(tuneStages).where(eq(tuneStages.tuneId, o.tuneId)))
          .length,
      }
    : await makeTune(db, o.teacherId, { taster: o.taster });
  const [a] = await db
    .insert(assignments)
    .values({
      teacherId: o.teacherId,
      tuneId: tune.tuneId,
      dueAt: o.dueAt ?? new Date(Date.now() + 7 * 86_400_000),
      unlockRule: o.unlockRule ?? "teacher_sign_off",
      unlockMinutes: o.unlockMinutes ?? null,
      note: "Mind the long notes.",
    })
    .returning({ id: assignments.id });
  const students: Record<string, string> = {};
  for (const studentId of o.studentIds) {
    const [as] = await db
      .insert(assignmentStudents)
      .values({ assignmentId: a.id, studentId })
      .returning({ id: assignmentStudents.id });
    students[studentId] = as.id;
    await db.insert(stageStates).values(
      Array.from({ length: tune.stageCount }, (_, i) => ({
        assignmentStudentId: as.id,
        stageIndex: i + 1,
        state: i === 0 ? ("open" as const) : ("locked" as const),
        openedAt: i === 0 ? (o.openedAt ?? new Date()) : null,
      })),
    );
  }
  return { assignmentId: a.id, tuneId: tune.tuneId, stageCount: tune.stageCount, students };
}

/** An upload row as the recordings routes leave it after a finished, checked upload. */
export async function makeUpload(
  db: Db,
  o: { ownerId: string; assignmentStudentId: string; stageIndex?: number; status?: "pending" | "stored" | "rejected" },
): Promise<string> {
  const [u] = await db
    .insert(uploads)
    .values({
      ownerId: o.ownerId,
      storageKey: `recordings/test/${randomUUID()}.wav`,
      contentType: "audio/wav",
      sizeBytes: 44,
      assignmentStudentId: o.assignmentStudentId,
      stageIndex: o.stageIndex ?? 1,
      status: o.status ?? "stored",
    })
    .returning({ id: uploads.id });
  return u.id;
}

/** A membership in good standing (issue 7's gate reads subscriptions): active, period ending in 30 days. */
export async function giveMembership(db: Db, userId: string): Promise<void> {
  const [plan] = await db
    .insert(plans)
    .values({ name: "Test monthly", amount: 1200, currency: "GBP", interval: "month" })
    .returning({ id: plans.id });
  await db.insert(subscriptions).values({
    userId,
    planId: plan.id,
    stripeSubscriptionId: `sub_test_${randomUUID()}`,
    status: "active",
    currentPeriodEnd: new Date(Date.now() + 30 * 86_400_000),
  });
}

export async function makePractice(
  db: Db,
  userId: string,
  v: { practisedOn: string; minutes: number; tuneId?: string | null },
): Promise<string> {
  const [row] = await db
    .insert(practiceLogs)
    .values({ userId, practisedOn: v.practisedOn, minutes: v.minutes, tuneId: v.tuneId ?? null })
    .returning({ id: practiceLogs.id });
  return row.id;
}

const status = (
  c: CallLike,
  file: string,
  method: string,
  o: { params?: Record<string, string>; body?: unknown } = {},
) => callRoute(`learn/${file}`, method, { ...o, cookie: c.cookie }).then((r) => r.status);

/** Only the student themself; teachers lack the student's actions (403); an admin has them but not the record (404). */
const studentOnly = (ok: number): Record<Who, number> => ({
  visitor: 401,
  student: ok,
  teacher: 403,
  otherTeacher: 403,
  admin: 404,
});

async function studentAssignment(c: CallLike): Promise<string> {
  const f = await makeAssignment(c.w.db, { teacherId: c.people.teacher.id, studentIds: [c.people.student.id] });
  return f.students[c.people.student.id];
}

export function learningRows(): RowLike[] {
  return [
    {
      covers: ["GET /api/learn/assignments"],
      call: (c) => status(c, "assignments", "GET"),
      expect: { visitor: 401, student: 200, teacher: 200, otherTeacher: 200, admin: 200 },
    },
    {
      covers: ["GET /api/learn/assignments/[id]"],
      call: async (c) => status(c, "assignments/[id]", "GET", { params: { id: await studentAssignment(c) } }),
      expect: { visitor: 401, student: 200, teacher: 404, otherTeacher: 404, admin: 404 },
    },
    {
      // Another student's assignment: nobody reaches it through the student's API.
      covers: ["GET /api/learn/assignments/[id]"],
      call: async (c) => {
        const f = await makeAssignment(c.w.db, {
          teacherId: c.people.teacher.id,
          studentIds: [c.people.otherStudent.id],
        });
        return status(c, "assignments/[id]", "GET", { params: { id: f.students[c.people.otherStudent.id] } });
      },
      expect: { visitor: 401, student: 404, teacher: 404, otherTeacher: 404, admin: 404 },
    },
    {
      covers: ["POST /api/learn/assignments/[id]/check-ins"],
      call: async (c) => {
        const id = await studentAssignment(c);
        const uploadId = await makeUpload(c.w.db, { ownerId: c.people.student.id, assignmentStudentId: id });
        return status(c, "assignments/[id]/check-ins", "POST", {
          params: { id },
          body: { stageIndex: 1, uploadId, selfRating: 4, fromMemory: false },
        });
      },
      expect: studentOnly(201),
    },
    {
      covers: ["DELETE /api/learn/check-ins/[checkInId]"],
      call: async (c) => {
        const id = await studentAssignment(c);
        const { checkIn } = await import("@/lib/teaching/check-in");
        const uploadId = await makeUpload(c.w.db, { ownerId: c.people.student.id, assignmentStudentId: id });
        const made = await checkIn(
          c.w.db,
          { id: c.people.student.id, role: "student" },
          { assignmentStudentId: id, stageIndex: 1, uploadId, selfRating: 3, fromMemory: true },
        );
        return status(c, "check-ins/[checkInId]", "DELETE", { params: { checkInId: made.checkInId } });
      },
      expect: studentOnly(200),
    },
    {
      covers: ["GET /api/learn/practice"],
      call: (c) => status(c, "practice", "GET"),
      expect: { visitor: 401, student: 200, teacher: 403, otherTeacher: 403, admin: 200 },
    },
    {
      covers: ["POST /api/learn/practice"],
      call: (c) => status(c, "practice", "POST", { body: { minutes: 20, practisedOn: "2026-01-05", note: "Scales" } }),
      expect: { visitor: 401, student: 201, teacher: 403, otherTeacher: 403, admin: 201 },
    },
    {
      covers: ["PATCH /api/learn/practice/[id]"],
      call: async (c) => {
        const id = await makePractice(c.w.db, c.people.student.id, { practisedOn: "2026-01-04", minutes: 15 });
        return status(c, "practice/[id]", "PATCH", { params: { id }, body: { minutes: 25 } });
      },
      expect: studentOnly(200),
    },
    {
      covers: ["DELETE /api/learn/practice/[id]"],
      call: async (c) => {
        const id = await makePractice(c.w.db, c.people.student.id, { practisedOn: "2026-01-04", minutes: 15 });
        return status(c, "practice/[id]", "DELETE", { params: { id } });
      },
      expect: studentOnly(204),
    },
  ];
}
