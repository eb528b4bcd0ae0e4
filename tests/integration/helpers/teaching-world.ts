// Fixtures for issue 6's teacher-side tests (others may import it read-only): a teacher's tune, a
// roster, an assignment made through lib/teaching/assignments.ts, a stored recording and a check-in
// through the state machine. Built on teachWorld (the real routes through their guard).
import { readFileSync } from "node:fs";
import { and, asc, eq } from "drizzle-orm";
import { teachWorld } from "./teach-world";
import { assignmentStudents, checkIns, stageStates, uploads } from "@/db/schema";
import { notFound } from "@/lib/auth/errors";

export const WICKER = readFileSync("tests/fixtures/teach/wicker-gate.abc", "utf8"); // an invented reel (this project's own), 4 stages

/** A local date+time `days` ahead of now, as the form's datetime-local field writes it (UTC wall clock). */
export function dueIn(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 16);
}

export async function teachingWorld() {
  const w = await teachWorld();
  const { addToRoster } = await import("@/db/queries/auth");
  const { createTune } = await import("@/lib/tunes/save");
  const { createAssignment } = await import("@/lib/teaching/assignments");
  const { applyTransition } = await import("@/lib/teaching/transitions");
  let n = 0;

  async function tuneOf(teacherId: string, title = "Wicker Gate"): Promise<string> {
    n += 1;
    const saved = await createTune(w.db, teacherId, {
      abc: WICKER.replace("T:Wicker Gate", `T:${title} ${n}`),
    });
    if (!saved.ok) throw new Error("fixture tune refused");
    return saved.tuneId;
  }

  /** A teacher with `count` students on their roster (everyone in UTC, so due dates read plainly). */
  async function classroom(count = 2) {
    const teacher = await w.person("teacher");
    await w.setUser(teacher.id, { timeZone: "UTC" });
    const students = [];
    for (let i = 0; i < count; i++) {
      const s = await w.person("student");
      await w.setUser(s.id, { timeZone: "UTC" });
      await addToRoster(w.db, teacher.id, s.id);
      students.push(s);
    }
    return { teacher, students, tuneId: await tuneOf(teacher.id) };
  }

  async function assign(
    teacher: { id: string },
    o: {
      role?: "teacher" | "admin";
      tuneId: string;
      studentIds: string[];
      dueLocal?: string;
      unlockRule?: "teacher_sign_off" | "self_check_in";
      unlockMinutes?: number | null;
    },
  ) {
    return createAssignment(
      w.db,
      { id: teacher.id, role: o.role ?? "teacher" },
      {
        tuneId: o.tuneId,
        studentIds: o.studentIds,
        dueLocal: o.dueLocal ?? dueIn(7),
        stagePlan: null,
        unlockRule: o.unlockRule ?? "teacher_sign_off",
        unlockMinutes: o.unlockMinutes ?? null,
        note: "Slow first.",
      },
      new Date(),
    );
  }

  /** The states of one student's stages, in order. */
  async function states(assignmentStudentId: string): Promise<string[]> {
    const rows = await w.db
      .select({ state: stageStates.state })
      .from(stageStates)
      .where(eq(stageStates.assignmentStudentId, assignmentStudentId))
      .orderBy(asc(stageStates.stageIndex));
    return rows.map((r) => r.state);
  }

  async function stageId(assignmentStudentId: string, index: number): Promise<string> {
    const [row] = await w.db
      .select({ id: stageStates.id })
      .from(stageStates)
      .where(and(eq(stageStates.assignmentStudentId, assignmentStudentId), eq(stageStates.stageIndex, index)));
    if (!row) throw notFound(`No stage ${index} on this assignment.`);
    return row.id;
  }

  /** A recording as the upload flow leaves it: stored, the student's own, for that assignment. */
  async function storedUpload(studentId: string, assignmentStudentId: string, stageIndex = 1): Promise<string> {
    n += 1;
    const [row] = await w.db
      .insert(uploads)
      .values({
        ownerId: studentId,
        storageKey: `fixture/${assignmentStudentId}/${n}.ogg`,
        contentType: "audio/ogg",
        sizeBytes: 1000,
        assignmentStudentId,
        stageIndex,
        status: "stored",
      })
      .returning({ id: uploads.id });
    return row.id;
  }

  /** The student checks in on stage `index` with a fresh stored recording; returns the check-in id. */
  async function checkIn(assignmentStudentId: string, index = 1): Promise<string> {
    const [as] = await w.db
      .select({ studentId: assignmentStudents.studentId })
      .from(assignmentStudents)
      .where(eq(assignmentStudents.id, assignmentStudentId));
    const uploadId = await storedUpload(as.studentId, assignmentStudentId, index);
    const r = await applyTransition(w.db, {
      stageStateId: await stageId(assignmentStudentId, index),
      transition: "checkIn",
      actor: { id: as.studentId, role: "student" },
      checkInInput: { uploadId, selfRating: 4, fromMemory: true },
      now: new Date(),
    });
    return r.checkInId;
  }

  async function checkInRow(id: string) {
    return (await w.db.select().from(checkIns).where(eq(checkIns.id, id)))[0];
  }

  return {
    ...w,
    tuneOf,
    classroom,
    assign,
    states,
    stageId,
    storedUpload,
    checkIn,
    checkInRow,
  };
}

export type TeachingWorld = Awaited<ReturnType<typeof teachingWorld>>;
