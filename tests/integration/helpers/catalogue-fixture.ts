// A small catalogue for route tests: one published course of the teacher with three rungs (a taster,
// then two more across two grades), one unpublished course, and the student enrolled with some
// progress. Tunes are invented for these tests.
import { insertEnrolment } from "@/db/queries/enrolments";
import { analyze } from "@/lib/abc";
import type { Db } from "@/db/client";
import { courses, grades, marginNotes, rungs, tuneProgress, tunes, tuneStages } from "@/db/schema";
import { giveMembership } from "./membership";

/** An invented polka with every kind of embellishment, so its four stages differ. */
export function fixtureTune(title: string, shift = 0): string {
  const notes = ["d", "e", "f", "g"][shift % 4];
  return [
    "X:1",
    `T:${title}`,
    "R:polka",
    "M:2/4",
    "L:1/8",
    "K:D",
    `|: !mf!(d${notes}) fd | ~A2 F2 | {g}fe dB | !>![DA]2 A2 |`,
    `(3BcB AF | (EF) G2 | (3FGF ED | .D2 D2 :|`,
    "",
  ].join("\n");
}

export interface CatalogueFixture {
  courseId: string;
  draftCourseId: string;
  /** A: taster (grade 1 rung 1), B: grade 1 rung 2 (open to the student), C: grade 2 rung 1 (locked), D: in the draft course. */
  tunes: { A: string; B: string; C: string; D: string };
  rungs: { A: string; B: string; C: string };
  /** A margin note the student wrote on tune A. */
  studentNoteId: string;
}

async function addTune(db: Db, teacherId: string, title: string, shift: number): Promise<string> {
  const abc = fixtureTune(title, shift);
  const result = analyze(abc);
  if (!result.ok) throw new Error(`fixture tune ${title}: ${result.problems.map((p) => p.message).join("; ")}`);
  const [row] = await db
    .insert(tunes)
    .values({ teacherId, title, tuneType: "polka", key: "D", meter: "2/4", abc })
    .returning({ id: tunes.id });
  await db
    .insert(tuneStages)
    .values(
      result.value.stages.map((s) => ({ tuneId: row.id, index: s.index, name: s.name, kinds: s.kinds, abc: s.abc })),
    );
  return row.id;
}

export async function makeCatalogueFixture(
  db: Db,
  people: { teacher: { id: string }; student: { id: string } },
  tag = "",
): Promise<CatalogueFixture> {
  const t = people.teacher.id;
  const ids = {
    A: await addTune(db, t, `Fixture Taster${tag}`, 0),
    B: await addTune(db, t, `Fixture Second${tag}`, 1),
    C: await addTune(db, t, `Fixture Third${tag}`, 2),
    D: await addTune(db, t, `Fixture Draft${tag}`, 3),
  };
  const slug = `fixture-${Math.random().toString(36).slice(2, 10)}`;
  const [course] = await db
    .insert(courses)
    .values({ teacherId: t, leadTeacherId: t, slug, title: `Fixture Course${tag}`, publishedAt: new Date() })
    .returning({ id: courses.id });
  const [draft] = await db
    .insert(courses)
    .values({ teacherId: t, leadTeacherId: t, slug: `${slug}-draft`, title: `Fixture Draft Course${tag}` })
    .returning({ id: courses.id });
  const [g1] = await db
    .insert(grades)
    .values({ courseId: course.id, position: 1, title: "Grade 1" })
    .returning({ id: grades.id });
  const [g2] = await db
    .insert(grades)
    .values({ courseId: course.id, position: 2, title: "Grade 2" })
    .returning({ id: grades.id });
  const [gd] = await db
    .insert(grades)
    .values({ courseId: draft.id, position: 1, title: "Grade 1" })
    .returning({ id: grades.id });
  const made = await db
    .insert(rungs)
    .values([
      { gradeId: g1.id, tuneId: ids.A, position: 1, requiredStage: 1, isTaster: true },
      { gradeId: g1.id, tuneId: ids.B, position: 2, requiredStage: 2 },
      { gradeId: g2.id, tuneId: ids.C, position: 1, requiredStage: 2 },
      { gradeId: gd.id, tuneId: ids.D, position: 1, requiredStage: 1 },
    ])
    .returning({ id: rungs.id, tuneId: rungs.tuneId });
  const rungOf = (tune: string) => made.find((r) => r.tuneId === tune)?.id ?? "";
  await insertEnrolment(db, { userId: people.student.id, courseId: course.id });
  // Member-only rungs open to members in good standing (lib/billing/gate.ts).
  await giveMembership(db, people.student.id);
  // The taster is reached at stage 1 (its required stage), so rung B is open; B is started at 0, so C stays locked.
  await db.insert(tuneProgress).values([
    { userId: people.student.id, tuneId: ids.A, reachedStage: 1 },
    { userId: people.student.id, tuneId: ids.B, reachedStage: 0 },
  ]);
  const [note] = await db
    .insert(marginNotes)
    .values({ userId: people.student.id, tuneId: ids.A, bar: 2, body: "Lift the bow here" })
    .returning({ id: marginNotes.id });
  return {
    courseId: course.id,
    draftCourseId: draft.id,
    tunes: ids,
    rungs: { A: rungOf(ids.A), B: rungOf(ids.B), C: rungOf(ids.C) },
    studentNoteId: note.id,
  };
}
