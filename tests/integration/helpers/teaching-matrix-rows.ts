// Issue 6's teacher-side rows of the authorization matrix (tests/integration/authorization-matrix.test.ts):
// every route under app/api/teach/assignments, /review and /roster, as a visitor, a student, the
// teacher who made the assignment, another teacher (404: someone else's assignment is not found;
// 422 on create: neither the tune nor the student is theirs) and an admin.
import { readFileSync } from "node:fs";
import type { Db } from "@/db/client";
import { callRoute, type TeachCall } from "./teach-world";

type Who = "visitor" | "student" | "teacher" | "otherTeacher" | "admin";
type Person = { id: string; email: string };
type CallLike = {
  who: Who;
  cookie: string | undefined;
  people: { teacher: Person; student: Person };
  w: { db: Db };
  n: number;
};
type RowLike = {
  covers: string[];
  call: (c: CallLike) => Promise<number>;
  expect: Record<Who, number>;
};

const WICKER = readFileSync("tests/fixtures/teach/wicker-gate.abc", "utf8"); // an invented reel (this project's own)
const DUE = () => new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 16);

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

async function tune(c: CallLike): Promise<string> {
  const { createTune } = await import("@/lib/tunes/save");
  const saved = await createTune(c.w.db, c.people.teacher.id, {
    abc: WICKER.replace("T:Wicker Gate", `T:Matrix Assign ${c.n}`),
  });
  if (!saved.ok) throw new Error("matrix tune refused");
  return saved.tuneId;
}

/** A fresh assignment of the matrix teacher to the matrix student; with a waiting check-in on stage 1 when asked. */
async function assignment(c: CallLike, withCheckIn = false): Promise<{ id: string; checkInId: string | null }> {
  const { createAssignment } = await import("@/lib/teaching/assignments");
  const teacher = { id: c.people.teacher.id, role: "teacher" as const };
  const input = {
    tuneId: await tune(c),
    studentIds: [c.people.student.id],
    dueLocal: DUE(),
    stagePlan: null,
    unlockRule: "teacher_sign_off" as const,
    unlockMinutes: null,
    note: "",
  };
  const made = await createAssignment(c.w.db, teacher, input, new Date());
  if (!withCheckIn) return { id: made.id, checkInId: null };
  const { and, eq } = await import("drizzle-orm");
  const { stageStates, uploads } = await import("@/db/schema");
  const asId = made.assignmentStudentIds[0];
  const [stage] = await c.w.db
    .select({ id: stageStates.id })
    .from(stageStates)
    .where(and(eq(stageStates.assignmentStudentId, asId), eq(stageStates.stageIndex, 1)));
  const [upload] = await c.w.db
    .insert(uploads)
    .values({
      ownerId: c.people.student.id,
      storageKey: `matrix/${asId}.ogg`,
      contentType: "audio/ogg",
      sizeBytes: 1000,
      assignmentStudentId: asId,
      stageIndex: 1,
      status: "stored",
    })
    .returning({ id: uploads.id });
  const { applyTransition } = await import("@/lib/teaching/transitions");
  const r = await applyTransition(c.w.db, {
    stageStateId: stage.id,
    transition: "checkIn",
    actor: { id: c.people.student.id, role: "student" },
    checkInInput: { uploadId: upload.id, selfRating: 3, fromMemory: false },
    now: new Date(),
  });
  return { id: made.id, checkInId: r.checkInId };
}

const status = (c: CallLike, file: string, method: string, o: Omit<TeachCall, "cookie"> = {}) =>
  callRoute(`teach/${file}`, method, { ...o, cookie: c.cookie }).then((r) => r.status);

export function teachingRows(): RowLike[] {
  return [
    {
      covers: ["GET /api/teach/assignments"],
      call: (c) => status(c, "assignments", "GET"),
      expect: staff(200),
    },
    {
      // Another teacher may assign, but neither this tune nor this student is theirs: 422 naming the fields.
      covers: ["POST /api/teach/assignments"],
      call: async (c) =>
        status(c, "assignments", "POST", {
          body: {
            tuneId: await tune(c),
            studentIds: [c.people.student.id],
            dueLocal: DUE(),
            note: "",
          },
        }),
      expect: {
        visitor: 401,
        student: 403,
        teacher: 201,
        otherTeacher: 422,
        admin: 201,
      },
    },
    {
      covers: ["GET /api/teach/assignments/[id]"],
      call: async (c) =>
        status(c, "assignments/[id]", "GET", {
          params: { id: (await assignment(c)).id },
        }),
      expect: owner(200),
    },
    {
      covers: ["PATCH /api/teach/assignments/[id]"],
      call: async (c) =>
        status(c, "assignments/[id]", "PATCH", {
          params: { id: (await assignment(c)).id },
          body: { note: `Edited by ${c.who}` },
        }),
      expect: owner(200),
    },
    {
      covers: ["DELETE /api/teach/assignments/[id]"],
      call: async (c) =>
        status(c, "assignments/[id]", "DELETE", {
          params: { id: (await assignment(c)).id },
        }),
      expect: owner(200),
    },
    {
      covers: ["GET /api/teach/review"],
      call: (c) => status(c, "review", "GET"),
      expect: staff(200),
    },
    {
      covers: ["POST /api/teach/review/[checkInId]"],
      call: async (c) =>
        status(c, "review/[checkInId]", "POST", {
          params: {
            checkInId: (await assignment(c, true)).checkInId as string,
          },
          body: { outcome: "signed_off", feedback: "Good." },
        }),
      expect: owner(200),
    },
    {
      covers: ["GET /api/teach/roster"],
      call: (c) => status(c, "roster", "GET"),
      expect: staff(200),
    },
  ];
}
