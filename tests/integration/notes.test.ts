// Margin notes through the real route handlers (issue 5 item 6): add, edit, delete; private to their
// writer (another person's note id answers 404); validated with the same zod schema as the form.
import { insertEnrolment } from "@/db/queries/enrolments";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { tuneProgress } from "@/db/schema";
import type { NoteJson } from "@/lib/catalogue/api-types";
import { authWorld, type AuthWorld } from "./helpers/auth-world";
import { makeCatalogueFixture, type CatalogueFixture } from "./helpers/catalogue-fixture";
import { giveMembership } from "./helpers/membership";
import { callRoute } from "./helpers/catalogue-routes";

let w: AuthWorld;
let f: CatalogueFixture;
let me: string; // the fixture's enrolled student
let classmate: string; // enrolled in the same course
let outsider: string; // a student not enrolled

beforeAll(async () => {
  w = await authWorld();
  const teacher = await w.person("teacher");
  const student = await w.person("student");
  const other = await w.person("student");
  f = await makeCatalogueFixture(w.db, { teacher, student });
  await insertEnrolment(w.db, { userId: other.id, courseId: f.courseId });
  await giveMembership(w.db, other.id);
  await w.db.insert(tuneProgress).values({ userId: other.id, tuneId: f.tunes.A, reachedStage: 1 });
  me = await w.cookieFor(student.id);
  classmate = await w.cookieFor(other.id);
  outsider = await w.cookieFor((await w.person("student")).id);
});
afterAll(async () => w?.close());

const list = async (cookie: string, tuneId = f.tunes.A) => {
  const res = await callRoute("tunes/[tuneId]/notes", "GET", { cookie, params: { tuneId } });
  return { status: res.status, notes: res.status === 200 ? ((await res.json()) as { notes: NoteJson[] }).notes : [] };
};
const add = (cookie: string, body: unknown, tuneId = f.tunes.A) =>
  callRoute("tunes/[tuneId]/notes", "POST", { cookie, params: { tuneId }, body });
const one = (method: "PATCH" | "DELETE", cookie: string, noteId: string, body?: unknown) =>
  callRoute("tunes/[tuneId]/notes/[noteId]", method, { cookie, params: { tuneId: f.tunes.A, noteId }, body });

describe("margin notes", () => {
  it("adds, edits and deletes a note pinned to a bar, listed in bar order", async () => {
    const res = await add(me, { bar: 5, body: "  Count the triplet: one-and-a  " });
    expect(res.status).toBe(201);
    const note = (await res.json()) as NoteJson;
    expect(note).toMatchObject({ bar: 5, body: "Count the triplet: one-and-a" }); // trimmed, as the form trims
    expect((await list(me)).notes.map((n) => n.bar)).toEqual([2, 5]); // the fixture's note sits on bar 2

    const changed = await one("PATCH", me, note.id, { body: "Count it slowly", bar: 0 });
    expect(changed.status).toBe(200);
    expect((await changed.json()) as NoteJson).toMatchObject({ id: note.id, bar: 0, body: "Count it slowly" });
    expect((await list(me)).notes.map((n) => n.body)).toEqual(["Count it slowly", "Lift the bow here"]);

    expect((await one("DELETE", me, note.id)).status).toBe(204);
    expect((await list(me)).notes.map((n) => n.id)).not.toContain(note.id);
    expect((await one("DELETE", me, note.id)).status).toBe(404); // already gone
  });

  it("keeps notes private: another student neither lists nor changes nor deletes them", async () => {
    expect((await list(classmate)).notes).toEqual([]);
    expect((await one("PATCH", classmate, f.studentNoteId, { body: "mine now" })).status).toBe(404);
    expect((await one("DELETE", classmate, f.studentNoteId)).status).toBe(404);
    const mine = (await list(me)).notes.find((n) => n.id === f.studentNoteId);
    expect(mine?.body).toBe("Lift the bow here");
    // The classmate's own note is theirs alone too.
    await add(classmate, { bar: 1, body: "Classmate's note" });
    expect((await list(me)).notes.map((n) => n.body)).not.toContain("Classmate's note");
  });

  it("refuses bad input with a message per field", async () => {
    const empty = await add(me, { bar: 1, body: "   " });
    expect(empty.status).toBe(400);
    expect(((await empty.json()) as { fieldErrors: Record<string, string> }).fieldErrors.body).toBe(
      "Write something in the note.",
    );
    const negative = await add(me, { bar: -1, body: "x" });
    expect(((await negative.json()) as { fieldErrors: Record<string, string> }).fieldErrors.bar).toMatch(
      /Bars start at 0/,
    );
    expect((await add(me, { bar: 1, body: "x".repeat(2001) })).status).toBe(400);
    expect((await one("PATCH", me, f.studentNoteId, {})).status).toBe(400); // nothing to change
  });

  it("needs the tune to be open: 403 on a locked rung's tune, 404 on a tune that does not exist for you", async () => {
    expect((await list(me, f.tunes.C)).status).toBe(403);
    expect((await add(me, { bar: 1, body: "early" }, f.tunes.C)).status).toBe(403);
    expect((await list(me, f.tunes.D)).status).toBe(404);
    // Anyone may keep notes on a taster tune, enrolled or not.
    expect((await add(outsider, { bar: 1, body: "trying the taster" })).status).toBe(201);
  });

  it("refuses a cross-site request", async () => {
    const mod = (await import("@/app/api/tunes/[tuneId]/notes/route")) as {
      POST: (r: Request, a: unknown) => Promise<Response>;
    };
    const req = new Request("http://127.0.0.1:3999/api/tunes/x/notes", {
      method: "POST",
      headers: { origin: "https://elsewhere.example", cookie: me, "content-type": "application/json" },
      body: JSON.stringify({ bar: 1, body: "sneaky" }),
    });
    expect((await mod.POST(req, { params: Promise.resolve({ tuneId: f.tunes.A }) })).status).toBe(403);
  });
});
