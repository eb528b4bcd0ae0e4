// Issue 6's recordings and calendar rows of the authorization matrix; spread into ROWS in
// tests/integration/authorization-matrix.test.ts. The matrix's teacher has its student on the roster
// and gives the assignments here; the other teacher teaches someone else. Someone else's record is
// "not found" (404); a role without the action is 403; a visitor 401.
import type { Db } from "@/db/client";
import { callRoute } from "./teach-world";
import { makeAssignment, putTicket, wavBytes } from "./recordings-world";

type Who = "visitor" | "student" | "teacher" | "otherTeacher" | "admin";
type Person = { id: string; email: string };
type CallLike = {
  who: Who;
  cookie: string | undefined;
  people: { student: Person; teacher: Person; otherStudent: Person; otherTeacher: Person };
  w: { db: Db };
};
type RowLike = { covers: string[]; call: (c: CallLike) => Promise<number>; expect: Record<Who, number> };

const all = (s: number): Record<Who, number> => ({ visitor: s, student: s, teacher: s, otherTeacher: s, admin: s });
const signedIn = (s: number): Record<Who, number> => ({
  visitor: 401,
  student: s,
  teacher: s,
  otherTeacher: s,
  admin: s,
});

const week = () => new Date(Date.now() + 7 * 86_400_000);

/** The matrix student's assignment from the matrix teacher (fresh per call). */
async function studentsAssignment(c: CallLike): Promise<string> {
  const a = await makeAssignment(c.w.db, {
    teacherId: c.people.teacher.id,
    studentIds: [c.people.student.id],
    dueAt: week(),
  });
  return a.students[c.people.student.id];
}

/** A recording the matrix student uploaded: "pending" (asked for, nothing sent) or "stored". */
async function studentsUpload(c: CallLike, stored: boolean): Promise<string> {
  const { startUpload, completeUpload } = await import("@/lib/storage/recordings");
  const me = {
    id: c.people.student.id,
    email: c.people.student.email,
    name: "Matrix student",
    role: "student" as const,
  };
  const body = wavBytes(800);
  const ticket = await startUpload(c.w.db, me, {
    assignmentStudentId: await studentsAssignment(c),
    stageIndex: 1,
    contentType: "audio/wav",
    sizeBytes: body.length,
  });
  await putTicket(ticket, body);
  if (stored) await completeUpload(c.w.db, me, ticket.uploadId);
  return ticket.uploadId;
}

const upload = (assignmentStudentId: string) => ({
  assignmentStudentId,
  stageIndex: 1,
  contentType: "audio/wav",
  sizeBytes: 1600,
});

export function recordingsRows(): RowLike[] {
  return [
    {
      // Only the student of the assignment; an admin has the action but it is not their assignment.
      covers: ["POST /api/recordings"],
      call: async (c) =>
        (await callRoute("recordings", "POST", { cookie: c.cookie, body: upload(await studentsAssignment(c)) })).status,
      expect: { visitor: 401, student: 201, teacher: 403, otherTeacher: 403, admin: 404 },
    },
    {
      // Another student's assignment is not found for the matrix student.
      covers: ["POST /api/recordings"],
      call: async (c) => {
        const a = await makeAssignment(c.w.db, {
          teacherId: c.people.otherTeacher.id,
          studentIds: [c.people.otherStudent.id],
          dueAt: week(),
        });
        return (
          await callRoute("recordings", "POST", {
            cookie: c.cookie,
            body: upload(a.students[c.people.otherStudent.id]),
          })
        ).status;
      },
      expect: { visitor: 401, student: 404, teacher: 403, otherTeacher: 403, admin: 404 },
    },
    {
      covers: ["POST /api/recordings/[uploadId]/complete"],
      call: async (c) =>
        (
          await callRoute("recordings/[uploadId]/complete", "POST", {
            cookie: c.cookie,
            params: { uploadId: await studentsUpload(c, false) },
          })
        ).status,
      expect: { visitor: 401, student: 200, teacher: 403, otherTeacher: 403, admin: 404 },
    },
    {
      // The recording's student, the assignment's teacher and an admin; another teacher: not found.
      covers: ["GET /api/recordings/[uploadId]/playback"],
      call: async (c) =>
        (
          await callRoute("recordings/[uploadId]/playback", "GET", {
            cookie: c.cookie,
            params: { uploadId: await studentsUpload(c, true) },
          })
        ).status,
      expect: { visitor: 401, student: 200, teacher: 200, otherTeacher: 404, admin: 200 },
    },
    {
      covers: ["POST /api/calendar"],
      call: async (c) => (await callRoute("calendar", "POST", { cookie: c.cookie, body: {} })).status,
      expect: signedIn(200),
    },
    {
      covers: ["DELETE /api/calendar"],
      call: async (c) => (await callRoute("calendar", "DELETE", { cookie: c.cookie })).status,
      expect: signedIn(204),
    },
    {
      // Public by token (a calendar program has no session): anyone holding a live address gets the feed.
      covers: ["GET /api/calendar/[token]"],
      call: async (c) => {
        const { rotateCalendarToken } = await import("@/lib/calendar/tokens");
        const token = await rotateCalendarToken(c.w.db, c.people.student.id);
        return (await callRoute("calendar/[token]", "GET", { cookie: c.cookie, params: { token } })).status;
      },
      expect: all(200),
    },
    {
      // A revoked address answers 404 to everyone, its former owner included.
      covers: ["GET /api/calendar/[token]"],
      call: async (c) => {
        const { revokeCalendarToken, rotateCalendarToken } = await import("@/lib/calendar/tokens");
        const token = await rotateCalendarToken(c.w.db, c.people.student.id);
        await revokeCalendarToken(c.w.db, c.people.student.id);
        return (await callRoute("calendar/[token]", "GET", { cookie: c.cookie, params: { token } })).status;
      },
      expect: all(404),
    },
  ];
}
