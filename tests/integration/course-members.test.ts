// Every member has a teacher (issue "From paying to playing", item 2) against PostgreSQL: the new
// member on the lead teacher's roster this week, the welcome note sent once, the daily e-mail of new
// members (one per teacher and day, through the outbox's dedupe key), and the admin reassigning one or
// many enrolments at once.
import { and, eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emailOutbox, enrolments, rosterEntries } from "@/db/schema";
import type { NewMember } from "@/lib/courses/members";
import type { RosterRow } from "@/lib/teaching/teach-api-types";
import { schoolWorld, type SchoolWorld } from "./helpers/school-world";

let w: SchoolWorld;
let E: typeof import("@/db/queries/enrolments");
let D: typeof import("@/lib/jobs/new-members");

beforeAll(async () => {
  w = await schoolWorld();
  E = await import("@/db/queries/enrolments");
  D = await import("@/lib/jobs/new-members");
});
afterAll(async () => w?.close());

const json = async <T>(res: Response): Promise<T> => {
  if (res.status >= 400) throw new Error(`${res.status}: ${await res.text()}`);
  return (await res.json()) as T;
};

/** Enrols a member as starting the course does, at a chosen time. */
async function enrol(courseId: string, at = new Date()) {
  const m = await w.member();
  const made = await E.insertEnrolment(w.db, { userId: m.id, courseId, at });
  if (!made) throw new Error("not enrolled");
  return { ...m, enrolmentId: made.id };
}

describe("the teacher's new members", () => {
  it("shows this week's new members on the roster, not older ones nor another teacher's", async () => {
    const teacher = await w.person("teacher");
    const course = await w.course(teacher);
    const fresh = await enrol(course.id);
    const old = await enrol(course.id, new Date(Date.now() - 9 * 86_400_000));
    const elsewhere = await enrol((await w.course(await w.person("teacher"))).id);
    const cookie = await w.cookieFor(teacher.id);
    const { members } = await json<{ members: NewMember[] }>(await w.call("teach/new-members", "GET", { cookie }));
    expect(members.map((m) => m.student.id)).toEqual([fresh.id]);
    expect(members[0]).toMatchObject({ course: { id: course.id, title: course.title }, welcomedAt: null });
    // Both are on the roster table; only one is new this week.
    const roster = await json<{ students: RosterRow[] }>(await w.call("teach/roster", "GET", { cookie }));
    expect(roster.students.map((s) => s.studentId).sort()).toEqual([fresh.id, old.id].sort());
    expect(roster.students.some((s) => s.studentId === elsewhere.id)).toBe(false);
  });

  it("sends a welcome note once; another teacher's member is not found; a student may not", async () => {
    const teacher = await w.person("teacher");
    const course = await w.course(teacher);
    const m = await enrol(course.id);
    const cookie = await w.cookieFor(teacher.id);
    const welcome = (c: string, note: string) =>
      w.call("teach/new-members/[enrolmentId]/welcome", "POST", {
        cookie: c,
        params: { enrolmentId: m.enrolmentId },
        body: { note },
      });
    expect((await welcome(cookie, "   ")).status).toBe(400);
    expect((await welcome(await w.cookieFor((await w.person("teacher")).id), "Hello")).status).toBe(404);
    expect((await welcome(m.cookie, "Hello")).status).toBe(403);
    const sent = await welcome(cookie, "Welcome aboard: start with the taster, slowly.");
    expect(sent.status).toBe(201);
    expect(((await sent.json()) as { member: NewMember }).member.welcomedAt).not.toBeNull();
    expect((await welcome(cookie, "Twice?")).status).toBe(409);
    const mails = (await w.mailsTo(m.email)).filter((x) => x.template === "welcome-note");
    expect(mails).toHaveLength(1);
    expect(mails[0].payload).toMatchObject({
      teacherName: teacher.name,
      courseTitle: course.title,
      note: "Welcome aboard: start with the taster, slowly.",
    });
  });
});

describe("the daily e-mail of new members", () => {
  it("lists yesterday's new members (in the teacher's zone) once a day, whatever runs it", async () => {
    const teacher = await w.person("teacher");
    await w.setUser(teacher.id, { timeZone: "Pacific/Auckland" });
    const course = await w.course(teacher);
    // 10:00 on 3 December in Auckland (UTC+13) is 21:00 on 2 December UTC.
    const a = await enrol(course.id, new Date("2026-12-02T21:00:00Z"));
    const b = await enrol(course.id, new Date("2026-12-03T05:00:00Z"));
    await enrol(course.id, new Date("2026-12-03T12:00:00Z")); // 01:00 on 4 December there: tomorrow's e-mail
    const morning = new Date("2026-12-03T20:00:00Z"); // 09:00 on 4 December in Auckland
    const keys = await D.sendNewMemberDigests(w.db, morning);
    const key = D.digestKey(teacher.id, "2026-12-03");
    expect(keys).toContain(key);
    expect(await D.sendNewMemberDigests(w.db, new Date(morning.getTime() + 15 * 60_000))).not.toContain(key);
    const [row] = await w.db.select().from(emailOutbox).where(eq(emailOutbox.dedupeKey, key));
    expect(row.toAddress).toBe(teacher.email);
    const listed = (row.payload as { members: { name: string }[] }).members.map((m) => m.name).sort();
    expect(listed).toEqual([a.name, b.name].sort());
    expect(row.payload).toMatchObject({ day: "Thursday 3 December" });
  });

  it("sends nothing to a teacher without new members", async () => {
    const quiet = await w.person("teacher");
    await w.course(quiet);
    const keys = await D.sendNewMemberDigests(w.db, new Date());
    expect(keys.some((k) => k.includes(quiet.id))).toBe(false);
  });
});

describe("the admin reassigns enrolments", () => {
  it("hands many at once to another teacher, who gets them on the roster as new; only an admin may", async () => {
    const lead = await w.person("teacher");
    const next = await w.person("teacher");
    const course = await w.course(lead);
    const one = await enrol(course.id, new Date(Date.now() - 30 * 86_400_000));
    const two = await enrol(course.id, new Date(Date.now() - 30 * 86_400_000));
    const admin = await w.cookieFor((await w.person("admin")).id);
    const call = (cookie: string, body: unknown) => w.call("admin/enrolments/teacher", "POST", { cookie, body });
    expect(
      (await call(await w.cookieFor(lead.id), { enrolmentIds: [one.enrolmentId], teacherId: next.id })).status,
    ).toBe(403);
    const student = await w.person("student");
    expect((await call(admin, { enrolmentIds: [one.enrolmentId], teacherId: student.id })).status).toBe(422);
    const done = await json<{ changed: number; teacherName: string }>(
      await call(admin, { enrolmentIds: [one.enrolmentId, two.enrolmentId], teacherId: next.id }),
    );
    expect(done).toEqual({ changed: 2, teacherName: next.name });
    const rows = await w.db
      .select({ teacherId: enrolments.teacherId })
      .from(enrolments)
      .where(inArray(enrolments.id, [one.enrolmentId, two.enrolmentId]));
    expect(rows.map((r) => r.teacherId)).toEqual([next.id, next.id]);
    const onRoster = await w.db
      .select()
      .from(rosterEntries)
      .where(and(eq(rosterEntries.teacherId, next.id), inArray(rosterEntries.studentId, [one.id, two.id])));
    expect(onRoster).toHaveLength(2);
    const news = await json<{ members: NewMember[] }>(
      await w.call("teach/new-members", "GET", { cookie: await w.cookieFor(next.id) }),
    );
    expect(news.members.map((m) => m.enrolmentId).sort()).toEqual([one.enrolmentId, two.enrolmentId].sort());
    // Again: nothing changes, and it says so.
    expect(await json(await call(admin, { enrolmentIds: [one.enrolmentId], teacherId: next.id }))).toEqual({
      changed: 0,
      teacherName: next.name,
    });
  });
});
