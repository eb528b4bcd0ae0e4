// The private calendar feed: parses as iCalendar (RFC 5545) with ical.js, holds only its owner's due
// dates, and its address stops working when rotated or turned off.
import ICAL from "ical.js";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeAssignment, type AssignmentFixture } from "./helpers/recordings-world";
import { callRoute, teachWorld } from "./helpers/teach-world";
import type { AuthWorld } from "./helpers/auth-world";

type Person = { id: string; email: string; name: string };
let w: AuthWorld;
let ana: Person, ben: Person, cleo: Person, teacher: Person, otherTeacher: Person;
let shared: AssignmentFixture, elsewhere: AssignmentFixture;
const cookies: Record<string, string> = {};
const due = new Date("2031-03-14T18:30:00Z");

beforeAll(async () => {
  w = await teachWorld();
  ana = await w.person("student", { name: "Ana Quillfeather" });
  ben = await w.person("student", { name: "Ben Alderbrook" });
  cleo = await w.person("student", { name: "Cleo Marrowgate" });
  teacher = await w.person("teacher");
  otherTeacher = await w.person("teacher");
  for (const p of [ana, ben, cleo, teacher, otherTeacher]) cookies[p.id] = await w.cookieFor(p.id);
  shared = await makeAssignment(w.db, {
    teacherId: teacher.id,
    studentIds: [ana.id, ben.id],
    dueAt: due,
    title: "The Heron's Step",
  });
  elsewhere = await makeAssignment(w.db, {
    teacherId: otherTeacher.id,
    studentIds: [cleo.id],
    dueAt: new Date("2031-03-20T09:00:00Z"),
    title: "Mossbank Jig",
  });
  await makeAssignment(w.db, {
    teacherId: teacher.id,
    studentIds: [ana.id],
    dueAt: due,
    status: "withdrawn",
    title: "Withdrawn Reel",
  });
});
afterAll(async () => {
  await w?.close();
});

async function turnOn(p: Person): Promise<string> {
  const res = await callRoute("calendar", "POST", { cookie: cookies[p.id], body: {} });
  expect(res.status).toBe(200);
  const { url } = (await res.json()) as { url: string };
  return url.split("/").pop() ?? "";
}

const fetchFeed = (token: string) => callRoute("calendar/[token]", "GET", { params: { token } });

type Ev = { uid: string; summary: string; start: Date; url: string };
async function events(token: string): Promise<Ev[]> {
  const res = await fetchFeed(token);
  expect(res.status).toBe(200);
  // RFC 5545 §8.1: text/calendar.
  expect(res.headers.get("content-type")).toMatch(/^text\/calendar/);
  const calendar = new ICAL.Component(ICAL.parse(await res.text()));
  expect(calendar.name).toBe("vcalendar");
  // RFC 5545 §3.6: VERSION and PRODID are required calendar properties.
  expect(calendar.getFirstPropertyValue("version")).toBe("2.0");
  expect(calendar.getFirstPropertyValue("prodid")).toBeTruthy();
  return calendar.getAllSubcomponents("vevent").map((v) => {
    const e = new ICAL.Event(v);
    return {
      uid: e.uid,
      summary: e.summary,
      start: e.startDate.toJSDate(),
      url: String(v.getFirstPropertyValue("url")),
    };
  });
}

describe("calendar feed", () => {
  it("gives a student their active assignments only, at the due time, with a stable UID", async () => {
    const token = await turnOn(ana);
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/); // 32 random bytes in base64url (RFC 4648 §5)
    const first = await events(token);
    expect(first).toHaveLength(1);
    expect(first[0].summary).toContain("The Heron's Step");
    expect(first[0].start.toISOString()).toBe(due.toISOString());
    expect(first[0].url).toMatch(new RegExp(`/learn/assignments/${shared.students[ana.id]}$`));
    expect((await events(token))[0].uid).toBe(first[0].uid);
    expect(JSON.stringify(first)).not.toMatch(/Withdrawn Reel|Mossbank Jig/);
  });

  it("holds only its owner's items: another student's feed has theirs, not Ana's", async () => {
    const cleoEvents = await events(await turnOn(cleo));
    expect(cleoEvents.map((e) => e.summary)).toEqual(["Due: Mossbank Jig"]);
    expect(cleoEvents[0].url).toContain(elsewhere.students[cleo.id]);
    const benEvents = await events(await turnOn(ben));
    expect(benEvents).toHaveLength(1);
    expect(benEvents[0].url).toContain(shared.students[ben.id]);
    expect(benEvents[0].uid).not.toBe((await events(await turnOn(ana)))[0].uid);
  });

  it("gives a teacher one event per assignment they gave, naming the students", async () => {
    const list = await events(await turnOn(teacher));
    expect(list).toHaveLength(1);
    expect(list[0].summary).toBe("Due: The Heron's Step (Ana Quillfeather, Ben Alderbrook)");
    expect(list[0].uid).toContain(shared.assignmentId);
    expect((await events(await turnOn(otherTeacher))).map((e) => e.summary)).toEqual([
      "Due: Mossbank Jig (Cleo Marrowgate)",
    ]);
  });

  it("stops answering an address once it is rotated or turned off", async () => {
    const old = await turnOn(ben);
    const fresh = await turnOn(ben);
    expect(fresh).not.toBe(old);
    expect((await fetchFeed(old)).status).toBe(404);
    expect((await fetchFeed(fresh)).status).toBe(200);
    expect((await callRoute("calendar", "DELETE", { cookie: cookies[ben.id] })).status).toBe(204);
    expect((await fetchFeed(fresh)).status).toBe(404);
  });

  it("answers 404 to unknown and malformed tokens, and 401 to a visitor managing a feed", async () => {
    expect((await fetchFeed("A".repeat(43))).status).toBe(404);
    expect((await fetchFeed("not-a-token")).status).toBe(404);
    expect((await callRoute("calendar", "POST", { body: {} })).status).toBe(401);
  });
});
