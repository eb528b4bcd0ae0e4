// Calling the catalogue's route handlers as a browser would (same origin, JSON body), and the
// rows they add to the authorization matrix (tests/integration/authorization-matrix.test.ts).
import type { Db } from "@/db/client";
import { marginNotes } from "@/db/schema";
import { TEST_APP_URL } from "./auth-world";
import { makeCatalogueFixture, type CatalogueFixture } from "./catalogue-fixture";
import { routeModule } from "./route-module";

/** Calls the method handler serving /api/<file> (helpers/route-module.ts); `file` keeps its [brackets], params fill them. */
export async function callRoute(
  file: string,
  method: "GET" | "POST" | "PATCH" | "DELETE",
  o: { cookie?: string; params?: Record<string, string>; body?: unknown; ip?: string } = {},
): Promise<Response> {
  const handler = (await routeModule(file))[method];
  if (!handler) throw new Error(`${method} ${file} does not exist`);
  const headers = new Headers({ origin: TEST_APP_URL, "x-forwarded-for": o.ip ?? "192.0.2.77" });
  if (o.cookie) headers.set("cookie", o.cookie);
  if (o.body !== undefined) headers.set("content-type", "application/json");
  const url = `${TEST_APP_URL}/api/${file.replace(/\[(\w+)\]/g, (_, k: string) => o.params?.[k] ?? k)}`;
  const req = new Request(url, { method, headers, body: o.body === undefined ? undefined : JSON.stringify(o.body) });
  return handler(req, { params: Promise.resolve(o.params ?? {}) });
}

type Who = "visitor" | "student" | "teacher" | "otherTeacher" | "admin";
type Person = { id: string; email: string };
/** What the matrix passes each row (only the parts these rows use). */
type CallLike = {
  who: Who;
  cookie: string | undefined;
  n: number;
  people: { student: Person; teacher: Person; otherTeacher: Person; admin: Person; otherStudent: Person };
  w: { db: Db };
};
type RowLike = { covers: string[]; call: (c: CallLike) => Promise<number>; expect: Record<Who, number> };

let made: Promise<CatalogueFixture> | undefined;
/** One fixture per matrix run: the teacher's course with the student enrolled. */
const fx = (c: CallLike) => (made ??= makeCatalogueFixture(c.w.db, c.people, " (matrix)"));

const all = (s: number): Record<Who, number> => ({ visitor: s, student: s, teacher: s, otherTeacher: s, admin: s });
const signedIn = (s: number): Record<Who, number> => ({ ...all(s), visitor: 401 });
const status = (
  file: string,
  method: "GET" | "POST" | "PATCH" | "DELETE",
  c: CallLike,
  params: Record<string, string>,
  body?: unknown,
) => callRoute(file, method, { cookie: c.cookie, params, body, ip: `192.0.2.${c.n % 250}` }).then((r) => r.status);

/** A course's teacher and admins see everything; the enrolled student follows the ladder; the rest get the taster. */
export function catalogueRows(): RowLike[] {
  return [
    { covers: ["GET /api/courses"], call: (c) => status("courses", "GET", c, {}), expect: all(200) },
    { covers: ["GET /api/courses/mine"], call: (c) => status("courses/mine", "GET", c, {}), expect: signedIn(200) },
    {
      covers: ["GET /api/courses/[courseId]"],
      call: async (c) => status("courses/[courseId]", "GET", c, { courseId: (await fx(c)).courseId }),
      expect: all(200),
    },
    {
      // An unpublished course exists only for its teacher and admins.
      covers: ["GET /api/courses/[courseId]"],
      call: async (c) => status("courses/[courseId]", "GET", c, { courseId: (await fx(c)).draftCourseId }),
      expect: { visitor: 404, student: 404, teacher: 200, otherTeacher: 404, admin: 200 },
    },
    {
      covers: ["GET /api/courses/[courseId]/ladder"],
      call: async (c) => status("courses/[courseId]/ladder", "GET", c, { courseId: (await fx(c)).courseId }),
      expect: signedIn(200),
    },
    {
      covers: ["GET /api/tunes/[tuneId]"],
      call: async (c) => status("tunes/[tuneId]", "GET", c, { tuneId: (await fx(c)).tunes.A }),
      expect: all(200),
    },
    {
      // Tune C sits on a rung the student has not opened yet.
      covers: ["GET /api/tunes/[tuneId]"],
      call: async (c) => status("tunes/[tuneId]", "GET", c, { tuneId: (await fx(c)).tunes.C }),
      expect: { visitor: 403, student: 403, teacher: 200, otherTeacher: 403, admin: 200 },
    },
    {
      covers: ["GET /api/tunes/[tuneId]/stages/[index]"],
      call: async (c) =>
        status("tunes/[tuneId]/stages/[index]", "GET", c, { tuneId: (await fx(c)).tunes.B, index: "1" }),
      expect: { visitor: 403, student: 200, teacher: 200, otherTeacher: 403, admin: 200 },
    },
    {
      // Stage 2 of an open rung waits until stage 1 is reached (the student is at 0 on B).
      covers: ["GET /api/tunes/[tuneId]/stages/[index]"],
      call: async (c) =>
        status("tunes/[tuneId]/stages/[index]", "GET", c, { tuneId: (await fx(c)).tunes.B, index: "2" }),
      expect: { visitor: 403, student: 403, teacher: 200, otherTeacher: 403, admin: 200 },
    },
    {
      covers: ["GET /api/tunes/[tuneId]/notes"],
      call: async (c) => status("tunes/[tuneId]/notes", "GET", c, { tuneId: (await fx(c)).tunes.A }),
      expect: signedIn(200),
    },
    {
      covers: ["POST /api/tunes/[tuneId]/notes"],
      call: async (c) =>
        status("tunes/[tuneId]/notes", "POST", c, { tuneId: (await fx(c)).tunes.A }, { bar: 1, body: `note ${c.n}` }),
      expect: signedIn(201),
    },
    {
      // The student's own note: only its writer can change it; for everyone else it does not exist.
      covers: ["PATCH /api/tunes/[tuneId]/notes/[noteId]"],
      call: async (c) => {
        const f = await fx(c);
        return status(
          "tunes/[tuneId]/notes/[noteId]",
          "PATCH",
          c,
          { tuneId: f.tunes.A, noteId: f.studentNoteId },
          { body: `changed ${c.n}` },
        );
      },
      expect: { visitor: 401, student: 200, teacher: 404, otherTeacher: 404, admin: 404 },
    },
    {
      covers: ["DELETE /api/tunes/[tuneId]/notes/[noteId]"],
      call: async (c) => {
        const f = await fx(c);
        const [note] = await c.w.db
          .insert(marginNotes)
          .values({ userId: c.people.student.id, tuneId: f.tunes.A, bar: 3, body: "to delete" })
          .returning({ id: marginNotes.id });
        return status("tunes/[tuneId]/notes/[noteId]", "DELETE", c, { tuneId: f.tunes.A, noteId: note.id });
      },
      expect: { visitor: 401, student: 204, teacher: 404, otherTeacher: 404, admin: 404 },
    },
  ];
}
