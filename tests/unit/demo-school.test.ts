// The demo school's teaching data (db/seed-data/teaching.ts, practice.ts, takes.ts) before it reaches a
// database: every demo assignment is one the app's rules could have produced, each teacher has work in
// every state, the keen students' practice ends in a live streak, and every take ships as audio.
import { readFileSync } from "node:fs";
import { fileTypeFromBuffer } from "file-type";
import { describe, expect, it } from "vitest";
import { DEMO_COURSES, DEMO_TUNES } from "@/db/seed-data/catalogue";
import { STUDENTS, TEACHERS } from "@/db/seed-data/people";
import { DEMO_MARGIN_NOTES, demoPractice, KEEN } from "@/db/seed-data/practice";
import { DEMO_TAKES, takeFile, type TakeName } from "@/db/seed-data/takes";
import { DEMO_ASSIGNMENTS, type DemoAssignment } from "@/db/seed-data/teaching";
import { replay } from "@/db/seed-data/teaching-replay";
import { DEMO_PROGRESS } from "@/db/seed-progress";
import { streakOf } from "@/lib/teaching/learn-dates";

const STAGES = 4; // every demo tune has the default plan's four stages (tests/integration/seed-catalogue.test.ts)

/** The states the issue lists, as Today and the review queue would show them. */
function statesOf(a: DemoAssignment): Set<string> {
  const { stages, checkIns } = replay(a, STAGES);
  const out = new Set<string>();
  const finished = stages.every((s) => s.state === "signed_off");
  if (finished) out.add("finished");
  else if (a.dueInDays < 0) out.add("overdue");
  else if (a.dueInDays <= 2) out.add("due soon");
  if (!finished && stages.some((s) => s.state === "open")) out.add("open");
  if (checkIns.at(-1)?.status === "waiting") out.add("waiting");
  if (checkIns.at(-1)?.status === "needs_more_time") out.add("needs more time");
  if (stages.some((s, i) => s.state === "signed_off" && stages[i + 1]?.state === "open")) out.add("next stage open");
  return out;
}

describe("the demo school's assignments", () => {
  it("replay through the app's rules without a single impossible step", () => {
    for (const a of DEMO_ASSIGNMENTS) expect(() => replay(a, STAGES), a.key).not.toThrow();
  });

  it("are each teacher's own tunes, for students on that teacher's roster, with unique keys", () => {
    for (const a of DEMO_ASSIGNMENTS) {
      expect(DEMO_TUNES.find((t) => t.file === a.tune)?.teacher, a.key).toBe(a.teacher);
      expect(STUDENTS[a.student].teacherIndex, a.key).toBe(a.teacher);
    }
    expect(new Set(DEMO_ASSIGNMENTS.map((a) => a.key)).size).toBe(DEMO_ASSIGNMENTS.length);
  });

  it("give every teacher assignments in every state", () => {
    for (const [t] of TEACHERS.entries()) {
      const seen = new Set(DEMO_ASSIGNMENTS.filter((a) => a.teacher === t).flatMap((a) => [...statesOf(a)]));
      for (const state of ["open", "due soon", "overdue", "waiting", "needs more time", "next stage open"])
        expect(seen, `${TEACHERS[t].name}: ${state}`).toContain(state);
    }
  });

  it("fill the first teacher's review queue with several check-ins, each with a recording", () => {
    const waiting = DEMO_ASSIGNMENTS.filter((a) => a.teacher === 0 && statesOf(a).has("waiting"));
    expect(waiting.length).toBeGreaterThanOrEqual(4);
    // Within the fortnight the listening aid's worker sweeps when it starts (lib/jobs/listen.ts).
    for (const a of waiting) expect(a.checkIns.at(-1)!.daysAgo, a.key).toBeLessThan(14);
  });

  it("leave the students the browser tests work with to those tests", () => {
    const reserved = [9, 12, 15]; // tests/e2e/assignments.test.ts and listening.test.ts
    expect(DEMO_ASSIGNMENTS.filter((a) => reserved.includes(a.student))).toEqual([]);
  });

  it("keep the first student's ladder as the browser test expects: taster done, second rung in progress", () => {
    const alder = (tune: string) => DEMO_PROGRESS.find((p) => p.student === 0 && p.tune === tune)?.reached;
    expect(alder("little-biscuit.abc")).toBe(1);
    expect(alder("hop-the-puddle.abc")).toBe(1); // below its rung's required stage 2: in progress
  });

  it("raise no progress beyond what a sign-off gave, and show progress on two ladders for six students", () => {
    for (const a of DEMO_ASSIGNMENTS) {
      const reached = DEMO_PROGRESS.find((p) => p.student === a.student && p.tune === a.tune)?.reached ?? 0;
      expect(reached, a.key).toBeGreaterThanOrEqual(replay(a, STAGES).reached);
    }
    const ladderOf = (tune: string) =>
      DEMO_COURSES.find((c) => c.grades.some((g) => g.rungs.some((r) => r.tune === tune)));
    for (const s of Object.keys(KEEN).map(Number)) {
      const ladders = new Set(
        DEMO_PROGRESS.filter((p) => p.student === s && p.reached > 0).map((p) => ladderOf(p.tune)?.slug),
      );
      expect(ladders.size, STUDENTS[s].name).toBeGreaterThanOrEqual(2);
      for (const slug of ladders)
        expect(
          DEMO_COURSES.find((c) => c.slug === slug)?.enrolments.some((e) => e.student === s && e.status === "active"),
          `${STUDENTS[s].name} on ${slug}`,
        ).toBe(true);
    }
  });
});

describe("the demo school's practice and notes", () => {
  it("give six students eight weeks of practice ending in a streak that is still alive", () => {
    expect(Object.keys(KEEN).length).toBeGreaterThanOrEqual(6);
    const today = "2026-03-31";
    const day = (daysAgo: number) =>
      new Date(Date.parse(`${today}T00:00:00Z`) - daysAgo * 86_400_000).toISOString().slice(0, 10);
    for (const [s, keen] of Object.entries(KEEN)) {
      const log = demoPractice(Number(s));
      expect(Math.max(...log.map((p) => p.daysAgo)), STUDENTS[Number(s)].name).toBeGreaterThanOrEqual(49);
      expect(
        streakOf(
          log.map((p) => day(p.daysAgo)),
          today,
        ),
        STUDENTS[Number(s)].name,
      ).toBe(keen.streak);
      for (const p of log) expect(p.minutes).toBeGreaterThanOrEqual(1);
    }
  });

  it("give each keen student margin notes on tunes of theirs", () => {
    for (const s of Object.keys(KEEN).map(Number)) {
      const notes = DEMO_MARGIN_NOTES.filter((n) => n.student === s);
      expect(notes.length, STUDENTS[s].name).toBeGreaterThanOrEqual(2);
      const theirs = (tune: string) =>
        DEMO_PROGRESS.some((p) => p.student === s && p.tune === tune) ||
        DEMO_ASSIGNMENTS.some((a) => a.student === s && a.tune === tune);
      for (const n of notes) expect(theirs(n.tune), `${n.tune} bar ${n.bar}`).toBe(true);
    }
  });
});

describe("the demo recordings", () => {
  it("ship every take a check-in uses as a small mp3", async () => {
    const used = new Set(DEMO_ASSIGNMENTS.flatMap((a) => a.checkIns.map((c) => c.take)));
    expect([...used].sort()).toEqual(Object.keys(DEMO_TAKES).sort());
    for (const name of used) {
      const bytes = readFileSync(takeFile(name as TakeName));
      expect((await fileTypeFromBuffer(bytes))?.mime, name).toBe("audio/mpeg");
      expect(bytes.length, name).toBeLessThan(150_000);
    }
  });

  it("record the stage that is checked in, of the assignment's own tune", () => {
    for (const a of DEMO_ASSIGNMENTS)
      for (const c of a.checkIns)
        expect([DEMO_TAKES[c.take].tune, DEMO_TAKES[c.take].stage], a.key).toEqual([a.tune, c.stage]);
  });
});
