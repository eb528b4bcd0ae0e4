// The teacher's assignment routes as the teaching-assign tests call them: their names, a valid body
// for a classroom, a create that must succeed, and a two-stage plan every tune can take.
import { expect } from "vitest";
import { dueIn, teachingWorld, type TeachingWorld } from "./teaching-world";

export const LIST = "teach/assignments";
export const ONE = "teach/assignments/[id]";
export type Refusal = { error: string; fieldErrors?: Record<string, string> };
export type Classroom = Awaited<ReturnType<TeachingWorld["classroom"]>>;

/** The bare tune, then every kind of embellishment at once (the engine's rule: all come back by the last stage). */
export const BARE_THEN_ALL = {
  stages: [
    { name: "Bare tune", adds: [] },
    {
      name: "All",
      adds: [
        "bowing",
        "ornaments",
        "slides",
        "fills",
        "doubleStops",
        "dynamics",
        "articulation",
        "fingerings",
        "marks",
      ],
    },
  ],
};

/** The classroom's tune to all its students, due in a week, with `o` laid over it. */
export const assignBody = (room: Classroom, o: Record<string, unknown> = {}) => ({
  tuneId: room.tuneId,
  studentIds: room.students.map((s) => s.id),
  dueLocal: dueIn(7),
  note: "Mind the rolls.",
  ...o,
});

export async function createAssignment(
  w: TeachingWorld,
  cookie: string,
  room: Classroom,
  o: Record<string, unknown> = {},
) {
  const res = await w.call(LIST, "POST", { cookie, body: assignBody(room, o) });
  expect(res.status).toBe(201);
  return (await res.json()) as { id: string; assignmentStudentIds: string[] };
}

/** A teaching world with a classroom of two students and its teacher's cookie (the caller closes `w`). */
export async function openClassroom(): Promise<{ w: TeachingWorld; room: Classroom; cookie: string }> {
  const w = await teachingWorld();
  const room = await w.classroom(2);
  return { w, room, cookie: await w.cookieFor(room.teacher.id) };
}
