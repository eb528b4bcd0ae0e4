// The tune editor's routes against a real database: saving, refusing with the engine's problems,
// hand-edited stages kept and flagged, accepted swaps, and whose tune is whose.
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { ProblemsBody, SavedBody, TuneView } from "@/lib/tunes/api-types";
import { checkTune } from "@/lib/tunes/check";
import { teachWorld } from "./helpers/teach-world";

const WICKER = readFileSync("tests/fixtures/teach/wicker-gate.abc", "utf8"); // an invented reel (this project's own)
type World = Awaited<ReturnType<typeof teachWorld>>;
let w: World;
let teacher: string;
let other: string;
let admin: string;
let student: string;

beforeAll(async () => {
  w = await teachWorld();
  teacher = await w.cookieFor((await w.person("teacher")).id);
  other = await w.cookieFor((await w.person("teacher")).id);
  admin = await w.cookieFor((await w.person("admin")).id);
  student = await w.cookieFor((await w.person("student")).id);
});
afterAll(async () => w?.close());

const T = "teach/tunes";
const ONE = "teach/tunes/[tuneId]";
const STAGE = "teach/tunes/[tuneId]/stages/[index]";

async function create(abc = WICKER, cookie = teacher): Promise<string> {
  const res = await w.call(T, "POST", { cookie, body: { abc } });
  expect(res.status).toBe(201);
  return ((await res.json()) as SavedBody).tuneId;
}
async function load(tuneId: string, cookie = teacher): Promise<TuneView> {
  const res = await w.call(ONE, "GET", { cookie, params: { tuneId } });
  expect(res.status).toBe(200);
  return (await res.json()) as TuneView;
}
const put = (tuneId: string, body: Record<string, unknown>, cookie = teacher) =>
  w.call(ONE, "PUT", { cookie, params: { tuneId }, body });

describe("saving a tune", () => {
  it("stores the tune with the facts its ABC states and its four stages", async () => {
    const id = await create();
    const t = await load(id);
    expect([t.title, t.tuneType, t.key, t.meter]).toEqual(["Wicker Gate", "reel", "D", "4/4"]);
    expect(t.stages.map((s) => s.index)).toEqual([1, 2, 3, 4]);
    expect(t.stages[3].abc).toBe(WICKER); // PRODUCT.md §4: the last stage equals the source
    const list = (await (await w.call(T, "GET", { cookie: teacher })).json()) as {
      tunes: { id: string; stageCount: number }[];
    };
    expect(list.tunes.find((x) => x.id === id)?.stageCount).toBe(4);
  });

  it("refuses a mistake with exactly the problems the editor shows in the browser", async () => {
    const bad = WICKER.replace("BAGE|(3", "BAGE|&#(3");
    const res = await w.call(T, "POST", { cookie: teacher, body: { abc: bad } });
    expect(res.status).toBe(422);
    const body = (await res.json()) as ProblemsBody;
    const browser = checkTune(bad);
    expect(browser.ok).toBe(false);
    expect(body.problems).toEqual(browser.ok ? [] : browser.problems);
    expect(body.problems.length).toBeGreaterThan(0);
    expect(body.problems.every((p) => p.line === 9)).toBe(true); // the line holding the mistake
  });

  it("saves a tune with a note (a bar of ten eighths in 4/4) and answers the note the editor shows", async () => {
    // the first bar of the B part gets two more eighths: a slip, noted by bar number, not refused
    const long = WICKER.replace("|:fa", "|:fafa");
    const browser = checkTune(long);
    expect(browser.ok).toBe(true);
    const res = await w.call(T, "POST", { cookie: teacher, body: { abc: long } });
    expect(res.status).toBe(201);
    const body = (await res.json()) as SavedBody;
    expect(body.notes).toEqual(browser.notes);
    expect(body.notes).toEqual([
      expect.objectContaining({
        message: expect.stringMatching(/^Bar 9 lasts 10 eighths, but M:4\/4 makes a bar of 8 eighths$/),
      }),
    ]);
  });

  it("refuses a plan that leaves kinds out, with the plan's reasons", async () => {
    const res = await w.call(T, "POST", {
      cookie: teacher,
      body: { abc: WICKER, stagePlan: { stages: [{ name: "Skeleton", adds: [] }] } },
    });
    expect(res.status).toBe(422);
    expect(((await res.json()) as ProblemsBody).planReasons).toContain(
      'Kind "bowing" is never added back, so the last stage would not be the full setting.',
    );
  });

  it("follows a shorter plan, dropping the stages past its end", async () => {
    const id = await create();
    const plan = {
      stages: [
        { name: "Core", adds: [] },
        { name: "Bowed", adds: ["bowing"] },
        {
          name: "All",
          adds: ["ornaments", "slides", "fills", "doubleStops", "dynamics", "articulation", "fingerings", "marks"],
        },
      ],
    };
    expect((await put(id, { abc: WICKER, stagePlan: plan })).status).toBe(200);
    const t = await load(id);
    expect(t.stages.map((s) => s.name)).toEqual(["Core", "Bowed", "All"]);
    expect(t.stagePlan).toEqual(plan);
  });

  it("stores accepted swaps and lets go of one the music no longer offers", async () => {
    const id = await create();
    expect((await put(id, { abc: WICKER, acceptedSwaps: ["A3"] })).status).toBe(200);
    expect((await load(id)).acceptedSwaps).toEqual(["A3"]);
    // Bar 6 made the same as bar 2: A3 is now an exact twin of A1, nothing left to swap.
    const res = await put(id, { abc: WICKER.replace("dGBd|", "dGBG|"), acceptedSwaps: ["A3"] });
    expect(((await res.json()) as SavedBody).droppedSwaps).toEqual(["A3"]);
    expect((await load(id)).acceptedSwaps).toEqual([]);
  });

  it("stores the bars whose double stops a teacher turned, and lets a turn go when its bar has none left", async () => {
    // an invented tune: the open A above the tune's F♯ (the engine keeps F♯ until double stops come back)
    const drone = "X:1\nT:Drone Field\nR:reel\nM:4/4\nL:1/8\nK:D\n|:d2 [FA]2 E2 D2|A2 [FA]2 E2 D2:|\n";
    const id = await create(drone);
    expect((await load(id)).stages[0].abc).toContain("|:d2 F2 E2 D2|A2 F2 E2 D2:|");
    expect((await put(id, { abc: drone, turnedBars: { "1": "upper" } })).status).toBe(200);
    let t = await load(id);
    expect(t.turnedBars).toEqual({ "1": "upper" });
    expect(t.stages[0].abc).toContain("|:d2 F2 E2 D2|A2 A2 E2 D2:|");
    expect((await put(id, { abc: drone, turnedBars: { bar: "upper" } })).status).toBe(400);
    // bar 2 loses its double stop: the turn has nothing left to turn
    expect((await put(id, { abc: drone.replace("A2 [FA]2", "A2 F2"), turnedBars: { "1": "upper" } })).status).toBe(200);
    t = await load(id);
    expect(t.turnedBars).toEqual({});
  });
});

describe("hand-edited stages", () => {
  it("keeps a hand edit as written, flags it when the source changes, and rebuilds it on request", async () => {
    const id = await create();
    const engine = (await load(id)).stages[1].abc;
    const mine = engine.replace("T:Wicker Gate", "T:Wicker Gate\nN:bow the first bar in one");
    expect(
      (await w.call(STAGE, "PUT", { cookie: teacher, params: { tuneId: id, index: "2" }, body: { abc: mine } })).status,
    ).toBe(200);
    let s2 = (await load(id)).stages[1];
    expect([s2.abc, s2.handEdited, s2.sourceChanged]).toEqual([mine, true, false]);

    // Same source again (say, only a swap accepted): nothing to flag.
    expect(((await (await put(id, { abc: WICKER, acceptedSwaps: ["A3"] })).json()) as SavedBody).flaggedStages).toEqual(
      [],
    );
    // A changed source: the stage stays as written and is flagged; the others follow the source.
    const changed = WICKER.replace("e2dc BAGF|\n(DF)", "e2dc BAGA|\n(DF)");
    expect(((await (await put(id, { abc: changed })).json()) as SavedBody).flaggedStages).toEqual([2]);
    const t = await load(id);
    s2 = t.stages[1];
    expect([s2.abc, s2.handEdited, s2.sourceChanged]).toEqual([mine, true, true]);
    expect(t.stages[0].abc).toContain("BAGA");

    expect((await w.call(STAGE, "DELETE", { cookie: teacher, params: { tuneId: id, index: "2" } })).status).toBe(200);
    s2 = (await load(id)).stages[1];
    expect([s2.handEdited, s2.sourceChanged, s2.abc.includes("BAGA"), s2.abc.includes("N:bow")]).toEqual([
      false,
      false,
      true,
      false,
    ]);
  });

  it("refuses a hand edit of the full setting, and one that does not read cleanly", async () => {
    const id = await create();
    const last = await w.call(STAGE, "PUT", {
      cookie: teacher,
      params: { tuneId: id, index: "4" },
      body: { abc: WICKER },
    });
    expect(last.status).toBe(422);
    expect(((await last.json()) as { error: string }).error).toMatch(/full setting itself/);
    const bad = await w.call(STAGE, "PUT", {
      cookie: teacher,
      params: { tuneId: id, index: "2" },
      body: { abc: WICKER.replace("dFAF|~G2", "dFAF|#G2") },
    });
    expect(bad.status).toBe(422);
    expect(((await bad.json()) as ProblemsBody).problems[0]).toMatchObject({
      line: 8,
      message: 'Unknown character ignored: "#"',
    });
    expect(
      (await w.call(STAGE, "PUT", { cookie: teacher, params: { tuneId: id, index: "9" }, body: { abc: WICKER } }))
        .status,
    ).toBe(400);
  });
});

describe("whose tune", () => {
  it("answers another teacher with 404 and lets an admin in", async () => {
    const id = await create();
    expect((await w.call(ONE, "GET", { cookie: other, params: { tuneId: id } })).status).toBe(404);
    expect((await put(id, { abc: WICKER }, other)).status).toBe(404);
    expect((await w.call(STAGE, "DELETE", { cookie: other, params: { tuneId: id, index: "2" } })).status).toBe(404);
    expect((await w.call(ONE, "GET", { cookie: admin, params: { tuneId: id } })).status).toBe(200);
    expect((await w.call(ONE, "GET", { cookie: student, params: { tuneId: id } })).status).toBe(403);
    expect((await w.call(ONE, "GET", { params: { tuneId: id } })).status).toBe(401);
    const theirs = (await (await w.call(T, "GET", { cookie: other })).json()) as { tunes: { id: string }[] };
    expect(theirs.tunes.some((t) => t.id === id)).toBe(false);
    const all = (await (await w.call(T, "GET", { cookie: admin })).json()) as { tunes: { id: string }[] };
    expect(all.tunes.some((t) => t.id === id)).toBe(true);
  });

  it("deletes an unused tune", async () => {
    const id = await create();
    expect((await w.call(ONE, "DELETE", { cookie: teacher, params: { tuneId: id } })).status).toBe(204);
    expect((await w.call(ONE, "GET", { cookie: teacher, params: { tuneId: id } })).status).toBe(404);
  });
});
