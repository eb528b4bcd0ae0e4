// The practice log through its routes: each bad field named (422), the day "not in the future" in
// the student's own time zone, tunes limited to those the student can open or was given, and
// someone else's entry answered 404.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { practiceLogs } from "@/db/schema";
import { dayIn } from "@/lib/teaching/learn-dates";
import { makeAssignment, makePractice, makeTune } from "./helpers/learning-matrix-rows";
import { teachWorld } from "./helpers/teach-world";

type World = Awaited<ReturnType<typeof teachWorld>>;
type Entry = { id: string; minutes: number; practisedOn: string; tuneId: string | null; note: string };
let w: World;
let teacherId: string;
let me: { id: string; cookie: string };
let other: { id: string; cookie: string };

beforeAll(async () => {
  w = await teachWorld();
  teacherId = (await w.person("teacher")).id;
  const a = await w.person("student");
  const b = await w.person("student");
  me = { id: a.id, cookie: await w.cookieFor(a.id) };
  other = { id: b.id, cookie: await w.cookieFor(b.id) };
});
afterAll(async () => w?.close());

const post = (body: Record<string, unknown>, who = me) =>
  w.call("learn/practice", "POST", { cookie: who.cookie, body });
const list = async (who = me) =>
  (await (await w.call("learn/practice", "GET", { cookie: who.cookie })).json()) as {
    entries: Entry[];
    tunes: { id: string }[];
  };
const fieldsOf = async (res: Response) =>
  Object.keys(((await res.json()) as { fieldErrors?: Record<string, string> }).fieldErrors ?? {});

describe("practice log", () => {
  it("logs an entry and lists it", async () => {
    const res = await post({ minutes: "35", practisedOn: "2026-01-10", note: "  Slow bowing  " });
    expect(res.status).toBe(201);
    const { id } = (await res.json()) as { id: string };
    expect((await list()).entries.find((e) => e.id === id)).toMatchObject({
      minutes: 35,
      practisedOn: "2026-01-10",
      note: "Slow bowing",
      tuneId: null,
    });
  });

  it.each([
    [{ minutes: 0, practisedOn: "2026-01-10" }, ["minutes"]],
    [{ minutes: 601, practisedOn: "2026-01-10" }, ["minutes"]],
    [{ minutes: 1.5, practisedOn: "2026-01-10" }, ["minutes"]],
    [{ minutes: "many", practisedOn: "2026-01-10" }, ["minutes"]],
    [{ practisedOn: "2026-01-10" }, ["minutes"]],
    [{ minutes: 10, practisedOn: "2026-02-30" }, ["practisedOn"]],
    [{ minutes: 10, practisedOn: "10/01/2026" }, ["practisedOn"]],
    [{ minutes: 10, practisedOn: "2026-01-10", note: "x".repeat(1001) }, ["note"]],
    [{ minutes: 10, practisedOn: "2026-01-10", tuneId: "not-a-tune" }, ["tuneId"]],
  ])("refuses %j naming %j (422)", async (body, fields) => {
    const before = (await list()).entries.length;
    const res = await post(body);
    expect(res.status).toBe(422);
    expect(await fieldsOf(res)).toEqual(fields);
    expect((await list()).entries.length).toBe(before);
  });

  it("keeps the day 'not in the future' in the student's own time zone", async () => {
    // UTC+14 and UTC−11 (IANA tz database) are always on different calendar days.
    const aheadDay = dayIn("Pacific/Kiritimati");
    await w.setUser(me.id, { timeZone: "Pacific/Pago_Pago" });
    const refused = await post({ minutes: 10, practisedOn: aheadDay });
    expect(refused.status).toBe(422);
    expect(await fieldsOf(refused)).toEqual(["practisedOn"]);
    await w.setUser(me.id, { timeZone: "Pacific/Kiritimati" });
    expect((await post({ minutes: 10, practisedOn: aheadDay })).status).toBe(201);
    await w.setUser(me.id, { timeZone: "Europe/London" });
  });

  it("takes a tune the student was given or can open, and refuses another", async () => {
    const assigned = await makeAssignment(w.db, { teacherId, studentIds: [me.id], taster: false });
    const taster = await makeTune(w.db, teacherId, { taster: true });
    const closed = await makeTune(w.db, teacherId, { taster: false });
    const tunes = (await list()).tunes.map((t) => t.id);
    expect(tunes).toEqual(expect.arrayContaining([assigned.tuneId, taster.tuneId]));
    expect(tunes).not.toContain(closed.tuneId);
    expect((await post({ minutes: 10, practisedOn: "2026-01-11", tuneId: assigned.tuneId })).status).toBe(201);
    expect((await post({ minutes: 10, practisedOn: "2026-01-11", tuneId: taster.tuneId })).status).toBe(201);
    const res = await post({ minutes: 10, practisedOn: "2026-01-11", tuneId: closed.tuneId });
    expect(res.status).toBe(422);
    expect(await fieldsOf(res)).toEqual(["tuneId"]);
  });

  it("edits and deletes one's own entry; another person's answers 404 and stays as it was", async () => {
    const mine = await makePractice(w.db, me.id, { practisedOn: "2026-01-12", minutes: 20 });
    const theirs = await makePractice(w.db, other.id, { practisedOn: "2026-01-12", minutes: 40 });
    const patch = (id: string, body: Record<string, unknown>) =>
      w.call("learn/practice/[id]", "PATCH", { cookie: me.cookie, params: { id }, body });
    expect((await patch(mine, { minutes: 25, note: "Rolls" })).status).toBe(200);
    const bad = await patch(mine, { minutes: 700 });
    expect(bad.status).toBe(422);
    expect(await fieldsOf(bad)).toEqual(["minutes"]);
    expect((await list()).entries.find((e) => e.id === mine)).toMatchObject({ minutes: 25, note: "Rolls" });
    expect((await patch(theirs, { minutes: 1 })).status).toBe(404);
    expect((await w.call("learn/practice/[id]", "DELETE", { cookie: me.cookie, params: { id: theirs } })).status).toBe(
      404,
    );
    expect((await w.call("learn/practice/[id]", "DELETE", { cookie: me.cookie, params: { id: "nope" } })).status).toBe(
      404,
    );
    const [kept] = await w.db.select().from(practiceLogs).where(eq(practiceLogs.id, theirs));
    expect(kept.minutes).toBe(40);
    expect((await list()).entries.some((e) => e.id === theirs)).toBe(false);
    expect((await w.call("learn/practice/[id]", "DELETE", { cookie: me.cookie, params: { id: mine } })).status).toBe(
      204,
    );
    expect((await list()).entries.some((e) => e.id === mine)).toBe(false);
  });
});
