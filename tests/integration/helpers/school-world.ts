// Fixtures for courses that members start and climb (enrol-climb, course-members, review-undo):
// a published course of the teacher's own tunes with a pace and a lead teacher, and members with a
// membership in good standing. Built on teachingWorld (the real routes through their guard).
import { courses, grades, rungs } from "@/db/schema";
import { giveMembership } from "./membership";
import { teachingWorld } from "./teaching-world";

export async function schoolWorld() {
  const w = await teachingWorld();
  let n = 0;

  /** A published course of `tunes` rungs (the first a taster), each asking for stage 1 before the next opens. */
  async function course(
    teacher: { id: string },
    o: { pace?: "self_paced" | "teacher_sign_off"; tunes?: number; lead?: { id: string } } = {},
  ) {
    n += 1;
    const tuneIds: string[] = [];
    for (let i = 0; i < (o.tunes ?? 2); i++) tuneIds.push(await w.tuneOf(teacher.id, `Climb ${n}.${i + 1}`));
    const [c] = await w.db
      .insert(courses)
      .values({
        teacherId: teacher.id,
        leadTeacherId: (o.lead ?? teacher).id,
        pace: o.pace ?? "self_paced",
        slug: `climb-${n}-${Date.now().toString(36)}`,
        title: `Climbing Course ${n}`,
        summary: "Two tunes, one stage at a time.",
        publishedAt: new Date(),
      })
      .returning();
    const [g] = await w.db.insert(grades).values({ courseId: c.id, position: 1, title: "Grade 1" }).returning();
    await w.db
      .insert(rungs)
      .values(
        tuneIds.map((tuneId, i) => ({ gradeId: g.id, tuneId, position: i + 1, requiredStage: 1, isTaster: i === 0 })),
      );
    return { ...c, tuneIds };
  }

  /** A student with a membership in good standing, and their session's cookie. */
  async function member() {
    const s = await w.person("student");
    await w.setUser(s.id, { timeZone: "UTC" });
    await giveMembership(w.db, s.id);
    return { ...s, cookie: await w.cookieFor(s.id) };
  }

  return { ...w, course, member };
}

export type SchoolWorld = Awaited<ReturnType<typeof schoolWorld>>;
