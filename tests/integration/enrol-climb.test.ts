// Enrolling from where you are and climbing without waiting (issue "From paying to playing", items 1
// and 3) against PostgreSQL: a course's page offers each person their next step; starting it enrols
// with the course's lead teacher; on a self-paced course a check-in opens the next stage at once and
// the ladder follows; on a teacher sign-off course it waits in the teacher's review queue.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { enrolments, rosterEntries, tuneProgress, uploads } from "@/db/schema";
import type { LadderJson, SuggestedCourse } from "@/lib/catalogue/api-types";
import type { ClimbJson } from "@/lib/teaching/course-check-in";
import type { ReviewItem } from "@/lib/teaching/teach-api-types";
import { schoolWorld, type SchoolWorld } from "./helpers/school-world";

let w: SchoolWorld;
let C: typeof import("@/lib/courses/actions");
let P: typeof import("@/lib/catalogue/course-page");

beforeAll(async () => {
  w = await schoolWorld();
  C = await import("@/lib/courses/actions");
  P = await import("@/lib/catalogue/course-page");
});
afterAll(async () => w?.close());

const json = async <T>(res: Response): Promise<T> => {
  if (res.status >= 400) throw new Error(`${res.status}: ${await res.text()}`);
  return (await res.json()) as T;
};

async function start(m: { cookie: string }, courseId: string) {
  const { ctx } = await w.context(m.cookie);
  return C.startCourseAction(ctx, { courseId });
}

const climb = (m: { cookie: string }, tuneId: string) =>
  w.call("learn/tunes/[tuneId]/climb", "GET", { cookie: m.cookie, params: { tuneId } });

const checkIn = (m: { cookie: string }, tuneId: string, body: Record<string, unknown>) =>
  w.call("learn/tunes/[tuneId]/check-ins", "POST", { cookie: m.cookie, params: { tuneId }, body });

describe("a course's own page and starting it", () => {
  it("offers a visitor 'join', a member 'start', an enrolled student their ladder, and the taster to all", async () => {
    const lead = await w.person("teacher");
    const author = await w.person("teacher");
    const course = await w.course(author, { lead });
    const visitor = await P.coursePage(w.db, null, course.slug);
    expect(visitor?.offer).toEqual({ kind: "join", href: `/plans?course=${course.slug}` });
    expect(visitor?.teacherName).toBe(lead.name);
    expect(visitor?.taster?.tuneId).toBe(course.tuneIds[0]);
    expect(visitor?.grades[0].rungs.map((r) => r.stageCount)).toEqual([4, 4]);

    const stranger = await w.person("student");
    expect((await P.coursePage(w.db, { id: stranger.id, role: "student" }, course.slug))?.offer).toMatchObject({
      kind: "plan",
      href: `/plans?course=${course.slug}`,
    });

    const m = await w.member();
    expect((await P.coursePage(w.db, { id: m.id, role: "student" }, course.slug))?.offer).toEqual({ kind: "start" });
    expect(await start(m, course.id)).toEqual({ status: 200, redirectTo: `/learn/courses/${course.slug}` });
    expect((await P.coursePage(w.db, { id: m.id, role: "student" }, course.slug))?.offer).toEqual({ kind: "open" });

    // The enrolment is followed by the course's lead teacher, who has the member on their roster.
    const [e] = await w.db
      .select()
      .from(enrolments)
      .where(and(eq(enrolments.userId, m.id), eq(enrolments.courseId, course.id)));
    expect(e.teacherId).toBe(lead.id);
    const roster = await w.db.select().from(rosterEntries).where(eq(rosterEntries.studentId, m.id));
    expect(roster.map((r) => r.teacherId)).toEqual([lead.id]);
  });

  it("refuses to start without a membership, saying why", async () => {
    const teacher = await w.person("teacher");
    const course = await w.course(teacher);
    const s = await w.person("student");
    const res = await start({ cookie: await w.cookieFor(s.id) }, course.id);
    expect(res.status).toBe(403);
    expect(res.message).toMatch(/membership plan/);
  });

  it("lists the courses a student could start next, without the ones they are on", async () => {
    const teacher = await w.person("teacher");
    const a = await w.course(teacher);
    const b = await w.course(teacher);
    const m = await w.member();
    await start(m, a.id);
    const body = await json<{ courses: { id: string }[]; suggestions: SuggestedCourse[] }>(
      await w.call("courses/mine", "GET", { cookie: m.cookie }),
    );
    expect(body.courses.map((c) => c.id)).toEqual([a.id]);
    expect(body.suggestions.map((c) => c.id)).toContain(b.id);
    expect(body.suggestions.map((c) => c.id)).not.toContain(a.id);
  });

  it("a course's settings set its lead teacher and pace; a new enrolment follows the new lead", async () => {
    const owner = await w.person("teacher");
    const other = await w.person("teacher");
    const course = await w.course(owner, { pace: "teacher_sign_off" });
    const cookie = await w.cookieFor(owner.id);
    const patch = (body: Record<string, unknown>) =>
      w.call("teach/courses/[courseId]", "PATCH", { cookie, params: { courseId: course.id }, body });
    const student = await w.person("student");
    const notStaff = await patch({ leadTeacherId: student.id });
    expect(notStaff.status).toBe(422);
    const view = await json<{ leadTeacherId: string; pace: string }>(
      await patch({ leadTeacherId: other.id, pace: "self_paced" }),
    );
    expect(view).toMatchObject({ leadTeacherId: other.id, pace: "self_paced" });
    const m = await w.member();
    await start(m, course.id);
    const [e] = await w.db.select().from(enrolments).where(eq(enrolments.userId, m.id));
    expect(e.teacherId).toBe(other.id);
    const ladder = await json<LadderJson>(
      await w.call("courses/[courseId]/ladder", "GET", { cookie: m.cookie, params: { courseId: course.id } }),
    );
    expect(ladder.course).toMatchObject({ pace: "self_paced", teacherName: other.name });
  });
});

describe("self-paced climbing", () => {
  it("a check-in played from memory opens the next stage at once, raises progress and opens the next rung", async () => {
    const teacher = await w.person("teacher");
    const course = await w.course(teacher, { pace: "self_paced" });
    const m = await w.member();
    await start(m, course.id);
    const [first, second] = course.tuneIds;

    const before = await json<ClimbJson>(await climb(m, first));
    expect(before.course.pace).toBe("self_paced");
    expect(before.current).toBe(1);
    expect(before.stages.map((s) => s.state)).toEqual(["open", "locked", "locked", "locked"]);
    let ladder = await json<LadderJson>(
      await w.call("courses/[courseId]/ladder", "GET", { cookie: m.cookie, params: { courseId: course.id } }),
    );
    expect(ladder.grades[0].rungs.map((r) => r.state)).toEqual(["open", "locked"]);

    const noProof = await checkIn(m, first, { stageIndex: 1, selfRating: 4, fromMemory: false });
    expect(noProof.status).toBe(422);
    expect(((await noProof.json()) as { fieldErrors: Record<string, string> }).fieldErrors.uploadId).toMatch(
      /Played from memory/,
    );

    const res = await checkIn(m, first, { stageIndex: 1, selfRating: 4, fromMemory: true });
    expect(res.status).toBe(201);
    expect(((await res.json()) as { checkIn: unknown }).checkIn).toMatchObject({
      state: "signed_off",
      checkInStatus: "signed_off",
      openedStage: 2,
    });
    const after = await json<ClimbJson>(await climb(m, first));
    expect(after.stages.map((s) => s.state)).toEqual(["signed_off", "open", "locked", "locked"]);
    expect(after.current).toBe(2);
    expect(after.stages[0].checkIn).toMatchObject({ status: "signed_off", fromMemory: true, recorded: false });
    const [progress] = await w.db
      .select()
      .from(tuneProgress)
      .where(and(eq(tuneProgress.userId, m.id), eq(tuneProgress.tuneId, first)));
    expect(progress.reachedStage).toBe(1);
    ladder = await json<LadderJson>(
      await w.call("courses/[courseId]/ladder", "GET", { cookie: m.cookie, params: { courseId: course.id } }),
    );
    expect(ladder.grades[0].rungs.map((r) => r.state)).toEqual(["done", "open"]);
    expect(ladder.grades[0].rungs[0].nextStageName).toBe("Bowing");

    // The same stage again: it is no longer open.
    expect((await checkIn(m, first, { stageIndex: 1, selfRating: 4, fromMemory: true })).status).toBe(409);
    // The second rung's tune is open now too.
    expect((await json<ClimbJson>(await climb(m, second))).current).toBe(1);
  });

  it("takes a stored recording of the climbed stage; another student's recording is not found", async () => {
    const teacher = await w.person("teacher");
    const course = await w.course(teacher, { pace: "self_paced" });
    const m = await w.member();
    const other = await w.member();
    await start(m, course.id);
    await start(other, course.id);
    const tune = course.tuneIds[0];
    // The place on the tune is made at the first step (here: the first check-in attempt).
    await checkIn(m, tune, { stageIndex: 1, selfRating: 3, fromMemory: false });
    await checkIn(other, tune, { stageIndex: 1, selfRating: 3, fromMemory: false });
    const { findEnrolmentTune } = await import("@/db/queries/climb");
    const placeOf = async (id: string) => {
      const [e] = await w.db.select().from(enrolments).where(eq(enrolments.userId, id));
      return (await findEnrolmentTune(w.db, e.id, tune)) ?? "";
    };
    const upload = async (ownerId: string, enrolmentTuneId: string) =>
      (
        await w.db
          .insert(uploads)
          .values({
            ownerId,
            storageKey: `fixture/${enrolmentTuneId}/${ownerId}.ogg`,
            contentType: "audio/ogg",
            sizeBytes: 1000,
            enrolmentTuneId,
            stageIndex: 1,
            status: "stored",
          })
          .returning()
      )[0].id;
    const theirs = await upload(other.id, await placeOf(other.id));
    expect((await checkIn(m, tune, { stageIndex: 1, selfRating: 3, uploadId: theirs })).status).toBe(422);
    const mine = await upload(m.id, await placeOf(m.id));
    const ok = await checkIn(m, tune, { stageIndex: 1, selfRating: 3, uploadId: mine });
    expect(ok.status).toBe(201);
    expect((await json<ClimbJson>(await climb(m, tune))).stages[0].checkIn).toMatchObject({ recorded: true });
  });

  it("the teacher sees the member's check-ins and may leave a word once, which is mailed", async () => {
    const teacher = await w.person("teacher");
    const course = await w.course(teacher, { pace: "self_paced" });
    const m = await w.member();
    await start(m, course.id);
    const made = await json<{ checkIn: { checkInId: string } }>(
      await checkIn(m, course.tuneIds[0], { stageIndex: 1, selfRating: 5, fromMemory: true }),
    );
    const cookie = await w.cookieFor(teacher.id);
    const list = await json<{ checkIns: { checkInId: string; comment: string | null; courseTitle: string }[] }>(
      await w.call("teach/check-ins", "GET", { cookie }),
    );
    expect(list.checkIns.find((c) => c.checkInId === made.checkIn.checkInId)).toMatchObject({
      comment: null,
      courseTitle: course.title,
    });
    const otherTeacher = await w.cookieFor((await w.person("teacher")).id);
    const say = (c: string, comment: string) =>
      w.call("teach/check-ins/[checkInId]/comment", "POST", {
        cookie: c,
        params: { checkInId: made.checkIn.checkInId },
        body: { comment },
      });
    expect((await say(otherTeacher, "Nice.")).status).toBe(404);
    expect((await say(cookie, "Lovely steady bow; try it a touch faster.")).status).toBe(201);
    expect((await say(cookie, "Again.")).status).toBe(409);
    const mail = (await w.mailsTo(m.email)).find((x) => x.dedupeKey === `checkin-feedback:${made.checkIn.checkInId}`);
    expect(mail?.payload).toMatchObject({
      outcome: "comment",
      feedback: "Lovely steady bow; try it a touch faster.",
      courseTitle: course.title,
    });
    expect((await json<ClimbJson>(await climb(m, course.tuneIds[0]))).stages[0].checkIn?.feedback).toBe(
      "Lovely steady bow; try it a touch faster.",
    );
  });

  it("refuses a check-in to someone not enrolled, saying what would open it", async () => {
    const teacher = await w.person("teacher");
    const course = await w.course(teacher, { pace: "self_paced" });
    const m = await w.member();
    const body = await json<{ why: string }>(await climb(m, course.tuneIds[0]));
    expect(body.why).toMatch(/Start a course/);
    const res = await checkIn(m, course.tuneIds[0], { stageIndex: 1, selfRating: 4, fromMemory: true });
    expect(res.status).toBe(403);
  });
});

describe("teacher sign-off courses", () => {
  it("a check-in waits in the enrolment teacher's review queue; their sign-off opens the next stage", async () => {
    const teacher = await w.person("teacher");
    const course = await w.course(teacher, { pace: "teacher_sign_off" });
    const m = await w.member();
    await start(m, course.id);
    const tune = course.tuneIds[0];
    const res = await json<{ checkIn: { checkInId: string; state: string; openedStage: number | null } }>(
      await checkIn(m, tune, { stageIndex: 1, selfRating: 4, fromMemory: true }),
    );
    expect(res.checkIn).toMatchObject({ state: "checked_in", openedStage: null });
    expect((await json<ClimbJson>(await climb(m, tune))).stages[0].state).toBe("checked_in");

    const cookie = await w.cookieFor(teacher.id);
    const queue = await json<{ checkIns: ReviewItem[] }>(await w.call("teach/review", "GET", { cookie }));
    const item = queue.checkIns.find((c) => c.checkInId === res.checkIn.checkInId);
    expect(item).toMatchObject({ assignmentId: null, courseTitle: course.title, stage: { index: 1, count: 4 } });
    const other = await w.cookieFor((await w.person("teacher")).id);
    const theirs = await json<{ checkIns: ReviewItem[] }>(await w.call("teach/review", "GET", { cookie: other }));
    expect(theirs.checkIns.some((c) => c.checkInId === res.checkIn.checkInId)).toBe(false);

    const signed = await json<{ openedStage: number | null }>(
      await w.call("teach/review/[checkInId]", "POST", {
        cookie,
        params: { checkInId: res.checkIn.checkInId },
        body: { outcome: "signed_off", feedback: "Good." },
      }),
    );
    expect(signed.openedStage).toBe(2);
    expect((await json<ClimbJson>(await climb(m, tune))).stages.map((s) => s.state)).toEqual([
      "signed_off",
      "open",
      "locked",
      "locked",
    ]);
    const mail = (await w.mailsTo(m.email)).find((x) => x.dedupeKey === `checkin-feedback:${res.checkIn.checkInId}`);
    expect(mail?.payload).toMatchObject({
      outcome: "signed_off",
      assignmentUrl: expect.stringContaining(`/learn/tunes/${tune}`),
    });
  });
});
