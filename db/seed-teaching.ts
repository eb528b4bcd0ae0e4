// The demo school's teaching (db/seed-data/teaching.ts, practice.ts, takes.ts) into the database and
// the recordings into storage: assignments with their stages, check-ins with recordings and feedback,
// practice and margin notes. Run after the people, the catalogue and the progress.
//
// Idempotent: every row's id is made from the demo's own keys, and a demo assignment already present
// is left alone with everything of its student's (practice, notes) — what someone did with the demo
// since is kept. Rows are written directly rather than through lib/teaching's transitions, which would
// date them now and e-mail each student; the stages come from ./seed-data/teaching-replay.ts, which
// follows the same rules.
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { eq, inArray, sql } from "drizzle-orm";
import type { Db } from "./client";
import {
  assignments,
  assignmentStudents,
  checkIns,
  marginNotes,
  practiceLogs,
  stageStates,
  tunes,
  tuneStages,
  uploads,
  users,
} from "./schema";
import { DEMO_TUNES } from "./seed-data/catalogue";
import { STUDENTS, TEACHERS } from "./seed-data/people";
import { DEMO_MARGIN_NOTES, demoPractice } from "./seed-data/practice";
import { takeFile, type TakeName } from "./seed-data/takes";
import { DEMO_ASSIGNMENTS, type DemoAssignment } from "./seed-data/teaching";
import { replay } from "./seed-data/teaching-replay";
import { demoTuneAbc, headerField } from "./seed-catalogue";
import { addDays, dayIn } from "@/lib/teaching/learn-dates";
import { presignPut } from "@/lib/storage/s3";

const DAY_MS = 86_400_000;
// The listening aid's worker hears check-ins this recent when it starts (lib/jobs/listen.ts sweepUnheard).
const HEARD_WITHIN_DAYS = 14;

/** A stable UUID from the demo's own key (SHA-1 name-based, as RFC 9562 §5.5's version 5). */
export function demoId(kind: string, key: string): string {
  const h = createHash("sha1").update(`rosinwood-demo/${kind}/${key}`).digest();
  h[6] = (h[6] & 0x0f) | 0x50;
  h[8] = (h[8] & 0x3f) | 0x80;
  const x = h.subarray(0, 16).toString("hex");
  return `${x.slice(0, 8)}-${x.slice(8, 12)}-${x.slice(12, 16)}-${x.slice(16, 20)}-${x.slice(20)}`;
}

type Ids = {
  person: Map<string, { id: string; timeZone: string }>;
  tune: Map<string, string>;
  stages: Map<string, number>;
};

async function lookUp(db: Db): Promise<Ids> {
  const emails = [...STUDENTS, ...TEACHERS].map((p) => p.email.toLowerCase());
  const people = await db
    .select({ id: users.id, email: users.email, timeZone: users.timeZone })
    .from(users)
    .where(inArray(sql`lower(${users.email})`, emails));
  const person = new Map(people.map((p) => [p.email.toLowerCase(), p]));
  const rows = await db
    .select({
      id: tunes.id,
      teacherId: tunes.teacherId,
      title: tunes.title,
      stages: sql<number>`count(${tuneStages.id})::int`,
    })
    .from(tunes)
    .leftJoin(tuneStages, eq(tuneStages.tuneId, tunes.id))
    .groupBy(tunes.id);
  const tune = new Map<string, string>();
  const stages = new Map<string, number>();
  for (const t of DEMO_TUNES) {
    const owner = person.get(TEACHERS[t.teacher].email.toLowerCase());
    const title = headerField(demoTuneAbc(t.file), "T");
    const row = rows.find((r) => r.teacherId === owner?.id && r.title === title);
    if (row) {
      tune.set(t.file, row.id);
      stages.set(t.file, row.stages);
    }
  }
  return { person, tune, stages };
}

const need = <T>(v: T | undefined, what: string): T => {
  if (v === undefined) throw new Error(`demo teaching: no ${what} (seed the people and the catalogue first)`);
  return v;
};

type Rows = {
  assignments: (typeof assignments.$inferInsert)[];
  places: (typeof assignmentStudents.$inferInsert)[];
  stages: (typeof stageStates.$inferInsert)[];
  uploads: (typeof uploads.$inferInsert & { take: TakeName })[];
  checkIns: (typeof checkIns.$inferInsert)[];
};

function rowsOf(a: DemoAssignment, ids: Ids, now: number, out: Rows): void {
  const at = (daysAgo: number) => new Date(Math.round((now - daysAgo * DAY_MS) / 60_000) * 60_000);
  const teacherId = need(ids.person.get(TEACHERS[a.teacher].email.toLowerCase()), `teacher ${a.teacher}`).id;
  const studentId = need(ids.person.get(STUDENTS[a.student].email.toLowerCase()), `student ${a.student}`).id;
  const tuneId = need(ids.tune.get(a.tune), `tune ${a.tune}`);
  const played = replay(a, need(ids.stages.get(a.tune), `stages of ${a.tune}`));
  const id = demoId("assignment", a.key);
  const place = demoId("place", a.key);
  out.assignments.push({
    id,
    teacherId,
    tuneId,
    dueAt: new Date(Math.round((now + a.dueInDays * DAY_MS) / 3_600_000) * 3_600_000),
    note: a.note,
    createdAt: at(a.assignedDaysAgo),
    updatedAt: at(a.assignedDaysAgo),
  });
  out.places.push({ id: place, assignmentId: id, studentId });
  for (const s of played.stages)
    out.stages.push({
      id: demoId("stage", `${a.key}/${s.index}`),
      assignmentStudentId: place,
      stageIndex: s.index,
      state: s.state,
      openedAt: s.openedDaysAgo === null ? null : at(s.openedDaysAgo),
      signedOffAt: s.signedOffDaysAgo === null ? null : at(s.signedOffDaysAgo),
    });
  played.checkIns.forEach((c, i) => {
    const uploadId = demoId("upload", `${a.key}/${i}`);
    out.uploads.push({
      id: uploadId,
      take: c.take,
      ownerId: studentId,
      storageKey: `recordings/${studentId}/${uploadId}`, // as lib/storage/recordings.ts names them
      contentType: "audio/mpeg",
      sizeBytes: 0, // set from the file below
      assignmentStudentId: place,
      stageIndex: c.stage,
      status: "stored",
      createdAt: at(c.daysAgo + 0.002),
    });
    out.checkIns.push({
      id: demoId("check-in", `${a.key}/${i}`),
      stageStateId: demoId("stage", `${a.key}/${c.stage}`),
      studentId,
      uploadId,
      selfRating: c.rating,
      fromMemory: c.fromMemory ?? false,
      status: c.status,
      feedback: c.review?.feedback ?? null,
      reviewedBy: c.review ? teacherId : null,
      reviewedAt: c.review ? at(c.review.daysAgo) : null,
      createdAt: at(c.daysAgo),
    });
  });
}

/** Puts each recording where the app keeps it, through the same presigned PUT a browser uses. */
async function store(list: Rows["uploads"]): Promise<void> {
  const bytes = new Map<TakeName, Buffer>();
  for (const u of list) {
    if (!bytes.has(u.take)) bytes.set(u.take, readFileSync(takeFile(u.take)));
    u.sizeBytes = bytes.get(u.take)!.length;
  }
  const queue = [...list];
  const putOne = async (): Promise<void> => {
    for (let u = queue.shift(); u; u = queue.shift()) {
      const body = bytes.get(u.take)!;
      const { url, headers } = await presignPut(u.storageKey, u.contentType, body.length);
      const res = await fetch(url, { method: "PUT", headers, body: new Uint8Array(body) });
      if (!res.ok) throw new Error(`demo recording ${u.take}: storage answered ${res.status} ${await res.text()}`);
    }
  };
  await Promise.all(Array.from({ length: 4 }, putOne)); // a few at a time: the stand-in writes each to disk
}

function practiceRows(student: number, ids: Ids, now: Date): (typeof practiceLogs.$inferInsert)[] {
  const who = need(ids.person.get(STUDENTS[student].email.toLowerCase()), `student ${student}`);
  const today = dayIn(who.timeZone, now);
  return demoPractice(student).map((p, i) => ({
    id: demoId("practice", `${student}/${i}`),
    userId: who.id,
    tuneId: p.tune ? need(ids.tune.get(p.tune), `tune ${p.tune}`) : null,
    practisedOn: addDays(today, -p.daysAgo),
    minutes: p.minutes,
    note: p.note,
    createdAt: new Date(now.getTime() - p.daysAgo * DAY_MS),
  }));
}

export type TeachingSeeded = { assignments: number; checkIns: number; recent: string[] };

/** Writes the demo assignments not yet present, with their students' practice and notes. */
export async function seedTeaching(db: Db, now = new Date()): Promise<TeachingSeeded> {
  const ids = await lookUp(db);
  const present = new Set(
    (
      await db
        .select({ id: assignments.id })
        .from(assignments)
        .where(
          inArray(
            assignments.id,
            DEMO_ASSIGNMENTS.map((a) => demoId("assignment", a.key)),
          ),
        )
    ).map((r) => r.id),
  );
  const fresh = DEMO_ASSIGNMENTS.filter((a) => !present.has(demoId("assignment", a.key)));
  if (!fresh.length) return { assignments: 0, checkIns: 0, recent: [] };
  const rows: Rows = { assignments: [], places: [], stages: [], uploads: [], checkIns: [] };
  for (const a of fresh) rowsOf(a, ids, now.getTime(), rows);
  // A student's practice and notes come with their demo work, the first time it is written.
  const students = [...new Set(fresh.map((a) => a.student))].filter(
    (s) => !DEMO_ASSIGNMENTS.some((a) => a.student === s && present.has(demoId("assignment", a.key))),
  );
  const practice = students.flatMap((s) => practiceRows(s, ids, now));
  const notes = DEMO_MARGIN_NOTES.filter((n) => students.includes(n.student)).map((n, i) => ({
    id: demoId("note", `${n.student}/${n.tune}/${n.bar}`),
    userId: need(ids.person.get(STUDENTS[n.student].email.toLowerCase()), `student ${n.student}`).id,
    tuneId: need(ids.tune.get(n.tune), `tune ${n.tune}`),
    bar: n.bar,
    body: n.body,
    createdAt: new Date(now.getTime() - (20 - i) * DAY_MS),
  }));

  await store(rows.uploads);
  await db.transaction(async (tx) => {
    await tx.insert(assignments).values(rows.assignments);
    await tx.insert(assignmentStudents).values(rows.places);
    await tx.insert(stageStates).values(rows.stages);
    if (rows.uploads.length) await tx.insert(uploads).values(rows.uploads.map(({ take: _, ...u }) => u));
    if (rows.checkIns.length) await tx.insert(checkIns).values(rows.checkIns);
    if (practice.length) await tx.insert(practiceLogs).values(practice).onConflictDoNothing();
    if (notes.length) await tx.insert(marginNotes).values(notes).onConflictDoNothing();
  });
  const recent = rows.checkIns
    .filter((c) => (c.createdAt as Date).getTime() > now.getTime() - HEARD_WITHIN_DAYS * DAY_MS)
    .map((c) => c.id as string);
  return { assignments: rows.assignments.length, checkIns: rows.checkIns.length, recent };
}
