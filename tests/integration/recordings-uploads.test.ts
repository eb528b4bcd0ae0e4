// Check-in recordings end to end against the S3 stand-in: presigned upload only for one's own open
// stage, audio recognised by content at "complete", the 25 MB limit on the declared and the actual
// size, and playback addresses only for the student, the assignment's teacher and an admin.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { uploads } from "@/db/schema";
import {
  ensureS3,
  makeAssignment,
  pngBytes,
  putTicket,
  wavBytes,
  type AssignmentFixture,
} from "./helpers/recordings-world";
import { callRoute, teachWorld } from "./helpers/teach-world";
import type { AuthWorld } from "./helpers/auth-world";

type Ticket = { uploadId: string; url: string; method: string; headers: Record<string, string> };
type Person = { id: string; email: string };

let s3: { close: () => Promise<void> };
let w: AuthWorld;
let student: Person, otherStudent: Person, teacher: Person, otherTeacher: Person, admin: Person;
let mine: AssignmentFixture, theirs: AssignmentFixture, withdrawn: AssignmentFixture;
const cookie: Record<string, string> = {};
const MB25 = 25 * 1024 * 1024;

beforeAll(async () => {
  s3 = await ensureS3();
  w = await teachWorld();
  [student, otherStudent, teacher, otherTeacher, admin] = [
    await w.person("student"),
    await w.person("student"),
    await w.person("teacher"),
    await w.person("teacher"),
    await w.person("admin"),
  ];
  for (const p of [student, otherStudent, teacher, otherTeacher, admin]) cookie[p.id] = await w.cookieFor(p.id);
  const dueAt = new Date(Date.now() + 7 * 86_400_000);
  mine = await makeAssignment(w.db, { teacherId: teacher.id, studentIds: [student.id], dueAt });
  theirs = await makeAssignment(w.db, { teacherId: otherTeacher.id, studentIds: [otherStudent.id], dueAt });
  withdrawn = await makeAssignment(w.db, {
    teacherId: teacher.id,
    studentIds: [student.id],
    dueAt,
    status: "withdrawn",
  });
});
afterAll(async () => {
  await w?.close();
  await s3?.close();
});

const ask = (who: Person, body: Record<string, unknown>) =>
  callRoute("recordings", "POST", { cookie: cookie[who.id], body });
const complete = (who: Person, uploadId: string) =>
  callRoute("recordings/[uploadId]/complete", "POST", { cookie: cookie[who.id], params: { uploadId } });
const playback = (who: Person, uploadId: string) =>
  callRoute("recordings/[uploadId]/playback", "GET", { cookie: cookie[who.id], params: { uploadId } });

function request(
  a: AssignmentFixture,
  who: Person,
  o: { contentType?: string; sizeBytes?: number; stageIndex?: number } = {},
) {
  return {
    assignmentStudentId: a.students[who.id] ?? Object.values(a.students)[0],
    stageIndex: o.stageIndex ?? 1,
    contentType: o.contentType ?? "audio/wav",
    sizeBytes: o.sizeBytes ?? 16_044,
  };
}

/** Ask, upload the bytes, complete: the complete answer. */
async function upload(bytes: Uint8Array<ArrayBuffer>, contentType = "audio/wav", declared = bytes.length) {
  const res = await ask(student, request(mine, student, { contentType, sizeBytes: declared }));
  expect(res.status).toBe(201);
  const ticket = (await res.json()) as Ticket;
  expect((await putTicket(ticket, bytes)).status).toBe(200);
  return { ticket, done: await complete(student, ticket.uploadId) };
}

const rowOf = async (id: string) => (await w.db.select().from(uploads).where(eq(uploads.id, id)))[0];
const objectExists = async (id: string) => {
  const { headObject } = await import("@/lib/storage/s3");
  return (await headObject((await rowOf(id)).storageKey)) !== null;
};

describe("asking for an upload address", () => {
  it("refuses another student's assignment as not found (404), and creates nothing", async () => {
    const res = await ask(student, request(theirs, otherStudent));
    expect(res.status).toBe(404);
    expect(await w.db.select().from(uploads).where(eq(uploads.ownerId, student.id))).toHaveLength(0);
  });

  it("refuses a declared size over 25 MB (25·1024·1024 bytes) with 422 naming sizeBytes", async () => {
    const res = await ask(student, request(mine, student, { sizeBytes: MB25 + 1 }));
    expect(res.status).toBe(422);
    expect(((await res.json()) as { fieldErrors: Record<string, string> }).fieldErrors.sizeBytes).toMatch(/25 MB/);
    expect((await ask(student, request(mine, student, { sizeBytes: MB25 }))).status).toBe(201); // the limit itself is allowed
  });

  it("refuses a declared type that is not audio with 422 naming contentType", async () => {
    const res = await ask(student, request(mine, student, { contentType: "image/png" }));
    expect(res.status).toBe(422);
    expect(((await res.json()) as { fieldErrors: Record<string, string> }).fieldErrors.contentType).toMatch(/audio/);
  });

  it("refuses a locked stage, a stage that does not exist and a withdrawn assignment", async () => {
    const locked = await ask(student, request(mine, student, { stageIndex: 2 }));
    expect(locked.status).toBe(422);
    expect(((await locked.json()) as { fieldErrors: Record<string, string> }).fieldErrors.stageIndex).toBe(
      "is not open",
    );
    expect((await ask(student, request(mine, student, { stageIndex: 9 }))).status).toBe(422);
    expect((await ask(student, request(withdrawn, student))).status).toBe(422);
  });

  it("issues a PUT address that lives 5 minutes and signs Content-Type and Content-Length", async () => {
    const ticket = (await (await ask(student, request(mine, student))).json()) as Ticket;
    const url = new URL(ticket.url);
    // AWS Signature Version 4, query parameters of a presigned request (AWS S3 API reference: Authenticating Requests, query string).
    expect(url.searchParams.get("X-Amz-Expires")).toBe("300");
    expect(url.searchParams.get("X-Amz-SignedHeaders")?.split(";")).toEqual(
      expect.arrayContaining(["content-type", "content-length"]),
    );
    // The upload's own key: the recording that is played back is a checked copy under another one.
    expect(url.pathname).toBe(`/rosinwood-recordings/incoming/${student.id}/${ticket.uploadId}`);
    expect(ticket).toMatchObject({ method: "PUT", headers: { "Content-Type": "audio/wav" } });
    expect((await rowOf(ticket.uploadId)).status).toBe("pending");
  });
});

describe("completing an upload", () => {
  it("stores a real WAV, typed by its content", async () => {
    const { ticket, done } = await upload(wavBytes(), "audio/x-wav");
    expect(done.status).toBe(200);
    expect(await done.json()).toMatchObject({
      uploadId: ticket.uploadId,
      contentType: "audio/wav",
      sizeBytes: wavBytes().length,
    });
    expect(await rowOf(ticket.uploadId)).toMatchObject({ status: "stored", contentType: "audio/wav", stageIndex: 1 });
  });

  it("refuses a non-audio file uploaded under an audio type (422), deletes the object and marks it rejected", async () => {
    const { ticket, done } = await upload(pngBytes(), "audio/mpeg");
    expect(done.status).toBe(422);
    expect(((await done.json()) as { error: string }).error).toMatch(/not an audio file/);
    expect(await objectExists(ticket.uploadId)).toBe(false);
    expect((await rowOf(ticket.uploadId)).status).toBe("rejected");
  });

  it("refuses an object that is actually over 25 MB though a small size was declared", async () => {
    const big = new Uint8Array(MB25 + 1);
    big.set(wavBytes(100));
    const res = await ask(student, request(mine, student, { sizeBytes: 16_044 }));
    const ticket = (await res.json()) as Ticket;
    // First line of defence: Content-Length is a signed header, so the presigned PUT refuses a body of
    // another size (403 SignatureDoesNotMatch — AWS Signature Version 4; the stand-in checks it too).
    expect((await putTicket(ticket, big)).status).toBe(403);
    // "complete" must not trust that alone (a storage that ignores the signed length, or a later write):
    // the object is written under the same key with a PUT signed for its real size, and complete measures it.
    const { presignPut } = await import("@/lib/storage/s3");
    const direct = await presignPut((await rowOf(ticket.uploadId)).storageKey, "audio/wav", big.length);
    expect((await putTicket(direct, big)).status).toBe(200);
    const done = await complete(student, ticket.uploadId);
    expect(done.status).toBe(422);
    expect(((await done.json()) as { error: string }).error).toMatch(/larger than 25 MB/);
    expect(await objectExists(ticket.uploadId)).toBe(false);
    expect(await rowOf(ticket.uploadId)).toMatchObject({ status: "rejected", sizeBytes: MB25 + 1 });
  }, 60_000);

  it("answers 422 when nothing arrived, and 404 to anyone but the uploader", async () => {
    const ticket = (await (await ask(student, request(mine, student))).json()) as Ticket;
    expect((await complete(student, ticket.uploadId)).status).toBe(422);
    expect((await complete(otherStudent, ticket.uploadId)).status).toBe(404);
    expect((await rowOf(ticket.uploadId)).status).toBe("pending");
  });
});

describe("playback", () => {
  it("gives a working 10-minute address to the student, the assignment's teacher and an admin only", async () => {
    const bytes = wavBytes(4000);
    const { ticket } = await upload(bytes);
    for (const who of [student, teacher, admin]) {
      const res = await playback(who, ticket.uploadId);
      expect(res.status).toBe(200);
      const { url } = (await res.json()) as { url: string };
      expect(new URL(url).searchParams.get("X-Amz-Expires")).toBe("600");
      const got = await fetch(url);
      expect(got.status).toBe(200);
      expect(got.headers.get("content-type")).toBe("audio/wav");
      expect(Buffer.from(await got.arrayBuffer()).equals(Buffer.from(bytes))).toBe(true);
    }
    expect((await playback(otherTeacher, ticket.uploadId)).status).toBe(404);
    expect((await playback(otherStudent, ticket.uploadId)).status).toBe(404);
    expect(
      (await callRoute("recordings/[uploadId]/playback", "GET", { params: { uploadId: ticket.uploadId } })).status,
    ).toBe(401);
  });

  it("serves only what was checked: the upload address, still valid after check-in, cannot replace it", async () => {
    const bytes = wavBytes(3000);
    const { ticket, done } = await upload(bytes);
    expect(done.status).toBe(200);
    expect((await rowOf(ticket.uploadId)).storageKey).toBe(`recordings/${student.id}/${ticket.uploadId}`);
    // The same presigned PUT, within its five minutes, with a page of the same signed length and type.
    const page = new TextEncoder().encode("<html><script>alert(1)</script></html>".padEnd(bytes.length, " "));
    expect((await putTicket(ticket, new Uint8Array(page))).status).toBe(200);
    expect((await complete(student, ticket.uploadId)).status).toBe(200);
    const { url } = (await (await playback(teacher, ticket.uploadId)).json()) as { url: string };
    const got = await fetch(url);
    expect(got.status).toBe(200);
    expect(Buffer.from(await got.arrayBuffer()).equals(Buffer.from(bytes))).toBe(true);
    expect(got.headers.get("content-type")).toBe("audio/wav");
    // Opened as a page it downloads; an <audio> element plays it regardless (HTML Standard: media elements).
    expect(got.headers.get("content-disposition")).toMatch(/^attachment/);
  });

  it("has no address for an upload that was not stored", async () => {
    const ticket = (await (await ask(student, request(mine, student))).json()) as Ticket;
    expect((await playback(student, ticket.uploadId)).status).toBe(404);
    expect((await playback(admin, ticket.uploadId)).status).toBe(404);
  });
});

describe("the storage stays private", () => {
  it("refuses an unsigned read, a PUT that changes a signed header and a presigned address past its expiry", async () => {
    const { ticket } = await upload(wavBytes(500));
    const key = (await rowOf(ticket.uploadId)).storageKey;
    const endpoint = process.env.S3_ENDPOINT ?? "";
    // No public-read: an object is reachable only through a signed request (AWS S3 docs: "Blocking public access").
    expect((await fetch(`${endpoint}/rosinwood-recordings/${key}`)).status).toBe(403);

    const fresh = (await (await ask(student, request(mine, student, { sizeBytes: 1044 }))).json()) as Ticket;
    // Content-Type and Content-Length are signed: another type or size breaks the signature (AWS Signature Version 4).
    expect((await putTicket({ url: fresh.url, headers: { "Content-Type": "image/png" } }, wavBytes(500))).status).toBe(
      403,
    );
    expect((await putTicket(fresh, wavBytes(900))).status).toBe(403);
    expect((await putTicket(fresh, wavBytes(500))).status).toBe(200);

    // An address signed 11 minutes ago with a 10-minute life, through the same presigner the app uses.
    const { S3Client, GetObjectCommand } = await import("@aws-sdk/client-s3");
    const { getSignedUrl } = await import("@aws-sdk/s3-request-presigner");
    const client = new S3Client({
      endpoint,
      region: "us-east-1",
      forcePathStyle: true,
      credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" },
    });
    const old = await getSignedUrl(client, new GetObjectCommand({ Bucket: "rosinwood-recordings", Key: key }), {
      expiresIn: 600,
      signingDate: new Date(Date.now() - 11 * 60_000),
    });
    expect((await fetch(old)).status).toBe(403);
    const current = await getSignedUrl(client, new GetObjectCommand({ Bucket: "rosinwood-recordings", Key: key }), {
      expiresIn: 600,
    });
    expect((await fetch(current)).status).toBe(200);
  });
});
