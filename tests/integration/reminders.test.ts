// Due-date reminders through the real worker with a clock the test moves: two days before, on the due
// day in the student's own time zone, once when overdue — each at most once per assignment and student,
// across repeated passes and a worker restart; none for a withdrawn or fully signed-off assignment.
import { eq, like } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { assignments, emailOutbox } from "@/db/schema";
import type { RunningWorker } from "@/lib/jobs/worker";
import type { ResendFake } from "@/scripts/fakes/resend";
import { authWorld, type AuthWorld } from "./helpers/auth-world";
import { FAKE_KEY, testMailer, waitFor } from "./helpers/mail";
import { makeAssignment, signOffAll } from "./helpers/recordings-world";

let w: AuthWorld;
let fake: ResendFake;
let worker: RunningWorker | undefined;
let now = new Date("2031-03-01T12:00:00Z");
const ids: Record<string, string> = {}; // label → assignmentStudentId
const LONDON_DUE = "2031-03-14T18:00:00.000Z";
const emails: Record<string, string> = {};

async function startTheWorker(): Promise<RunningWorker> {
  const { startWorker } = await import("@/lib/jobs/worker");
  return startWorker({
    databaseUrl: process.env.DATABASE_URL,
    mailer: testMailer(fake.url),
    pollingIntervalSeconds: 0.5,
    // The test drives each pass itself with remindNow(); only the pass at start runs on its own.
    reminders: { intervalSeconds: 3600 },
    sweep: { intervalSeconds: 3600, minAgeSeconds: 3600 },
    clock: () => now,
    log: () => {},
  });
}

beforeAll(async () => {
  w = await authWorld();
  const { startResendFake } = await import("@/scripts/fakes/resend");
  fake = await startResendFake({ port: 0, apiKey: FAKE_KEY });
  const teacher = await w.person("teacher");
  const person = async (label: string, timeZone: string) => {
    const p = await w.person("student", { name: `Student ${label}` });
    await w.setUser(p.id, { timeZone });
    emails[label] = p.email;
    return p.id;
  };
  const london = await person("london", "Europe/London");
  const done = await person("done", "Europe/London");
  const gone = await person("gone", "Europe/London");
  const dueAt = new Date(LONDON_DUE);
  ids.london = (await makeAssignment(w.db, { teacherId: teacher.id, studentIds: [london], dueAt })).students[london];
  ids.done = (await makeAssignment(w.db, { teacherId: teacher.id, studentIds: [done], dueAt })).students[done];
  await signOffAll(w.db, ids.done);
  ids.gone = (
    await makeAssignment(w.db, { teacherId: teacher.id, studentIds: [gone], dueAt, status: "withdrawn" })
  ).students[gone];
  // One assignment, two students half a world apart: due 20:00 UTC is 13:00 on the 24th in Los Angeles
  // (PDT, UTC−7) and 09:00 on the 25th in Auckland (NZDT, UTC+13) — IANA tz database.
  const auckland = await person("auckland", "Pacific/Auckland");
  const la = await person("la", "America/Los_Angeles");
  const both = await makeAssignment(w.db, {
    teacherId: teacher.id,
    studentIds: [auckland, la],
    dueAt: new Date("2032-03-24T20:00:00Z"),
  });
  ids.auckland = both.students[auckland];
  ids.la = both.students[la];
  worker = await startTheWorker();
});
afterAll(async () => {
  await worker?.stop();
  await fake?.close();
  await w?.close();
});

/** The reminder kinds queued so far for one student's copy, in order. */
async function sent(label: string): Promise<string[]> {
  const rows = await w.db
    .select()
    .from(emailOutbox)
    .where(like(emailOutbox.dedupeKey, `due-reminder:%:${ids[label]}:%`));
  return rows.sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime()).map((r) => String(r.payload.when));
}

async function passAt(iso: string): Promise<string[]> {
  now = new Date(iso);
  if (!worker) throw new Error("no worker");
  return worker.remindNow();
}

describe("due-date reminders", () => {
  it("sends nothing while the due date is more than two days away", async () => {
    expect(await passAt("2031-03-11T12:00:00Z")).toEqual([]);
    expect(await sent("london")).toEqual([]);
  });

  it("sends one 'two days' reminder, however many passes run", async () => {
    expect(await passAt("2031-03-12T19:00:00Z")).toEqual([`due-reminder:two_days:${ids.london}:${LONDON_DUE}`]);
    expect(await passAt("2031-03-12T19:01:00Z")).toEqual([]);
    expect(await passAt("2031-03-13T09:00:00Z")).toEqual([]);
    expect(await sent("london")).toEqual(["two_days"]);
  });

  it("sends 'due today' on the due day and 'overdue' once after it", async () => {
    expect(await passAt("2031-03-14T07:00:00Z")).toEqual([`due-reminder:due_today:${ids.london}:${LONDON_DUE}`]);
    expect(await passAt("2031-03-14T17:59:00Z")).toEqual([]);
    expect(await passAt("2031-03-14T18:00:00Z")).toEqual([`due-reminder:overdue:${ids.london}:${LONDON_DUE}`]);
    expect(await passAt("2031-03-20T18:00:00Z")).toEqual([]);
    expect(await sent("london")).toEqual(["two_days", "due_today", "overdue"]);
    const [mail] = (await w.mailsTo(emails.london)).filter((m) => m.payload.when === "due_today");
    expect(mail.payload).toMatchObject({
      dueLocal: "Friday 14 March, 18:00",
      assignmentUrl: `/learn/assignments/${ids.london}`,
    });
  });

  it("sends nothing for a fully signed-off or a withdrawn assignment", async () => {
    expect(await sent("done")).toEqual([]);
    expect(await sent("gone")).toEqual([]);
  });

  it("sends nothing new after a restart, and each reminder reaches the provider once", async () => {
    await worker?.stop();
    worker = await startTheWorker(); // its start-up pass runs at the same clock
    expect(await worker.remindNow()).toEqual([]);
    expect(await sent("london")).toEqual(["two_days", "due_today", "overdue"]);
    const delivered = () => fake.emails().filter((e) => e.to.includes(emails.london));
    await waitFor(() => delivered().length >= 3, 20_000, "three reminders delivered");
    expect(delivered()).toHaveLength(3);
  });

  it("queues a reminder once when passes race (two workers at the same moment)", async () => {
    const teacher = await w.person("teacher");
    const racer = await w.person("student");
    ids.race = (
      await makeAssignment(w.db, {
        teacherId: teacher.id,
        studentIds: [racer.id],
        dueAt: new Date("2031-06-10T12:00:00Z"),
      })
    ).students[racer.id];
    now = new Date("2031-06-10T13:00:00Z");
    const { sendDueReminders } = await import("@/lib/jobs/reminders");
    const runs = await Promise.all([
      sendDueReminders(w.db, now),
      sendDueReminders(w.db, now),
      sendDueReminders(w.db, now),
    ]);
    // The outbox's unique dedupe_key decides the race: exactly one pass queued it.
    expect(runs.flat()).toEqual([`due-reminder:overdue:${ids.race}:2031-06-10T12:00:00.000Z`]);
    expect(await sent("race")).toEqual(["overdue"]);
  });

  it("reminds again for the new date when the teacher moves the due date, once", async () => {
    const teacher = await w.person("teacher");
    const mover = await w.person("student");
    emails.moved = mover.email;
    const made = await makeAssignment(w.db, {
      teacherId: teacher.id,
      studentIds: [mover.id],
      dueAt: new Date("2031-07-10T12:00:00Z"),
    });
    ids.moved = made.students[mover.id];
    expect(await passAt("2031-07-08T13:00:00Z")).toEqual([
      `due-reminder:two_days:${ids.moved}:2031-07-10T12:00:00.000Z`,
    ]);
    await w.db
      .update(assignments)
      .set({ dueAt: new Date("2031-07-20T12:00:00Z") })
      .where(eq(assignments.id, made.assignmentId));
    expect(await passAt("2031-07-09T13:00:00Z")).toEqual([]); // the new date is eleven days away
    expect(await passAt("2031-07-18T13:00:00Z")).toEqual([
      `due-reminder:two_days:${ids.moved}:2031-07-20T12:00:00.000Z`,
    ]);
    expect(await passAt("2031-07-18T14:00:00Z")).toEqual([]);
    const dues = (await w.mailsTo(emails.moved)).map((m) => m.payload.dueLocal);
    expect(dues).toHaveLength(2);
    expect(dues[1]).not.toBe(dues[0]);
  });

  it("says 'due today' on each student's own day: Los Angeles first, Auckland later", async () => {
    await passAt("2032-03-24T06:59:00Z"); // 23:59 on the 23rd in Los Angeles, 19:59 on the 24th in Auckland
    expect(await sent("la")).toEqual(["two_days"]);
    expect(await sent("auckland")).toEqual(["two_days"]);
    await passAt("2032-03-24T07:01:00Z"); // 00:01 on the 24th in Los Angeles: its due day
    expect(await sent("la")).toEqual(["two_days", "due_today"]);
    expect(await sent("auckland")).toEqual(["two_days"]);
    await passAt("2032-03-24T10:59:00Z"); // 23:59 on the 24th in Auckland: not yet its due day
    expect(await sent("auckland")).toEqual(["two_days"]);
    await passAt("2032-03-24T11:01:00Z"); // 00:01 on the 25th in Auckland
    expect(await sent("auckland")).toEqual(["two_days", "due_today"]);
    const local = async (label: string) =>
      (await w.mailsTo(emails[label])).find((m) => m.payload.when === "due_today")?.payload.dueLocal;
    expect(await local("la")).toBe("Wednesday 24 March, 13:00");
    expect(await local("auckland")).toBe("Thursday 25 March, 09:00");
    await passAt("2032-03-24T20:00:00Z");
    expect(await sent("la")).toEqual(["two_days", "due_today", "overdue"]);
    expect(await sent("auckland")).toEqual(["two_days", "due_today", "overdue"]);
  });
});
