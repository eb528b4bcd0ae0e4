// The teacher tools' rows of the authorization matrix (tests/integration/authorization-matrix.test.ts):
// every route under app/api/teach, called as a visitor, a student, the teacher who owns the tune or
// course, another teacher (404: someone else's work is not found, as for /api/people/[id]) and an admin.
import { readFileSync } from "node:fs";
import type { Db } from "@/db/client";
import { callRoute, type TeachCall } from "./teach-world";

type Who = "visitor" | "student" | "teacher" | "otherTeacher" | "admin";
type Person = { id: string; email: string };
type CallLike = { who: Who; cookie: string | undefined; people: { teacher: Person }; w: { db: Db } };
type RowLike = { covers: string[]; call: (c: CallLike) => Promise<number>; expect: Record<Who, number> };

const WICKER = readFileSync("tests/fixtures/teach/wicker-gate.abc", "utf8"); // an invented reel (this project's own)

const staff = (s: number): Record<Who, number> => ({
  visitor: 401,
  student: 403,
  teacher: s,
  otherTeacher: s,
  admin: s,
});
const owner = (s: number): Record<Who, number> => ({
  visitor: 401,
  student: 403,
  teacher: s,
  otherTeacher: 404,
  admin: s,
});

/** A fresh tune and course of the matrix's teacher: tune → grade → rung, one of each. */
async function fixture(c: CallLike) {
  const { createTune } = await import("@/lib/tunes/save");
  const { createCourse, addGrade, addRung, editableCourse } = await import("@/lib/courses/bench");
  const me = { id: c.people.teacher.id, role: "teacher" as const };
  const saved = await createTune(c.w.db, me.id, { abc: WICKER });
  if (!saved.ok) throw new Error("matrix tune refused");
  const spare = await createTune(c.w.db, me.id, { abc: WICKER.replace("T:Wicker Gate", "T:Wicker Gate (spare)") });
  if (!spare.ok) throw new Error("matrix tune refused");
  const courseId = await createCourse(c.w.db, me, { title: "Matrix course", summary: "" });
  const course = await editableCourse(c.w.db, me, courseId);
  const gradeId = await addGrade(c.w.db, course, "Grade 1");
  const rungId = await addRung(c.w.db, me, course, {
    gradeId,
    tuneId: saved.tuneId,
    requiredStage: 1,
    isTaster: false,
  });
  return { tuneId: saved.tuneId, spareTuneId: spare.tuneId, courseId, gradeId, rungId };
}

const status = (c: CallLike, file: string, method: string, o: Omit<TeachCall, "cookie"> = {}) =>
  callRoute(`teach/${file}`, method, { ...o, cookie: c.cookie }).then((r) => r.status);

export function teachRows(): RowLike[] {
  return [
    { covers: ["GET /api/teach/tunes"], call: (c) => status(c, "tunes", "GET"), expect: staff(200) },
    {
      covers: ["POST /api/teach/tunes"],
      call: (c) => status(c, "tunes", "POST", { body: { abc: WICKER } }),
      expect: staff(201),
    },
    {
      covers: ["GET /api/teach/tunes/[tuneId]"],
      call: async (c) => status(c, "tunes/[tuneId]", "GET", { params: { tuneId: (await fixture(c)).tuneId } }),
      expect: owner(200),
    },
    {
      covers: ["PUT /api/teach/tunes/[tuneId]"],
      call: async (c) =>
        status(c, "tunes/[tuneId]", "PUT", {
          params: { tuneId: (await fixture(c)).tuneId },
          body: { abc: WICKER, acceptedSwaps: ["A3"] },
        }),
      expect: owner(200),
    },
    {
      covers: ["DELETE /api/teach/tunes/[tuneId]"],
      call: async (c) => status(c, "tunes/[tuneId]", "DELETE", { params: { tuneId: (await fixture(c)).spareTuneId } }),
      expect: owner(204),
    },
    {
      covers: ["PUT /api/teach/tunes/[tuneId]/stages/[index]"],
      call: async (c) =>
        status(c, "tunes/[tuneId]/stages/[index]", "PUT", {
          params: { tuneId: (await fixture(c)).tuneId, index: "2" },
          body: { abc: WICKER.replace("!p!", "") },
        }),
      expect: owner(200),
    },
    {
      covers: ["DELETE /api/teach/tunes/[tuneId]/stages/[index]"],
      call: async (c) =>
        status(c, "tunes/[tuneId]/stages/[index]", "DELETE", {
          params: { tuneId: (await fixture(c)).tuneId, index: "2" },
        }),
      expect: owner(200),
    },
    {
      covers: ["POST /api/teach/import"],
      call: (c) =>
        status(c, "import", "POST", {
          query: "?name=matrix.abc",
          raw: WICKER.replace("T:Wicker Gate", `T:Imported by ${c.who}`),
        }),
      expect: staff(200),
    },
    { covers: ["GET /api/teach/courses"], call: (c) => status(c, "courses", "GET"), expect: staff(200) },
    {
      covers: ["POST /api/teach/courses"],
      call: (c) => status(c, "courses", "POST", { body: { title: `Started by ${c.who}` } }),
      expect: staff(201),
    },
    {
      covers: ["GET /api/teach/courses/[courseId]"],
      call: async (c) => status(c, "courses/[courseId]", "GET", { params: { courseId: (await fixture(c)).courseId } }),
      expect: owner(200),
    },
    {
      covers: ["PATCH /api/teach/courses/[courseId]"],
      call: async (c) =>
        status(c, "courses/[courseId]", "PATCH", {
          params: { courseId: (await fixture(c)).courseId },
          body: { published: true },
        }),
      expect: owner(200),
    },
    {
      covers: ["DELETE /api/teach/courses/[courseId]"],
      call: async (c) =>
        status(c, "courses/[courseId]", "DELETE", { params: { courseId: (await fixture(c)).courseId } }),
      expect: owner(204),
    },
    {
      covers: ["POST /api/teach/courses/[courseId]/grades"],
      call: async (c) =>
        status(c, "courses/[courseId]/grades", "POST", {
          params: { courseId: (await fixture(c)).courseId },
          body: { title: "Grade 2" },
        }),
      expect: owner(201),
    },
    {
      covers: ["PATCH /api/teach/courses/[courseId]/grades/[gradeId]"],
      call: async (c) => {
        const f = await fixture(c);
        return status(c, "courses/[courseId]/grades/[gradeId]", "PATCH", {
          params: { courseId: f.courseId, gradeId: f.gradeId },
          body: { title: "First grade" },
        });
      },
      expect: owner(200),
    },
    {
      covers: ["DELETE /api/teach/courses/[courseId]/grades/[gradeId]"],
      call: async (c) => {
        const f = await fixture(c);
        return status(c, "courses/[courseId]/grades/[gradeId]", "DELETE", {
          params: { courseId: f.courseId, gradeId: f.gradeId },
        });
      },
      expect: owner(204),
    },
    {
      covers: ["POST /api/teach/courses/[courseId]/rungs"],
      call: async (c) => {
        const f = await fixture(c);
        return status(c, "courses/[courseId]/rungs", "POST", {
          params: { courseId: f.courseId },
          body: { gradeId: f.gradeId, tuneId: f.spareTuneId, requiredStage: 2 },
        });
      },
      expect: owner(201),
    },
    {
      covers: ["PATCH /api/teach/courses/[courseId]/rungs/[rungId]"],
      call: async (c) => {
        const f = await fixture(c);
        return status(c, "courses/[courseId]/rungs/[rungId]", "PATCH", {
          params: { courseId: f.courseId, rungId: f.rungId },
          body: { isTaster: true },
        });
      },
      expect: owner(200),
    },
    {
      covers: ["DELETE /api/teach/courses/[courseId]/rungs/[rungId]"],
      call: async (c) => {
        const f = await fixture(c);
        return status(c, "courses/[courseId]/rungs/[rungId]", "DELETE", {
          params: { courseId: f.courseId, rungId: f.rungId },
        });
      },
      expect: owner(204),
    },
    {
      covers: ["PUT /api/teach/courses/[courseId]/order"],
      call: async (c) => {
        const f = await fixture(c);
        return status(c, "courses/[courseId]/order", "PUT", {
          params: { courseId: f.courseId },
          body: { grades: [{ id: f.gradeId, rungs: [f.rungId] }] },
        });
      },
      expect: owner(200),
    },
  ];
}
