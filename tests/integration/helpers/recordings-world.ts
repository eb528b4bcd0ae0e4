// Fixtures for the recordings, reminders and calendar tests, written straight into the database with
// drizzle (an assignment is a row in assignments, one in assignment_students per student and one
// stage_states row per stage), so these tests do not depend on the assignment routes.
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { assignments, assignmentStudents, stageStates, tunes } from "@/db/schema";

/**
 * S3_* for the storage code. `npm test` exports them (its stand-in); run alone, the file starts its
 * own stand-in on a free port. Must run before anything calls env(), which reads them once.
 */
export async function ensureS3(): Promise<{ close: () => Promise<void> }> {
  if (process.env.S3_ENDPOINT) return { close: async () => {} };
  const { startS3Fake } = await import("@/scripts/fakes/s3");
  const bucket = "rosinwood-recordings";
  const fake = await startS3Fake({ port: 0, directory: mkdtempSync(path.join(tmpdir(), "rec-s3-")), bucket });
  Object.assign(process.env, {
    S3_ENDPOINT: fake.url,
    S3_REGION: "us-east-1",
    S3_BUCKET: bucket,
    S3_ACCESS_KEY_ID: "S3RVER",
    S3_SECRET_ACCESS_KEY: "S3RVER",
    S3_FORCE_PATH_STYLE: "true",
  });
  return { close: async () => void (await fake.close()) };
}

let tunesMade = 0;

/** A tune of the teacher's (its stages are not needed here: stage_states carry the states). */
export async function makeTune(db: Db, teacherId: string, title?: string): Promise<{ id: string; title: string }> {
  tunesMade += 1;
  const name = title ?? `Fixture Reel ${tunesMade}`;
  const [row] = await db
    .insert(tunes)
    .values({
      teacherId,
      title: name,
      tuneType: "reel",
      key: "D",
      meter: "4/4",
      abc: `X:1\nT:${name}\nM:4/4\nL:1/8\nK:D\n|:DFAd fdAF:|\n`,
    })
    .returning({ id: tunes.id, title: tunes.title });
  return row;
}

export type AssignmentFixture = {
  assignmentId: string;
  tuneId: string;
  tuneTitle: string;
  students: Record<string, string>;
};

/** An assignment of a fresh tune to students: stage 1 open, the rest locked. `students` maps studentId → assignmentStudentId. */
export async function makeAssignment(
  db: Db,
  o: {
    teacherId: string;
    studentIds: string[];
    dueAt: Date;
    stages?: number;
    status?: "active" | "withdrawn";
    title?: string;
  },
): Promise<AssignmentFixture> {
  const tune = await makeTune(db, o.teacherId, o.title);
  const [a] = await db
    .insert(assignments)
    .values({ teacherId: o.teacherId, tuneId: tune.id, dueAt: o.dueAt, status: o.status ?? "active" })
    .returning({ id: assignments.id });
  const students: Record<string, string> = {};
  for (const studentId of o.studentIds) {
    const [as] = await db
      .insert(assignmentStudents)
      .values({ assignmentId: a.id, studentId })
      .returning({ id: assignmentStudents.id });
    students[studentId] = as.id;
    const count = o.stages ?? 3;
    await db.insert(stageStates).values(
      Array.from({ length: count }, (_, i) => ({
        assignmentStudentId: as.id,
        stageIndex: i + 1,
        state: i === 0 ? ("open" as const) : ("locked" as const),
        openedAt: i === 0 ? new Date() : null,
      })),
    );
  }
  return { assignmentId: a.id, tuneId: tune.id, tuneTitle: tune.title, students };
}

/** Every stage of one student's copy signed off (what a finished assignment looks like). */
export async function signOffAll(db: Db, assignmentStudentId: string): Promise<void> {
  await db
    .update(stageStates)
    .set({ state: "signed_off", signedOffAt: new Date() })
    .where(eq(stageStates.assignmentStudentId, assignmentStudentId));
}

/**
 * A valid PCM WAV file written here: the RIFF/WAVE header (44 bytes: "RIFF", size, "WAVE", a "fmt "
 * chunk of 16 bytes, a "data" chunk) and `samples` of 16-bit mono silence at 8 kHz — the canonical
 * layout (Microsoft/IBM RIFF WAVE format, 1991).
 */
export function wavBytes(samples = 8000): Uint8Array<ArrayBuffer> {
  const dataBytes = samples * 2;
  const buf = Buffer.alloc(44 + dataBytes);
  buf.write("RIFF", 0, "ascii");
  buf.writeUInt32LE(36 + dataBytes, 4);
  buf.write("WAVE", 8, "ascii");
  buf.write("fmt ", 12, "ascii");
  buf.writeUInt32LE(16, 16); // fmt chunk size
  buf.writeUInt16LE(1, 20); // PCM
  buf.writeUInt16LE(1, 22); // mono
  buf.writeUInt32LE(8000, 24); // sample rate
  buf.writeUInt32LE(16000, 28); // byte rate
  buf.writeUInt16LE(2, 32); // block align
  buf.writeUInt16LE(16, 34); // bits per sample
  buf.write("data", 36, "ascii");
  buf.writeUInt32LE(dataBytes, 40);
  return new Uint8Array(buf);
}

/** A PNG's signature and IHDR start: recognisably an image whatever type it is uploaded under (PNG spec §5.2). */
export function pngBytes(): Uint8Array<ArrayBuffer> {
  const b = Buffer.alloc(64);
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]).copy(b, 0);
  return new Uint8Array(b);
}

/** The browser's part: PUT the bytes to the presigned address with the headers it was issued with. */
export async function putTicket(
  ticket: { url: string; headers: Record<string, string> },
  body: Uint8Array<ArrayBuffer>,
): Promise<Response> {
  return fetch(ticket.url, { method: "PUT", headers: ticket.headers, body });
}
